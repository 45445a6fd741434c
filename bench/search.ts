/**
 * Formula-search benchmark: published physics laws (and one of Euclid's), each on its own table of
 * the law's variables plus three distractor columns, noise 0.5% of the law's standard deviation,
 * searched with up to 3 terms. Prints per law: recovered (best candidate's held-out RMSE within 3×
 * the noise), exact form (its formula with fractions equals the law within 3× the noise on every
 * row), wall and CPU seconds; then the recovery rate and the median times.
 * Physical constants are set to 1 (natural units), as is common practice.
 *   node --import tsx bench/search.ts                  5,000 rows per law (default settings)
 *   node --import tsx bench/search.ts --quick          2,000 rows
 *   node --import tsx bench/search.ts --rows 10000 --only kepler
 *   node --import tsx bench/search.ts --large          also 100,000 rows of one law, with peak RSS
 *   node --import tsx bench/search.ts --module FILE    another implementation of searchRelations (side by side)
 */
import { performance } from 'node:perf_hooks';
import { resolve } from 'node:path';
import { pathToFileURL } from 'node:url';
import { searchRelations as ours } from '../src/relate/search.ts';
import { compileExpression } from '../src/table/expr/evaluate.ts';
import type { Table } from '../src/table/types.ts';
import { Rng } from '../src/util/rng.ts';

interface Law { name: string; source: string; law: string; vars: Record<string, [number, number]> }

// Sources: R. P. Feynman, R. B. Leighton, M. Sands, "The Feynman Lectures on Physics" (1963),
// chapter numbers from memory; Euclid, Elements I.47.
const LAWS: Law[] = [
  { name: 'kinetic energy', source: 'Feynman Lectures I, ch. 4 (E = mv²/2)', law: 'm*v^2/2', vars: { m: [0.5, 5], v: [0.5, 5] } },
  { name: 'gravitation', source: 'Feynman Lectures I, ch. 7 (F = G m₁m₂/r², G = 1)', law: 'm1*m2/r^2', vars: { m1: [1, 5], m2: [1, 5], r: [1, 3] } },
  { name: 'Kepler third law', source: 'Feynman Lectures I, ch. 7 (T = 2π √(a³/GM), G = 1)', law: '2*pi*sqrt(a^3/M)', vars: { a: [1, 4], M: [1, 5] } },
  { name: 'relativistic mass', source: 'Feynman Lectures I, ch. 15 (m = m₀/√(1 − v²/c²), c = 1)', law: 'm0/sqrt(1 - v^2)', vars: { m0: [1, 5], v: [0, 0.9] } },
  { name: 'velocity addition', source: 'Feynman Lectures I, ch. 16 (w = (u + v)/(1 + uv/c²), c = 1)', law: '(u + v)/(1 + u*v)', vars: { u: [0, 0.9], v: [0, 0.9] } },
  { name: 'harmonic oscillator', source: 'Feynman Lectures I, ch. 21 (x = A cos ωt)', law: 'A*cos(w*t)', vars: { A: [0.5, 3], w: [0.5, 2], t: [0, 3] } },
  { name: 'pendulum period', source: 'Feynman Lectures I, ch. 21 (T = 2π √(L/g), small swings)', law: '2*pi*sqrt(L/g)', vars: { L: [0.5, 3], g: [5, 15] } },
  { name: 'Snell law', source: 'Feynman Lectures I, ch. 26 (sin θ₂ = n sin θ₁, n₂ = 1)', law: 'n*sin(th)', vars: { n: [0.5, 1], th: [0, 1.5] } },
  { name: 'two-source interference', source: 'Feynman Lectures I, ch. 29 (I = 4I₀ cos²(δ/2))', law: '4*I0*cos(d/2)^2', vars: { I0: [0.5, 3], d: [0, 6] } },
  { name: 'Doppler shift', source: 'Feynman Lectures I, ch. 34 (ω = ω₀/(1 − v/c), c = 1)', law: 'w0/(1 - v)', vars: { w0: [1, 5], v: [0, 0.8] } },
  { name: 'ideal gas', source: 'Feynman Lectures I, ch. 39 (pV = NkT, k = 1)', law: 'N*T/V', vars: { N: [1, 5], T: [1, 5], V: [1, 5] } },
  { name: 'Planck oscillator', source: 'Feynman Lectures I, ch. 41 (⟨E⟩ = ħω/(e^{ħω/kT} − 1), ħ = k = 1)', law: 'w/(exp(w/T) - 1)', vars: { w: [0.5, 3], T: [0.5, 3] } },
  { name: 'normal density', source: 'Feynman Lectures I, ch. 6 (p(x) = e^{−x²/2}/√(2π))', law: 'exp(-x^2/2)/sqrt(2*pi)', vars: { x: [-3, 3] } },
  { name: 'Coulomb energy', source: 'Feynman Lectures II, ch. 4 (U = q₁q₂/4πε₀r, 4πε₀ = 1)', law: 'q1*q2/r', vars: { q1: [0.5, 3], q2: [0.5, 3], r: [0.5, 3] } },
  { name: 'Pythagoras', source: 'Euclid, Elements I.47 (c = √(a² + b²))', law: 'sqrt(a^2 + b^2)', vars: { a: [0.5, 3], b: [0.5, 3] } },
];

