import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import { mkdtempSync, rmSync, writeFileSync, readFileSync, existsSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { runCli } from '../../src/cli/main.ts';
import { memoryIO } from '../../src/cli/io.ts';

let dir: string;
beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), 'surmise-knots-'));
  // invented file; the invariants are standard-table values (from memory, see tests/fixtures/knots-small.provenance.md)
  writeFileSync(
    join(dir, 'd.txt'),
    '# a few diagrams\ntrefoil\t1 1 1\nfig8\tX[4,2,5,1] X[8,6,1,5] X[6,3,7,4] X[2,7,3,8]\nfive2\tDT[4,8,10,2,6]\nhopf\t1 1\n',
  );
  writeFileSync(join(dir, 'census.csv'), 'name,volume\ntrefoil,0\nfig8,2.0298832128193\nlost,1.5\n');
  writeFileSync(join(dir, 'codes.csv'), 'id,code\na,"[[1,5,2,4],[3,1,4,6],[5,3,6,2]]"\nb,1 -2 1 -2\n');
  writeFileSync(join(dir, 'bad.txt'), 'ok\t1 1 1\nbroken\tX[1,2,3,4] X[1,2,3,5]\n');
});
afterAll(() => rmSync(dir, { recursive: true, force: true }));

async function run(args: string[]): Promise<{ code: number; out: string; err: string }> {
  const io = memoryIO(dir);
  const code = await runCli(args, io);
  return { code, out: io.out, err: io.err };
}

