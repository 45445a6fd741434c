import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { runCli } from '../../src/cli/main.ts';
import { memoryIO } from '../../src/cli/io.ts';

let dir: string;
beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), 'surmise-hyp-'));
  // invented file of standard diagrams; expected values: figure-eight volume 2.0298832128193 and cusp 2√3·i (from memory)
  // 80 closed braids (the twist family of 5_2's braid and a few torus knots) for the worker test
  const lines: string[] = [];
  for (let k = 0; k < 80; k++) lines.push(k % 10 === 9 ? `t${k}\t${Array(2 * (k % 7) + 3).fill(1).join(' ')}` : `k${k}\t${Array(2 * (k % 9) + 3).fill(1).join(' ')} 2 -1 2`);
  writeFileSync(join(dir, 'many.txt'), lines.join('\n') + '\n');
  writeFileSync(join(dir, 'd.txt'), 'fig8\t1 -2 1 -2\ntrefoil\t1 1 1\nfive2\tX[1,5,2,4] X[3,9,4,8] X[5,1,6,10] X[7,3,8,2] X[9,7,10,6]\n');
});
afterAll(() => rmSync(dir, { recursive: true, force: true }));

async function run(args: string[]): Promise<{ code: number; out: string; err: string }> {
  const io = memoryIO(dir);
  const code = await runCli(args, io);
  return { code, out: io.out, err: io.err };
}

describe('surmise knots --invariants hyperbolic', () => {
  it('worker threads give the same table as one thread (80 rows; ordering and values identical)', async () => {
    const one = await run(['knots', 'many.txt', '--invariants', 'crossings,hyperbolic', '--workers', '0', '--no-progress']);
    const two = await run(['knots', 'many.txt', '--invariants', 'crossings,hyperbolic', '--workers', '2', '--no-progress']);
    expect(one.code).toBe(0);
    expect(two.code).toBe(0);
    expect(two.out).toBe(one.out);
    expect(one.out.split('\n').filter((l) => l.includes(',hyperbolic,')).length).toBe(72);
    const bad = await run(['knots', 'many.txt', '--invariants', 'hyperbolic', '--workers', '65']);
    expect(bad.code).toBe(2);
    expect(bad.err).toMatch(/--workers/);
  });
  it('adds geometry, geometry_reason, volume, cusp_shape (complex), natural_slope and the maximal cusp', async () => {
    const r = await run(['knots', 'd.txt', '--invariants', 'hyperbolic']);
    expect(r.code).toBe(0);
    const lines = r.out.trim().split('\n');
    expect(lines[0]).toBe('name,geometry,geometry_reason,volume,cusp_shape,natural_slope,cusp_volume,meridian_length,longitude_length');
    const fig8 = lines[1]!.split(',');
    expect(fig8[1]).toBe('hyperbolic');
    expect(Number(fig8[3])).toBeCloseTo(2.029883212819307, 12);
    expect(fig8[4]).toMatch(/\+3\.46410161513\d*j$/);
    // figure-eight maximal cusp: volume √3, meridian 1, longitude 2√3 (from memory; Adams)
    expect(Number(fig8[6])).toBeCloseTo(Math.sqrt(3), 9);
    expect(Number(fig8[7])).toBeCloseTo(1, 9);
    expect(Number(fig8[8])).toBeCloseTo(2 * Math.sqrt(3), 9);
    const tref = lines[2]!;
    expect(tref).toMatch(/^trefoil,not hyperbolic,"torus knot T\(2,3\) \(Seifert fibred\)[^"]*",,,,,,$/);
  });
  it('JSON rows carry the cusp shape as [re, im] and the tetrahedra used; `all` includes the columns', async () => {
    const j = JSON.parse((await run(['knots', 'd.txt', '--invariants', 'hyperbolic', '--json'])).out);
    expect(j.rows[0].cusp_shape[1]).toBeCloseTo(2 * Math.sqrt(3), 9);
    expect(j.rows[1].volume).toBeNull();
    expect(j.rows[2].volume).toBeCloseTo(2.8281220883308, 10); // 5_2, from memory
    const all = await run(['knots', 'd.txt', '--invariants', 'all']);
    expect(all.out.split('\n')[0]).toMatch(/,geometry,geometry_reason,volume,cusp_shape,natural_slope,cusp_volume,meridian_length,longitude_length$/);
    expect(j.rows[0].cusp_volume).toBeCloseTo(Math.sqrt(3), 9);
    expect(j.rows[1].cusp_volume).toBeNull();
  });
  it('a generated twist family goes straight into bound: volume ≤ c·crossings with c below v_oct (D. Thurston: one ideal octahedron per crossing)', async () => {
    // full twists on strands 1..2 of the figure-eight's braid 1 -2 1 -2; q = 1 is 6_2 (volume 4.400832516, from memory)
    expect((await run(['knots', 'generate', 'twist', '--braid', '1 -2 1 -2', '--strands', '3', '--on', '1..2', '--twists', '0..12', '--out', 'tw.txt'])).code).toBe(0);
    expect((await run(['knots', 'tw.txt', '--invariants', 'crossings,hyperbolic', '--out', 'tw.csv', '--no-progress'])).code).toBe(0);
    const b = await run(['bound', 'tw.csv', '--lhs', 'volume', '--rhs', 'crossings', '--json']);
    expect(b.code, b.err).toBe(0);
    const res = JSON.parse(b.out);
    expect(res.n).toBe(13);
    const c = res.results[0].constant as number;
    // regular ideal octahedron volume 3.663862376708876 (= 4 × Catalan, from memory) bounds the volume per crossing
    expect(c).toBeLessThan(3.663862376708876);
    expect(res.results[0].witnesses[0].labels.name).toBe('twist_q1');
    expect(res.results[0].witnesses[0].lhs).toBeCloseTo(4.400832516123, 8);
    // the volumes increase with the twists: observed on this family, not a theorem (Thurston's hyperbolic
    // Dehn surgery theorem gives only convergence from below, to the volume with the twisting circle drilled)
    const vol = (await run(['knots', 'tw.txt', '--invariants', 'hyperbolic', '--json', '--no-progress'])).out;
    const v = (JSON.parse(vol).rows as Array<{ volume: number }>).map((r) => r.volume);
    for (let k = 1; k < v.length; k++) expect(v[k]!).toBeGreaterThan(v[k - 1]!);
  });
});
