import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import { mkdtempSync, writeFileSync, rmSync, readFileSync, readdirSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { runCli } from '../../src/cli/main.ts';
import { memoryIO } from '../../src/cli/io.ts';
import { Rng } from '../../src/util/rng.ts';

/**
 * Invented data for the machinery (no outside source): z = 2a + e with |e| ≤ C·b/w planted on every
 * row (C = 0.1, approached as u → ±1), and a 'thin' family whose w → 0 so that the naive constant of
 * |2a − z| ≤ c·b grows as w decreases.
 */
const PLANTED_C = 0.1;
function plantedTable(rows: number, seed: number): string {
  const rng = new Rng(seed);
  const lines = ['name,family,a,b,w,z'];
  for (let r = 0; r < rows; r++) {
    const thin = rng.next() < 0.1;
    const k = 2 + rng.int(39);
    const b = thin ? 6.5 * rng.uniform(0.97, 1.03) : rng.uniform(2, 12);
    const w = thin ? (1.2 / k) * rng.uniform(0.9, 1.1) : 0.15 + 0.85 * rng.next();
    const a = 2 * (rng.int(11) - 5);
    const u = rng.uniform(-1, 1);
    const bw = Number(b.toPrecision(8));
    const ww = Number(w.toPrecision(8));
    lines.push(`x${r + 1},${thin ? 'thin' : 'main'},${a},${bw},${ww},${2 * a + PLANTED_C * (bw / ww) * u * u * u}`);
  }
  return lines.join('\n') + '\n';
}

let dir: string;
beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), 'surmise-bound-'));
  // x on [-1, 1] with x = 1 on row 3: |exp(x) - 1 - x| <= (e - 2) x^2, attained at x = 1 (from memory)
  writeFileSync(join(dir, 'taylor.csv'), 'name,x\np1,0.5\np2,-1\np3,1\np4,0.25\np5,-0.5\np6,0.75\n');
  writeFileSync(join(dir, 'bad.csv'), 'name,l,r\na,1,1\nb,2,0\nc,3,-1\nd,4,2\n');
  writeFileSync(join(dir, 'planted.csv'), plantedTable(6000, 7));
});
afterAll(() => rmSync(dir, { recursive: true, force: true }));

async function run(args: string[]) {
  const io = memoryIO(dir);
  const code = await runCli(['bound', ...args], io);
  return { code, out: io.out, err: io.err };
}

