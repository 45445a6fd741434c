import { describe, it, expect, beforeAll } from 'vitest';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { runCli } from '../../src/cli/main.ts';
import { memoryIO } from '../../src/cli/io.ts';
import { Rng } from '../../src/util/rng.ts';

let dir = '';
beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), 'surmise-search-'));
  // the planted law from the issue: y = 3x² − 2pq + noise (noise SD 0.05)
  const rng = new Rng(2026);
  const lines = ['id,x,p,q,y'];
  for (let i = 0; i < 1500; i++) {
    const x = rng.uniform(0.5, 2);
    const p = rng.uniform(-1, 1);
    const q = rng.uniform(-1, 1);
    lines.push(`k${i},${x},${p},${q},${3 * x * x - 2 * p * q + 0.05 * rng.normal()}`);
  }
  writeFileSync(join(dir, 'planted.csv'), lines.join('\n') + '\n');
});

describe('surmise search (CLI)', () => {
  it('--json finds 3x² − 2pq with rationals 3 and −2, reports mode, counts and a front (known answer by construction)', async () => {
    const io = memoryIO(dir);
    const code = await runCli(['search', 'planted.csv', '--target', 'y', '--from', 'x,p,q', '--max-terms', '2', '--powers', '-3..3', '--max-complexity', '3', '--json', '--top', '5'], io);
    expect(code).toBe(0);
    const j = JSON.parse(io.out);
    expect(j.mode).toBe('exhaustive');
    expect(j.selectionRows + j.heldOutRows).toBe(1500);
    expect(j.nCandidatesTried).toBeGreaterThan(1000);
    expect(j.candidates).toHaveLength(5);
    const best = j.candidates[0];
    expect(new Set(best.terms)).toEqual(new Set(['x^2', 'p*q']));
    const rat = Object.fromEntries(best.terms.map((t: string, k: number) => [t, best.rationals[k].text]));
    expect(rat).toEqual({ 'x^2': '3', 'p*q': '-2' });
    expect(best.heldOutRmse).toBeLessThan(0.06);
    expect(best.complexity).toBe(4); // x^2: 2, p*q: 2 (README's count)
    expect(j.front.some((c: { terms: string[] }) => c.terms.includes('x^2') && c.terms.includes('p*q'))).toBe(true);
    // the front is ordered by complexity with strictly falling held-out error
    for (let k = 1; k < j.front.length; k++) {
      expect(j.front[k].complexity).toBeGreaterThan(j.front[k - 1].complexity);
      expect(j.front[k].heldOutRmse).toBeLessThan(j.front[k - 1].heldOutRmse);
    }
    // not a terminal: at most plain progress lines (one per 5 s on a slow machine), nothing else
    for (const line of io.err.split('\n').filter(Boolean)) expect(line).toMatch(/^searching formulas: \d+% \(\d+\/100\)$/);
  });
  it('human output names the held-out split and warns about multiple comparisons', async () => {
    const io = memoryIO(dir);
    expect(await runCli(['search', 'planted.csv', '--target', 'y', '--from', 'x,p,q', '--powers', '-1..2', '--max-complexity', '5', '--split', 'random:0.5,0.1,0.4'], io)).toBe(0);
    // project split syntax: 1500 rows → 600 test, 150 validation (unused here, and said so), 750 train
    expect(io.out).toMatch(/selection rows 750, held-out rows 600: .*\(150 rows in neither part\)/);
    expect(io.out).toMatch(/multiple comparisons/);
    expect(io.out).toMatch(/3\*x\^2 - 2\*p\*q/);
    expect(io.out).toMatch(/skipped terms \(6\):\n {2}- sqrt\(p\): 'p' is negative at data row \d+/);
  });
  it('bad input exits 2: power range, unknown column, bad target expression', async () => {
    const a = memoryIO(dir);
    expect(await runCli(['search', 'planted.csv', '--target', 'y', '--from', 'x', '--powers', '3..-3'], a)).toBe(2);
    expect(a.err).toMatch(/--powers 3\.\.-3: the lower end 3 exceeds the upper end -3 \[relate\.badPowers\]/);
    const b = memoryIO(dir);
    expect(await runCli(['search', 'planted.csv', '--target', 'y', '--from', 'x,pp'], b)).toBe(2);
    expect(b.err).toMatch(/no column 'pp'.*did you mean 'p'/);
    const d = memoryIO(dir);
    expect(await runCli(['search', 'planted.csv', '--target', 'y', '--from', 'x', '--time', '10 parsecs'], d)).toBe(2);
    expect(d.err).toMatch(/--time 10 parsecs: expected a duration such as 60s or 2m/);
    const e = memoryIO(dir);
    expect(await runCli(['search', 'planted.csv', '--target', 'y', '--from', 'x', '--lattice', '-2'], e)).toBe(2);
    expect(e.err).toMatch(/--lattice -2: expected auto, off or a positive step/);
    const f = memoryIO(dir);
    expect(await runCli(['search', 'planted.csv', '--target', 'y', '--from', 'x', '--max-complexity', '40'], f)).toBe(2);
    expect(f.err).toMatch(/expected --max-complexity to be at most 12 \(its ceiling\), got 40/);
    const c = memoryIO(dir);
    expect(await runCli(['search', 'planted.csv', '--target', 'y)', '--from', 'x'], c)).toBe(2);
    expect(c.err).toMatch(/\n {2}y\)\n {3}\^/);
  });
});
