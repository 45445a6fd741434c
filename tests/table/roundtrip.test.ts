/**
 * Property tests (fast-check): random tables written by writeTable and read back by readTable give
 * back the same values bit for bit (ECMAScript's Number::toString is the shortest string that
 * reads back to the same double — ECMA-262 §6.1.6.1.20, from memory), in every format.
 */
import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import { join } from 'node:path';
import { existsSync, readdirSync, readFileSync } from 'node:fs';
import { readTable } from '../../src/table/read.ts';
import { writeTable } from '../../src/table/write.ts';
import { tableFromColumns } from '../../src/table/columns.ts';
import { isMissingText, parseComplexText } from '../../src/table/cell.ts';
import { SurmiseError } from '../../src/errors.ts';
import type { Column, ColumnKind, Table } from '../../src/table/types.ts';
import { put, tempDir } from './helpers.ts';

const dir = tempDir('roundtrip');
let k = 0;

const double = fc.oneof(
  fc.double({ noNaN: false }),
  fc.constantFrom(5e-324, -5e-324, 1.7976931348623157e308, 2.2250738585072014e-308, -0, 0, 0.1, 1e21, 1e-7),
);
const integer = fc.integer({ min: -(2 ** 53) + 1, max: 2 ** 53 - 1 }).map((x) => x);
const labelText = fc
  .string({ unit: fc.oneof(fc.constantFrom(',', '"', '\n', '\r', '\t', ' ', 'é', '結', '🪢', 'a', 'x', '1'), fc.string({ maxLength: 1 })), minLength: 1, maxLength: 12 })
  // a label that reads as a missing marker or is empty cannot be told from a missing cell in JSON
  .filter((s) => !isMissingText(s));

interface Spec {
  kind: ColumnKind;
  cells: Array<{ missing: boolean; v: number | string | [number, number] }>;
}

const columnSpec = (n: number) =>
  fc.constantFrom<ColumnKind>('real', 'integer', 'complex', 'label').chain((kind) => {
    const value =
      kind === 'real' ? double : kind === 'integer' ? integer : kind === 'complex' ? fc.tuple(double, double) : labelText;
    return fc
      .array(fc.record({ missing: fc.boolean(), v: value as fc.Arbitrary<number | string | [number, number]> }), {
        minLength: n,
        maxLength: n,
      })
      .map((cells) => ({ kind, cells }) as Spec);
  });

const tableSpec = fc.integer({ min: 1, max: 25 }).chain((n) => fc.array(columnSpec(n), { minLength: 1, maxLength: 5 }));

function build(specs: Spec[]): Table {
  const cols: Column[] = specs.map((s, j) => {
    const n = s.cells.length;
    const missing = Uint8Array.from(s.cells.map((c) => (c.missing ? 1 : 0)));
    const name = `c${j} ,"q"`;
    if (s.kind === 'label') return { name, kind: 'label', values: s.cells.map((c) => (c.missing ? '' : (c.v as string))), missing };
    if (s.kind === 'complex') {
      const re = new Float64Array(n);
      const im = new Float64Array(n);
      s.cells.forEach((c, i) => {
        [re[i], im[i]] = c.missing ? [NaN, NaN] : (c.v as [number, number]);
      });
      return { name, kind: 'complex', re, im, missing };
    }
    return { name, kind: s.kind, values: Float64Array.from(s.cells.map((c) => (c.missing ? NaN : (c.v as number)))), missing };
  });
  return tableFromColumns(cols, 'generated');
}

function sameValues(a: Table, b: Table): void {
  expect(b.nRows).toBe(a.nRows);
  expect(b.columns.map((c) => [c.name, c.kind])).toEqual(a.columns.map((c) => [c.name, c.kind]));
  a.columns.forEach((ca, j) => {
    const cb = b.columns[j]!;
    expect(Array.from(cb.missing)).toEqual(Array.from(ca.missing));
    for (let i = 0; i < a.nRows; i++) {
      if (ca.missing[i]) continue;
      if (ca.kind === 'label') expect((cb as typeof ca).values[i]).toBe(ca.values[i]);
      else if (ca.kind === 'complex') {
        const z = cb as typeof ca;
        expect(Object.is(z.re[i], ca.re[i]) && Object.is(z.im[i], ca.im[i]), `${ca.re[i]} ${ca.im[i]} vs ${z.re[i]} ${z.im[i]}`).toBe(true);
      } else {
        const x = (cb as typeof ca).values[i]!;
        expect(Object.is(x, ca.values[i]), `${ca.values[i]} vs ${x}`).toBe(true);
      }
    }
  });
}