describe('surmise knots', () => {
  it('writes a CSV table with one row per diagram (values: standard knot table, from memory)', async () => {
    const r = await run(['knots', 'd.txt']);
    expect(r.code).toBe(0);
    const lines = r.out.trim().split('\n');
    expect(lines[0]).toBe('name,crossings,writhe,components,signature,determinant,alexander');
    expect(lines[1]).toBe('trefoil,3,3,1,-2,3,t - 1 + t^-1');
    expect(lines[2]).toBe('fig8,4,0,1,0,5,-t + 3 - t^-1');
    expect(lines[3]).toMatch(/^five2,5,-?5,1,-?2,7,2t - 3 \+ 2t\^-1$/);
    // positive Hopf link: Conway Δ = t^{1/2} − t^{-1/2}, σ = −1, linking number 1 (from memory)
    expect(lines[4]).toBe('hopf,2,2,2,-1,2,t^(1/2) - t^(-1/2)');
  });

  it("--invariants 'all' with others is refused on one line that says why (it said 'all' was not an invariant)", async () => {
    const r = await run(['knots', 'd.txt', '--invariants', 'all,crossings']);
    expect(r.code).toBe(2);
    expect(r.err).toBe("surmise: --invariants all,crossings: 'all' already means every invariant; give it alone or list the ones wanted [option.badValue]\n");
  });
  it('--json prints one object with coefficient lists; --omega adds Levine–Tristram', async () => {
    const r = await run(['knots', 'd.txt', '--json', '--invariants', 'signature,alexander,linking,jumps', '--omega', '0.1']);
    expect(r.code).toBe(0);
    const o = JSON.parse(r.out);
    expect(o.rows).toHaveLength(4);
    expect(o.rows[0].alexander).toEqual([1, -1, 1]);
    expect(o.rows[0].alexander_lowest_exponent).toBe(-1);
    expect(o.rows[0].jumps).toEqual([{ x: 0.166666666667, jump: -2 }]); // root e^{iπ/3} of t² − t + 1 (hand computation); σ_ω goes 0 → −2 (from memory)
    expect(o.rows[0].levine_tristram).toBe(0); // trefoil: σ_ω = 0 below the first jump (from memory)
    expect(o.rows[3].linking).toEqual([{ i: 1, j: 2, lk: 1 }]);
    expect(o.rows[1].levine_tristram).toBe(0); // figure-eight: σ_ω = 0 for all ω (amphichiral; from memory)
  });

  it('--join adds columns by key and reports unmatched keys on both sides', async () => {
    const r = await run(['knots', 'd.txt', '--join', 'census.csv', '--on', 'name', '--out', 'joined.csv']);
    expect(r.code).toBe(0);
    const text = readFileSync(join(dir, 'joined.csv'), 'utf8').trim().split('\n');
    expect(text[0]).toBe('name,volume,crossings,writhe,components,signature,determinant,alexander');
    expect(text[2]).toBe('fig8,2.0298832128193,4,0,1,0,5,-t + 3 - t^-1');
    expect(text[3]).toBe('lost,1.5,,,,,,');
    expect(r.err).toContain('1 row(s) of census.csv have no diagram in d.txt');
    expect(r.err).toContain('lost');
    expect(r.err).toContain('2 diagram(s) of d.txt match no');
    expect(r.err).toContain('five2, hopf');
    // never overwrites
    const again = await run(['knots', 'd.txt', '--join', 'census.csv', '--on', 'name', '--out', 'joined.csv']);
    expect(again.code).toBe(2);
    expect(again.err).toContain('[table.exists]');
  });

  it('reads codes from a JSON array of records, PD codes as nested lists (standard table values, from memory)', async () => {
    writeFileSync(join(dir, 'codes.json'), JSON.stringify([{ name: 'a', code: [[1, 5, 2, 4], [3, 1, 4, 6], [5, 3, 6, 2]] }, { name: 'b', code: { strands: 3, word: [1, -2, 1, -2] } }, { name: 'c', code: [[1, 5, 2, 4], [3, 1, 4, 6], [5, 3, 6, 9]] }]));
    writeFileSync(join(dir, 'good.json'), JSON.stringify([{ name: 'a', code: [[1, 5, 2, 4], [3, 1, 4, 6], [5, 3, 6, 2]] }, { name: 'b', code: { strands: 3, word: [1, -2, 1, -2] } }]));
    const ok = await run(['knots', 'good.json', '--invariants', 'determinant']);
    expect(ok.out.trim().split('\n')).toEqual(['name,determinant', 'a,3', 'b,5']);
    const bad = await run(['knots', 'codes.json']);
    expect(bad.code).toBe(2);
    expect(bad.err).toContain('codes.json: record 3: c: edge label 2 is used 1 time');
  });

  it('reads codes from a CSV column', async () => {
    const r = await run(['knots', 'codes.csv', '--column', 'code', '--name-column', 'id', '--invariants', 'determinant']);
    expect(r.code).toBe(0);
    expect(r.out.trim().split('\n')).toEqual(['name,determinant', 'a,3', 'b,5']);
  });

  it('bad input: exit 2, one line naming file:line:column, the diagram and the crossing', async () => {
    const r = await run(['knots', 'bad.txt']);
    expect(r.code).toBe(2);
    expect(r.err.trim().split('\n')).toHaveLength(1);
    expect(r.err).toContain('bad.txt:2:8: broken: edge label 4 is used 1 time (in crossing 1: X[1,2,3,4])');
    expect(r.err).toContain('[knots.badEdge]');
    const amb = await run(['knots', 'd.txt', '--kind', 'braids']);
    expect(amb.code).toBe(2);
    expect(amb.err).toContain("did you mean 'braid'");
  });

  it('determinants past 2^53 are exact in CSV and --json: closure of (σ1σ2⁻¹)^40 has det L_80 − 2 (from memory)', async () => {
    writeFileSync(join(dir, 'big.txt'), `fig8\t${Array(2).fill('1 -2').join(' ')}\nb40\t${Array(40).fill('1 -2').join(' ')}\nb41\t${Array(41).fill('1 -2').join(' ')}\n`);
    const r = await run(['knots', 'big.txt', '--invariants', 'determinant']);
    expect(r.code).toBe(0);
    // L_80 = 52361396397820127, L_82 = 137083915467899403 (Lucas numbers, from memory)
    expect(r.out.trim().split('\n')).toEqual(['name,determinant', 'fig8,5', 'b40,52361396397820125', 'b41,137083915467899401']);
    const j = await run(['knots', 'big.txt', '--invariants', 'determinant,alexander', '--json']);
    expect(j.code).toBe(0);
    const o = JSON.parse(j.out);
    expect(o.rows[0].determinant).toBe(5); // small values stay numbers
    expect(o.rows[1].determinant).toBe('52361396397820125');
    // Alexander coefficients of b41 pass 2^53: exact decimal strings there, numbers elsewhere; Δ(1) = 1 (knot)
    const coeffs = o.rows[2].alexander as (number | string)[];
    expect(coeffs.some((x) => typeof x === 'string')).toBe(true);
    expect(coeffs.every((x) => typeof x === 'string' ? !Number.isSafeInteger(Number(x)) : Number.isSafeInteger(x))).toBe(true);
    expect(coeffs.reduce((s: bigint, x) => s + BigInt(x), 0n)).toBe(1n);
    expect(j.err).toBe('');
  });

  it('an empty diagram file is refused as such; a name without a code and a missing file are named plainly', async () => {
    writeFileSync(join(dir, 'empty.txt'), '');
    writeFileSync(join(dir, 'header.txt'), 'name\tcode\n');
    writeFileSync(join(dir, 'comment.txt'), '# nothing yet\n');
    for (const f of ['empty.txt', 'header.txt', 'comment.txt']) {
      const r = await run(['knots', f]);
      expect(r.code, f).toBe(2);
      expect(r.err.trim(), f).toBe(`surmise: ${f} holds no diagrams [knots.empty]`);
    }
    writeFileSync(join(dir, 'nocode.txt'), 'a\t\n');
    const n = await run(['knots', 'nocode.txt']);
    expect(n.code).toBe(2);
    expect(n.err.trim()).toBe('surmise: nocode.txt:1: a: no code after the name [knots.parse]');
    const m = await run(['knots', 'nonexist.txt']);
    expect(m.code).toBe(2);
    expect(m.err.trim()).toBe('surmise: cannot read nonexist.txt: no such file [knots.unreadable]');
  });

  it('help states the sign convention', async () => {
    const r = await run(['knots', '--help']);
    expect(r.out).toContain('right-handed trefoil (braid "1 1 1") has signature -2');
  });
});