const args = process.argv.slice(2);
const opt = (name: string): string | undefined => {
  const k = args.indexOf(name);
  return k >= 0 ? args[k + 1] : undefined;
};
const rows = Number(opt('--rows') ?? (args.includes('--quick') ? 2000 : 5000));
const only = opt('--only');
const modulePath = opt('--module');
type Search = typeof ours;
const impls: Array<[string, Search]> = [['this', ours]];
if (modulePath) impls.push(['other', (await import(pathToFileURL(resolve(modulePath)).href)).searchRelations as Search]);

function lawTable(l: Law, seed: number, n: number): { table: Table; from: string[]; noise: number } {
  const rng = new Rng(seed);
  const cols: Record<string, Float64Array> = {};
  for (const [v, [lo, hi]] of Object.entries(l.vars)) cols[v] = Float64Array.from({ length: n }, () => rng.uniform(lo, hi));
  for (const d of ['p', 'q', 's']) cols[d] = Float64Array.from({ length: n }, () => rng.uniform(0.5, 3));
  const mk = (c: Record<string, Float64Array>): Table => ({
    source: `bench ${l.name}`, nRows: n,
    columns: Object.entries(c).map(([name, values]) => ({ name, kind: 'real' as const, values, missing: new Uint8Array(n) })),
  });
  const exact = compileExpression(mk(cols), l.law).evaluate().re;
  const mean = exact.reduce((s, x) => s + x, 0) / n;
  const sd = Math.sqrt(exact.reduce((s, x) => s + (x - mean) ** 2, 0) / n);
  const noise = 0.005 * sd;
  const y = exact.map((x) => x + noise * rng.normal());
  return { table: mk({ ...cols, y }), from: Object.keys(cols), noise };
}

const median = (xs: number[]): number => { const s = xs.slice().sort((a, b) => a - b); return s.length ? (s[(s.length - 1) >> 1]! + s[s.length >> 1]!) / 2 : NaN; };
const os = await import('node:os');
console.log(`formula search benchmark: ${rows} rows per law, 3 distractors, noise 0.5% of the law's SD, up to 3 terms (load average ${os.loadavg().map((x) => x.toFixed(1)).join(' ')})`);
const summary = new Map<string, { rec: number; exact: number; wall: number[]; cpu: number[] }>();
for (const [k, l] of LAWS.entries()) {
  if (only && !l.name.toLowerCase().includes(only.toLowerCase())) continue;
  const { table, from, noise } = lawTable(l, 1000 + k, rows);
  const law = compileExpression(table, l.law).evaluate().re;
  for (const [label, search] of impls) {
    const c0 = process.cpuUsage();
    const t0 = performance.now();
    const r = search(table, { target: 'y', from, maxTerms: 3, seed: k });
    const wall = (performance.now() - t0) / 1000;
    const cu = process.cpuUsage(c0);
    const cpu = (cu.user + cu.system) / 1e6;
    const best = r.candidates[0]!;
    const recovered = best.heldOutRmse <= 3 * noise;
    let worst = Infinity;
    try {
      const found = compileExpression(table, best.roundedFormula).evaluate().re;
      worst = 0;
      for (let i = 0; i < rows; i++) worst = Math.max(worst, Math.abs(found[i]! - law[i]!));
    } catch { /* a formula the language cannot read counts as not exact */ }
    const exact = worst <= 3 * noise;
    const s = summary.get(label) ?? { rec: 0, exact: 0, wall: [], cpu: [] };
    s.rec += recovered ? 1 : 0; s.exact += exact ? 1 : 0; s.wall.push(wall); s.cpu.push(cpu);
    summary.set(label, s);
    console.log(`${label.padEnd(5)} ${l.name.padEnd(24)} ${recovered ? 'recovered' : 'MISSED   '} ${exact ? 'exact' : '     '} ${wall.toFixed(1).padStart(6)} s wall ${cpu.toFixed(1).padStart(6)} s CPU  held-out/noise ${(best.heldOutRmse / noise).toFixed(2).padStart(7)}  ${best.roundedFormula}   [${l.source}]`);
  }
}
for (const [label, s] of summary) {
  console.log(`${label}: recovered ${s.rec}/${s.wall.length}, exact form ${s.exact}/${s.wall.length}; median ${median(s.wall).toFixed(1)} s wall (max ${Math.max(...s.wall).toFixed(1)}), median ${median(s.cpu).toFixed(1)} s CPU   targets: median < 20 s, each < 60 s`);
}

if (args.includes('--large')) {
  const l = LAWS.find((x) => x.name === 'Pythagoras')!;
  const { table, from, noise } = lawTable(l, 7, 100_000);
  const t0 = performance.now();
  const r = ours(table, { target: 'y', from, maxTerms: 3, seed: 1 });
  const wall = (performance.now() - t0) / 1000;
  console.log(`100,000 rows (${l.name}): ${wall.toFixed(1)} s wall, peak RSS ${(process.resourceUsage().maxRSS / 1024).toFixed(0)} MB, held-out/noise ${(r.candidates[0]!.heldOutRmse / noise).toFixed(2)}, ${r.candidates[0]!.roundedFormula}`);
  for (const n of r.notes) console.log(`   ${n}`);
}
