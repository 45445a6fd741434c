/**
 * JSON and JSON Lines input, complex pair joining, declared kinds, and in-memory construction.
 * Expected values are written by hand from the inputs (the task statement's rules).
 */
import { describe, it, expect } from 'vitest';
import { readTable } from '../../src/table/read.ts';
import { getColumn, tableFromRecords, joinComplexPairs } from '../../src/table/columns.ts';
import { SurmiseError } from '../../src/errors.ts';
import type { ComplexColumn, LabelColumn, RealColumn } from '../../src/table/types.ts';
import { put, tempDir } from './helpers.ts';

const dir = tempDir('json');

describe('JSON and JSON Lines', () => {
  it('an array of objects with numbers, strings, null, {re, im} and [re, im] cells', async () => {
    const p = put(
      dir,
      'knots.json',
      JSON.stringify([
        { name: '4_1', amp: 2.0298832128193, tau: { re: 0, im: 3.4641016151377544 }, c: 4, sig: 0 },
        { name: '5_2', amp: 2.8281220883308, tau: [-0.5, 2.5], c: 5, sig: null },
        { name: '6_1', amp: '3.1639632288831', tau: '1.5-2j', c: 6, sig: -2 },
      ]),
    );
    const t = await readTable(p);
    expect(t.columns.map((c) => `${c.name}:${c.kind}`)).toEqual(['name:label', 'amp:real', 'tau:complex', 'c:integer', 'sig:integer']);
    const tau = getColumn(t, 'tau') as ComplexColumn;
    expect(Array.from(tau.re)).toEqual([0, -0.5, 1.5]);
    expect(Array.from(tau.im)).toEqual([3.4641016151377544, 2.5, -2]);
    expect(Array.from(getColumn(t, 'sig').missing)).toEqual([0, 1, 0]);
    // volumes of 4_1, 5_2, 6_1 (from memory; shared reference-checks list)
    expect((getColumn(t, 'amp') as RealColumn).values[2]).toBe(3.1639632288831);
    expect(t.lines).toBeUndefined();
  });

  it('JSON Lines: keys may differ between records (absent key = missing), lines are tracked, blank lines skipped', async () => {
    const p = put(dir, 'r.ndjson', '{"a": 1, "b": "x"}\n\n{"a": 2.5, "c": 7}\r\n{"b": "y"}\n');
    const t = await readTable(p);
    expect(t.columns.map((c) => c.name)).toEqual(['a', 'b', 'c']);
    expect(Array.from(getColumn(t, 'a').missing)).toEqual([0, 0, 1]);
    expect((getColumn(t, 'b') as LabelColumn).values).toEqual(['x', '', 'y']);
    expect(Array.from(t.lines!)).toEqual([1, 3, 4]);
  });

  it('JSON Lines: a numeric-looking start then text gives labels with the original text recovered', async () => {
    const p = put(dir, 'mix.jsonl', ['{"k": 1.50}', '{"k": "1e3"}', '{"k": "x"}', '{"k": "y"}'].join('\n'));
    const t = await readTable(p);
    // a JSON number keeps only its value (1.50 is the number 1.5); a string keeps its text
    expect((getColumn(t, 'k') as LabelColumn).values).toEqual(['1.5', '1e3', 'x', 'y']);
  });

  it('a nested object that is not {re, im} is table.badCell naming the record line and column', async () => {
    const p = put(dir, 'nest.jsonl', '{"a": 1}\n{"a": {"x": 1}}\n');
    const err = (await readTable(p, { displayName: 'nest.jsonl' }).catch((e) => e)) as SurmiseError;
    expect(err.code).toBe('table.badCell');
    expect(err.message).toMatch(/^nest\.jsonl:2: column 'a': a nested object is not a table cell/);
  });

  it('--format overrides the extension', async () => {
    const p = put(dir, 'data.txt', 'a\tb\n1\t2\n');
    const t = await readTable(p, { format: 'tsv' });
    expect(t.columns.map((c) => c.name)).toEqual(['a', 'b']);
  });
});