describe('surmise bound', () => {
  it('--json prints one JSON object with the constant, witnesses, quantiles, strata and trend', async () => {
    const { code, out, err } = await run(['taylor.csv', '--lhs', 'abs(exp(x) - 1 - x)', '--rhs', 'x^2', '--bins', '3', '--top', '2', '--json']);
    expect(err).toBe('');
    expect(code).toBe(0);
    const j = JSON.parse(out);
    expect(j).toMatchObject({ lhs: 'abs(exp(x) - 1 - x)', by: null, n: 6, dropped: { total: 0 } });
    const r = j.results[0];
    expect(r.rhs).toBe('x^2');
    expect(r.constant).toBeCloseTo(Math.E - 2, 12); // e − 2 at x = 1 (from memory)
    expect(r.witnesses[0]).toMatchObject({ row: 3, line: 4, labels: { name: 'p3' } });
    expect(r.witnesses).toHaveLength(2);
    expect(r.quantiles.map((q: { p: number }) => q.p)).toEqual([0.5, 0.9, 0.99, 0.999]);
    expect(r.strata).toHaveLength(3);
    expect(Object.keys(r.strata[0]).sort()).toEqual(['centre', 'constant', 'high', 'low', 'n', 'row']);
    expect(Object.keys(r.trend)).toEqual(expect.arrayContaining(['slope', 'low', 'high', 'verdict']));
  });

  it('refuses rhs ≤ 0 with exit 2 and one line naming the count and first rows', async () => {
    const { code, out, err } = await run(['bad.csv', '--lhs', 'l', '--rhs', 'r']);
    expect(code).toBe(2);
    expect(out).toBe('');
    expect(err.trimEnd().split('\n')).toHaveLength(1);
    expect(err).toBe(
      'surmise: bad.csv: 2 of 4 rows cannot be used for l ≤ c·(r) (2 with rhs ≤ 0); first: row 2, line 3: lhs = 2, rhs = 0; ' +
        'row 3, line 4: lhs = 3, rhs = -1. With --skip-invalid they are dropped and counted instead [bound.badRhs]\n',
    );
    const skipped = await run(['bad.csv', '--lhs', 'l', '--rhs', 'r', '--skip-invalid', '--json']);
    expect(skipped.code).toBe(0);
    expect(JSON.parse(skipped.out).dropped).toEqual({ missing: 0, nonFinite: 0, rhsNonPositive: 2, total: 2 });
  });

  it('an unknown column is the expression error, exit 2', async () => {
    const { code, err } = await run(['bad.csv', '--lhs', 'll', '--rhs', 'r']);
    expect(code).toBe(2);
    expect(err).toMatch(/^surmise: unknown column 'll'/);
    expect(err).toMatch(/\[expr\.unknownColumn\]\n$/);
  });

  it('refuses --bins 0 and a missing table file with exit 2', async () => {
    const b = await run(['bad.csv', '--lhs', 'l', '--rhs', 'r', '--bins', '0']);
    expect(b.code).toBe(2);
    expect(b.err).toMatch(/--bins/);
    const f = await run(['nope.csv', '--lhs', 'l', '--rhs', 'r']);
    expect(f.code).toBe(2);
    expect(f.err.trimEnd().split('\n')).toHaveLength(1);
  });

  // The planted table above: |2a − z| ≤ 0.1·b/w on every row, while the naive bound by b fails as w → 0 on the thin family.
  it('on a planted table: the planted bound holds with no trend; the naive one grows as w decreases', async () => {
    const { code, out } = await run([
      'planted.csv', '--lhs', 'abs(2*a - d)', '--derive', 'd=z',
      '--rhs', 'b/w', '--rhs', 'b', '--by', 'w', '--json',
    ]);
    expect(code).toBe(0);
    const j = JSON.parse(out);
    const [planted, naive] = j.results;
    expect(planted.constant).toBeLessThanOrEqual(PLANTED_C * (1 + 1e-9));
    expect(planted.constant).toBeGreaterThan(0.9 * PLANTED_C);
    expect(planted.trend.kind).toBe('none');
    expect(naive.trend.kind).toBe('down');
    expect(naive.trend.verdict).toMatch(/^increasing towards low w/);
    expect(naive.extremeStratum).toBe('lowest');
    expect(naive.witnesses[0].labels.family).toBe('thin');
  });

  it('--lower gives the smallest ratio; --id chooses the columns beside the witnesses', async () => {
    // the smallest ratio of |exp(x) − 1 − x|/x² on [−1, 1] is at x = −1: e⁻¹ (from the formula)
    const { code, out } = await run(['taylor.csv', '--lhs', 'abs(exp(x) - 1 - x)', '--rhs', 'x^2', '--lower', '--id', 'x,name', '--top', '1', '--json']);
    expect(code).toBe(0);
    const j = JSON.parse(out);
    expect(j.form).toBe('lower');
    expect(j.results[0].constant).toBeCloseTo(1 / Math.E, 12);
    expect(j.results[0].witnesses[0].labels).toEqual({ x: -1, name: 'p2' });
  });

  it('the text report compares the candidates side by side', async () => {
    const { code, out } = await run([
      'planted.csv', '--lhs', 'abs(2*a - z)', '--rhs', 'b/w', '--rhs', 'b', '--by', 'w', '--top', '2',
    ]);
    expect(code).toBe(0);
    expect(out).toMatch(/candidates side by side:\n {2}rhs +c\* +witness row +trend\n {2}b\/w .*no trend detected along w\n {2}b .*increasing towards low w\n/);
    expect(out).toMatch(/Hyndman & Fan \(1996\) type 7/);
  });

  // The planted table above (invented): |2a − z| ≤ 0.1·b/w should be found among monomials of b and w.
  it('--from searches the rhs: the planted b/w comes first with c = 0.1, in the JSON contract', async () => {
    const { code, out, err } = await run(['planted.csv', '--lhs', 'abs(2*a - z)', '--from', 'b,w', '--json', '--proposals', '3']);
    expect(err).toBe('');
    expect(code).toBe(0);
    const j = JSON.parse(out);
    expect(j.proposals).toHaveLength(3);
    const best = j.proposals[0];
    expect(Object.keys(best)).toEqual(expect.arrayContaining(['rhs', 'exponents', 'constant', 'heldOutConstant', 'heldOutExceed', 'supremum', 'trend']));
    expect(best.rhs).toBe('b/w');
    expect(best.exponents).toEqual({ b: 1, w: -1 });
    expect(best.constant).toBeLessThanOrEqual(PLANTED_C * (1 + 1e-9));
    expect(best.constant).toBeGreaterThan(0.99 * PLANTED_C);
    expect(best.trend.kind).toBe('none');
    expect(best.heldOutExceed).toBeLessThanOrEqual(3);
  });

  it('--witnesses writes the witness rows with every column, atomically, and refuses to overwrite without --force', async () => {
    const args = ['taylor.csv', '--lhs', 'abs(exp(x) - 1 - x)', '--rhs', 'x^2', '--top', '2', '--witnesses', 'w.csv'];
    const first = await run(args);
    expect(first.code).toBe(0);
    expect(first.out).toMatch(/witness rows written to w\.csv\n$/);
    const lines = readFileSync(join(dir, 'w.csv'), 'utf8').trimEnd().split('\n');
    expect(lines[0]).toBe('bound_rhs,bound_rank,bound_row,bound_ratio,bound_lhs,bound_rhs_value,name,x');
    expect(lines[1]).toMatch(/^x\^2,1,3,0\.71828\d*,0\.71828\d*,1,p3,1$/); // e − 2 at x = 1
    expect(lines).toHaveLength(3);
    const again = await run(args);
    expect(again.code).toBe(2);
    expect(again.err).toMatch(/w\.csv already exists.*--force/);
    expect((await run([...args, '--force'])).code).toBe(0);
    expect(readdirSync(dir).filter((f) => f.endsWith('.tmp'))).toEqual([]);
  });

  it('refuses --rhs with --from, neither, and discovery flags without --from, with exit 2', async () => {
    const both = await run(['taylor.csv', '--lhs', 'x', '--rhs', 'x', '--from', 'x']);
    expect(both.code).toBe(2);
    expect(both.err).toBe('surmise: give either --rhs or --from, not both [option.conflict]\n');
    const none = await run(['taylor.csv', '--lhs', 'x']);
    expect(none.code).toBe(2);
    expect(none.err).toMatch(/give a right-hand side with --rhs, or search for one with --from/);
    const stray = await run(['taylor.csv', '--lhs', 'x', '--rhs', 'x', '--max-exponent', '3']);
    expect(stray.err).toBe('surmise: --max-exponent applies to --from [option.conflict]\n');
    const big = await run(['planted.csv', '--lhs', 'b', '--from', 'w', '--max-exponent', '99']);
    expect(big.code).toBe(2);
    expect(big.err).toBe('surmise: expected --max-exponent to be at most 12 (its ceiling), got 99 [option.tooLarge]\n');
  });

  it('--form two-sided adds both affine sides to each candidate', async () => {
    const { code, out } = await run(['taylor.csv', '--lhs', 'exp(x)', '--rhs', 'x + 2', '--form', 'two-sided', '--json']);
    expect(code).toBe(0);
    const a = JSON.parse(out).results[0].affine;
    expect(a.map((s: { form: string }) => s.form)).toEqual(['upper', 'lower']);
    // on the six points the upper side is the chord through x = −1 and x = 1 (convexity): slope sinh(1)
    expect(a[0].slope).toBeCloseTo(Math.sinh(1), 10);
  });
});
