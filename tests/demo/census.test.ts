import { describe, it, expect } from 'vitest';
import { readFileSync } from 'node:fs';
import { generateCensus, PLANTED_BOUND_CONSTANT, CENSUS_COLUMNS } from '../../src/demo/census.ts';

const committed = readFileSync(new URL('../../demo-data/census.csv', import.meta.url), 'utf8');

/** Parse `a+bj` / `a-bj` (the census' own complex format). */
function complexCell(s: string): [number, number] {
  const m = /^([-+]?[0-9.e+-]+?)([-+][0-9.e+-]+)j$/.exec(s);
  if (!m) throw new Error(`bad complex cell ${s}`);
  return [Number(m[1]), Number(m[2])];
}

describe('demo census', () => {
  it('the committed file is exactly what the documented model generates (seed 1, 20,000 rows)', () => {
    expect(generateCensus({ rows: 20000, seed: 1 })).toBe(committed);
  });

  it('stays under 3 MB', () => {
    expect(Buffer.byteLength(committed)).toBeLessThan(3 * 1024 * 1024);
  });

  it('satisfies the planted law as documented: |2 sig − re(lon/mer)| ≤ 0.1·vol/inj, sig even', () => {
    const lines = committed.trimEnd().split('\n');
    expect(lines[0]).toBe(CENSUS_COLUMNS.join(','));
    let cStar = 0;
    let naive = 0;
    let naiveGeneric = 0;
    for (const line of lines.slice(1)) {
      const f = line.split(',');
      const sig = Number(f[13]);
      expect(Math.abs(sig % 2)).toBe(0); // a signature is an even integer (fact of the trade)
      const [a, b] = complexCell(f[5]!);
      const lon = Number(f[6]);
      const slope = (lon * a) / (a * a + b * b); // re(lon / (a + bi)) for real lon
      const dev = Math.abs(2 * sig - slope);
      const vol = Number(f[4]);
      const inj = Number(f[7]);
      cStar = Math.max(cStar, dev / (vol / inj));
      naive = Math.max(naive, dev / vol);
      if (f[1] === 'generic') naiveGeneric = Math.max(naiveGeneric, dev / vol);
    }
    expect(cStar).toBeLessThanOrEqual(PLANTED_BOUND_CONSTANT * (1 + 1e-8));
    expect(cStar).toBeGreaterThan(PLANTED_BOUND_CONSTANT * 0.99);
    // the naive constant is driven by the twisted family (inj → 0): several times the generic one
    expect(naive).toBeGreaterThan(3 * naiveGeneric);
  });
});