describe('surmise knots generate', () => {
  it('braid: seeded, reproducible, refuses to overwrite without --force', async () => {
    const a = await run(['knots', 'generate', 'braid', '--strands', '4', '--length', '12', '--count', '20', '--seed', '7', '--out', 'g.txt']);
    expect(a.code).toBe(0);
    const text = readFileSync(join(dir, 'g.txt'), 'utf8');
    const lines = text.trim().split('\n');
    expect(lines).toHaveLength(20);
    for (const l of lines) expect(l).toMatch(/^braid_\d\d\t4: (-?[123] ){11}-?[123]$/);
    const b = await run(['knots', 'generate', 'braid', '--strands', '4', '--length', '12', '--count', '20', '--seed', '7', '--out', 'g.txt']);
    expect(b.code).toBe(2);
    expect(b.err).toContain('[knots.exists]');
    const c = await run(['knots', 'generate', 'braid', '--strands', '4', '--length', '12', '--count', '20', '--seed', '7', '--out', 'g.txt', '--force']);
    expect(c.code).toBe(0);
    expect(readFileSync(join(dir, 'g.txt'), 'utf8')).toBe(text);
    const t = await run(['knots', 'g.txt', '--invariants', 'crossings']);
    expect(t.out.trim().split('\n').slice(1).every((l) => l.endsWith(',12'))).toBe(true);
  });

  it('twist: full twists on strands 1..2 of 4₁ give the double-twist family; T(2,·) via torus', async () => {
    const r = await run(['knots', 'generate', 'twist', '--braid', '1 -2 1 -2', '--strands', '3', '--on', '1..2', '--twists', '0..2', '--out', 'tw.txt']);
    expect(r.code).toBe(0);
    expect(readFileSync(join(dir, 'tw.txt'), 'utf8')).toBe('twist_q0\t3: 1 -2 1 -2\ntwist_q1\t3: 1 -2 1 -2 1 1\ntwist_q2\t3: 1 -2 1 -2 1 1 1 1\n');
    expect(existsSync(join(dir, 'tw.txt'))).toBe(true);
    const s = await run(['knots', 'generate', 'torus', '--p', '2', '--q', '3..9', '--coprime', '--out', 'torus.txt']);
    expect(s.code).toBe(0);
    const inv = await run(['knots', 'torus.txt', '--invariants', 'signature,determinant']);
    // σ(T(2, 2k+1)) = −2k, det = 2k + 1 (from memory)
    expect(inv.out.trim().split('\n').slice(1)).toEqual(['"T(2,3)",-2,3', '"T(2,5)",-4,5', '"T(2,7)",-6,7', '"T(2,9)",-8,9']);
  });

  it('pd: random knot PD codes (sums, kinks) read back as knots with odd determinant and σ even (from memory: facts of the trade)', async () => {
    const g = await run(['knots', 'generate', 'pd', '--strands', '3', '--length', '7', '--count', '25', '--summands', '1..2', '--kinks', '0..2', '--seed', '5', '--out', 'pd.txt']);
    expect(g.code).toBe(0);
    const r = await run(['knots', 'pd.txt', '--json', '--invariants', 'components,signature,determinant,alexander']);
    expect(r.code).toBe(0);
    const rows = JSON.parse(r.out).rows as Array<{ components: number; signature: number; determinant: number; alexander: number[] }>;
    expect(rows).toHaveLength(25);
    for (const row of rows) {
      expect(row.components).toBe(1);
      expect(Math.abs(row.signature % 2)).toBe(0);
      expect(row.determinant % 2).toBe(1);
      expect(row.alexander.reduce((a, b) => a + b, 0)).toBe(1);
    }
  });

  it('progress: nothing on a pipe for work that ends within 5 s (the project progress rule), nor with --no-progress', async () => {
    const g = await run(['knots', 'generate', 'braid', '--strands', '3', '--length', '5', '--count', '250', '--out', 'many.txt']);
    expect(g.code).toBe(0);
    const a = await run(['knots', 'many.txt', '--invariants', 'signature']);
    expect(a.code).toBe(0);
    expect(a.err).toBe('');
    expect(a.out.trim().split('\n')).toHaveLength(251);
    const b = await run(['knots', 'many.txt', '--invariants', 'signature', '--no-progress']);
    expect(b.err).toBe('');
    expect(b.out).toBe(a.out);
  });
});