describe('complex pairs and kinds', () => {
  it("'auto' joins X_re/X_im and X.re/X.im into complex X at the real part's place, and notes it", async () => {
    const p = put(dir, 'pairs.csv', 'k,shape_re,shape_im,u.re,u.im\n1,0.5,1.2,3,4\n2,-0.5,NA,5,6\n');
    const t = await readTable(p);
    expect(t.columns.map((c) => `${c.name}:${c.kind}`)).toEqual(['k:integer', 'shape:complex', 'u:complex']);
    const s = getColumn(t, 'shape') as ComplexColumn;
    expect(Array.from(s.missing)).toEqual([0, 1]); // missing imaginary part: the complex cell is missing
    expect(t.notes).toContain("columns 'shape_re' and 'shape_im' joined into complex column 'shape'");
  });

  it("complexPairs 'none' keeps the parts; an explicit rule joins any two numeric columns", async () => {
    const p = put(dir, 'pairs2.csv', 'czb_x,czb_y,shape_re,shape_im\n1,2,3,4\n');
    expect((await readTable(p, { complexPairs: 'none' })).columns).toHaveLength(4);
    const t = await readTable(p, { complexPairs: [{ name: 'czb', re: 'czb_x', im: 'czb_y' }] });
    expect(t.columns.map((c) => c.name)).toEqual(['czb', 'shape_re', 'shape_im']);
    const err = (() => {
      try {
        joinComplexPairs(t, [{ name: 'w', re: 'shape_re', im: 'shape_imag' }]);
      } catch (e) {
        return e as SurmiseError;
      }
    })();
    expect(err?.code).toBe('table.unknownColumn');
    expect(err?.message).toMatch(/no column 'shape_imag' .*\(did you mean 'shape_im'\?\)/);
  });

  it('declared kinds: integers as real, numbers as labels (text kept as written)', async () => {
    const p = put(dir, 'k.csv', 'id,c\n007,3\n010,4\n');
    const t = await readTable(p, { kinds: { id: 'label', c: 'real' } });
    expect((getColumn(t, 'id') as LabelColumn).values).toEqual(['007', '010']);
    expect(getColumn(t, 'c').kind).toBe('real');
  });

  it('a column whose cells are complex numbers with one non-real value is complex; reals there have im 0', async () => {
    const p = put(dir, 'cx.tsv', 'z\n3\n-i\n(1.5,2.25)\n');
    const z = getColumn(await readTable(p), 'z') as ComplexColumn;
    expect(z.kind).toBe('complex');
    expect(Array.from(z.re)).toEqual([3, 0, 1.5]);
    expect(Array.from(z.im)).toEqual([0, -1, 2.25]);
  });

  it('nan and inf are values, not missing; NA and empty are missing (the table contract in types.ts)', async () => {
    const p = put(dir, 'nf.csv', 'x\nnan\nInf\nNA\n""\n-infinity\n');
    const x = getColumn(await readTable(p), 'x') as RealColumn;
    expect(Array.from(x.missing)).toEqual([0, 0, 1, 1, 0]);
    expect(Array.from(x.values)).toEqual([NaN, Infinity, NaN, NaN, -Infinity]);
  });

  it('a CSV column that turns to labels after numeric cells keeps their text as written (second pass)', async () => {
    const p = put(dir, 'late.csv', 'id,v\n1.50,1\n"007",2\n1e3,3\nK3a1,4\nK4a1,5\n');
    const t = await readTable(p);
    expect((getColumn(t, 'id') as LabelColumn).values).toEqual(['1.50', '007', '1e3', 'K3a1', 'K4a1']);
    expect(t.notes).toEqual(["column 'id' read as labels: 2 of 5 cells are not numbers (first: line 5, 'K3a1')"]);
  });

  it('getColumn suggests the nearest name (table.unknownColumn)', () => {
    const t = tableFromRecords([{ volume: 1, slope: 2 }], 'mem');
    expect(() => getColumn(t, 'slop')).toThrowError("no column 'slop' in mem (did you mean 'slope'?); columns: volume, slope");
  });

  it('an empty header field is named column_<k> (as R writes row names) rather than rejected', async () => {
    const p = put(dir, 'rn.csv', ',x\nr1,1\nr2,2\n');
    expect((await readTable(p)).columns.map((c) => c.name)).toEqual(['column_1', 'x']);
  });
});
