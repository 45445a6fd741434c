/**
 * Attribution benchmark: `surmise rank` defaults on 20,000 rows of Friedman #1 (J. H. Friedman,
 * Annals of Statistics 19, 1991: y = 10 sin(π x1 x2) + 20 (x3 − 0.5)² + 10 x4 + 5 x5 + N(0, 1),
 * x ~ U[0,1]^10; x6..x10 do not enter), wall time against the 60 s target, plus the ranking it
 * finds. Run: node --import tsx bench/attribute.ts
 * (options: --workers=N, --epochs=N, --method=a,b to compare settings)
 */
import { tableFromRecords } from '../src/table/columns.ts';
import { Rng } from '../src/util/rng.ts';
import { rankFeatures, RANK_DEFAULTS } from '../src/attribute/rank.ts';
import type { AttributionMethod } from '../src/attribute/types.ts';

function friedman1(n: number): Array<Record<string, number>> {
  const rng = new Rng(20000);
  return Array.from({ length: n }, () => {
    const x = Array.from({ length: 10 }, () => rng.next());
    const y = 10 * Math.sin(Math.PI * x[0]! * x[1]!) + 20 * (x[2]! - 0.5) ** 2 + 10 * x[3]! + 5 * x[4]! + rng.normal();
    return { ...Object.fromEntries(x.map((v, k) => [`x${k + 1}`, v])), y };
  });
}
const methodsArg = process.argv.find((a) => a.startsWith('--method='));
const methods = methodsArg ? (methodsArg.slice(9).split(',') as AttributionMethod[]) : undefined;

const t0 = performance.now();
const table = tableFromRecords(friedman1(20_000));
const t1 = performance.now();
const epochsArg = process.argv.find((a) => a.startsWith('--epochs='));
const epochs = epochsArg ? Number(epochsArg.slice(9)) : undefined;
const workersArg = process.argv.find((a) => a.startsWith('--workers='));
const workers = workersArg ? Number(workersArg.slice(10)) : undefined;
const cpu0 = process.cpuUsage();
const res = await rankFeatures(table, {
  target: 'y',
  methods,
  ...(epochs ? { epochs } : {}),
  ...(workers !== undefined ? { workers } : {}),
});
const t2 = performance.now();
const cpu = process.cpuUsage(cpu0);
const s = (ms: number) => (ms / 1000).toFixed(1);
console.log(`rows ${table.nRows}, features ${res.features.length}, groups ${res.groups.length}, repeats ${res.repeats.length}, task ${res.task}`);
console.log(`defaults: workers ${workers ?? RANK_DEFAULTS.workers}, seeds ${RANK_DEFAULTS.seeds}, hidden ${RANK_DEFAULTS.hidden.join(',')}, max epochs ${RANK_DEFAULTS.epochs}, epochs run ${res.model.epochsRun.join(',')}`);
console.log(`build table            ${s(t1 - t0)} s`);
console.log(`rank (all defaults)    ${s(t2 - t1)} s   target < 60 s (whole command)`);
console.log(`  CPU time of rank      ${s((cpu.user + cpu.system) / 1000)} s   (wall − CPU ≈ waiting for a core on a shared machine)`);
console.log(`total                  ${s(t2 - t0)} s   target < 60 s`);
console.log(`model ${res.model.metric} ${res.model.score.toFixed(4)}  constant ${res.model.baselines.constant.score.toFixed(4)}  ridge ${res.model.baselines.ridge.score.toFixed(4)}`);
for (const r of res.ranking) console.log(`  ${r.feature.padEnd(10)} ${r.score.toFixed(3)} [${r.low.toFixed(3)}, ${r.high.toFixed(3)}]`);
for (const [m, v] of Object.entries(res.methods)) console.log(`  ${m}: top ${v.ranking.slice(0, 3).map((e) => e.feature).join(' > ')}, tau ${v.kendallTau?.toFixed(2)}`);
if (res.completeness) console.log(`IG completeness: mean |gap| / mean |Δf| = ${res.completeness.map((c) => (c.meanAbsGap / c.meanAbsDelta).toExponential(2)).join(', ')}`);