describe('writeTable -> readTable round trip (fast-check)', () => {
  for (const ext of ['csv', 'tsv', 'json', 'jsonl'])
    it(`${ext}: same values, bit for bit, with kinds declared`, async () => {
      await fc.assert(
        fc.asyncProperty(tableSpec, async (specs) => {
          const t = build(specs);
          const path = join(dir, `r${k++}.${ext}`);
          await writeTable(t, path);
          const kinds = Object.fromEntries(t.columns.map((c) => [c.name, c.kind]));
          const back = await readTable(path, { kinds, complexPairs: 'none' });
          sameValues(t, back);
        }),
        { numRuns: 60, seed: 20240601 },
      );
    });

  it('csv: kinds are inferred back for numeric columns without declaring them', async () => {
    await fc.assert(
      fc.asyncProperty(
        fc.array(fc.tuple(fc.double({ noNaN: true, noDefaultInfinity: true }), fc.integer(), fc.tuple(fc.double(), fc.double({ min: 1, max: 2 }))), { minLength: 1, maxLength: 30 }),
        async (rows) => {
          const n = rows.length;
          // force the real column to hold a non-integer so that it is inferred real
          const real = Float64Array.from(rows.map((r) => r[0]));
          real[0] = 0.5;
          const t = tableFromColumns([
            { name: 'x', kind: 'real', values: real, missing: new Uint8Array(n) },
            { name: 'k', kind: 'integer', values: Float64Array.from(rows.map((r) => r[1])), missing: new Uint8Array(n) },
            { name: 'z', kind: 'complex', re: Float64Array.from(rows.map((r) => r[2][0])), im: Float64Array.from(rows.map((r) => r[2][1])), missing: new Uint8Array(n) },
          ]);
          const path = join(dir, `i${k++}.csv`);
          await writeTable(t, path);
          sameValues(t, await readTable(path));
        },
      ),
      { numRuns: 60, seed: 7 },
    );
  });

  it('a CSV label spelled NA or null is quoted on writing and read back as text, not missing', async () => {
    const t = tableFromColumns([
      { name: 'name', kind: 'label', values: ['NA', 'null', '', ' pad '], missing: Uint8Array.from([0, 0, 1, 0]) },
    ]);
    const path = join(dir, 'na.csv');
    await writeTable(t, path);
    expect(readFileSync(path, 'utf8')).toBe('name\n"NA"\n"null"\n""\n" pad "\n');
    sameValues(t, await readTable(path, { kinds: { name: 'label' } }));
  });

  it('complex cells are written a+bj and JSON cells as {"re", "im"}', async () => {
    const t = tableFromColumns([{ name: 'z', kind: 'complex', re: Float64Array.from([1.5, 0]), im: Float64Array.from([-2.25, 1]), missing: new Uint8Array(2) }]);
    await writeTable(t, join(dir, 'z.csv'));
    await writeTable(t, join(dir, 'z.json'));
    expect(readFileSync(join(dir, 'z.csv'), 'utf8')).toBe('z\n1.5-2.25j\n0+1j\n');
    expect(JSON.parse(readFileSync(join(dir, 'z.json'), 'utf8'))).toEqual([{ z: { re: 1.5, im: -2.25 } }, { z: { re: 0, im: 1 } }]);
    expect(parseComplexText('1.5-2.25j')).toEqual({ re: 1.5, im: -2.25 });
  });

  it('refuses to overwrite an existing file (table.exists) unless force; leaves no temporary file behind', async () => {
    const path = put(dir, 'keep.csv', 'precious\n1\n');
    const t = tableFromColumns([{ name: 'x', kind: 'integer', values: Float64Array.from([2]), missing: new Uint8Array(1) }]);
    const err = (await writeTable(t, path).catch((e) => e)) as SurmiseError;
    expect(err.code).toBe('table.exists');
    expect(readFileSync(path, 'utf8')).toBe('precious\n1\n');
    await writeTable(t, path, { force: true });
    expect(readFileSync(path, 'utf8')).toBe('x\n2\n');
    expect(readdirSync(dir).filter((f) => f.endsWith('.tmp') || f.includes('surmise-partial'))).toEqual([]);
    expect(existsSync(path)).toBe(true);
  });
});
