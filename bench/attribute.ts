/**
 * Attribution benchmark: `surmise rank` defaults on the bundled 20,000-row demo census, wall time
 * against the 60 s target, plus the ranking it finds. Run: node --import tsx bench/attribute.ts
 * (options: --workers=N, --epochs=N, --method=a,b to compare settings)
 */
import { fileURLToPath } from 'node:url';
import { readTable } from '../src/table/read.ts';
import { rankFeatures, RANK_DEFAULTS } from '../src/attribute/rank.ts';
import type { AttributionMethod } from '../src/attribute/types.ts';

const census = fileURLToPath(new URL('../demo-data/census.csv', import.meta.url));
const methodsArg = process.argv.find((a) => a.startsWith('--method='));
const methods = methodsArg ? (methodsArg.slice(9).split(',') as AttributionMethod[]) : undefined;

const t0 = performance.now();
const table = await readTable(census);
const t1 = performance.now();
const epochsArg = process.argv.find((a) => a.startsWith('--epochs='));
const epochs = epochsArg ? Number(epochsArg.slice(9)) : undefined;
const workersArg = process.argv.find((a) => a.startsWith('--workers='));
const workers = workersArg ? Number(workersArg.slice(10)) : undefined;
const cpu0 = process.cpuUsage();
const res = await rankFeatures(table, {
  target: 'sig',
  derive: ['slope=re(lon/mer)'],
  methods,
  ...(epochs ? { epochs } : {}),
  ...(workers !== undefined ? { workers } : {}),
});
const t2 = performance.now();
const cpu = process.cpuUsage(cpu0);
const s = (ms: number) => (ms / 1000).toFixed(1);
console.log(`rows ${table.nRows}, features ${res.features.length}, groups ${res.groups.length}, repeats ${res.repeats.length}, task ${res.task}`);
console.log(`defaults: workers ${workers ?? RANK_DEFAULTS.workers}, seeds ${RANK_DEFAULTS.seeds}, hidden ${RANK_DEFAULTS.hidden.join(',')}, max epochs ${RANK_DEFAULTS.epochs}, epochs run ${res.model.epochsRun.join(',')}`);
console.log(`read census            ${s(t1 - t0)} s`);
console.log(`rank (all defaults)    ${s(t2 - t1)} s   target < 60 s (whole command)`);
console.log(`  CPU time of rank      ${s((cpu.user + cpu.system) / 1000)} s   (wall − CPU ≈ waiting for a core on a shared machine)`);
console.log(`total                  ${s(t2 - t0)} s   target < 60 s`);
console.log(`model ${res.model.metric} ${res.model.score.toFixed(4)}  constant ${res.model.baselines.constant.score.toFixed(4)}  ridge ${res.model.baselines.ridge.score.toFixed(4)}`);
for (const r of res.ranking) console.log(`  ${r.feature.padEnd(10)} ${r.score.toFixed(3)} [${r.low.toFixed(3)}, ${r.high.toFixed(3)}]`);
for (const [m, v] of Object.entries(res.methods)) console.log(`  ${m}: top ${v.ranking.slice(0, 3).map((e) => e.feature).join(' > ')}, tau ${v.kendallTau?.toFixed(2)}`);
if (res.completeness) console.log(`IG completeness: mean |gap| / mean |Δf| = ${res.completeness.map((c) => (c.meanAbsGap / c.meanAbsDelta).toExponential(2)).join(', ')}`);
