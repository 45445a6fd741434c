import { describe, it, expect } from 'vitest';
import { execFileSync } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import * as api from '../../src/api/functions.ts';
import * as lib from '../../src/index.ts';
import { tableFromRecords as rawRecords } from '../../src/table/columns.ts';
import { SurmiseError } from '../../src/errors.ts';
import { caught } from '../helpers/errors.ts';

const doc = readFileSync(new URL('../../docs/API.md', import.meta.url), 'utf8');
// y = 2a + b − 1 exactly on four rows
const t = rawRecords([{ a: 1, b: 2, y: 3 }, { a: 2, b: 1, y: 4 }, { a: 3, b: 5, y: 10 }, { a: 4, b: 2, y: 9 }]);

describe('the library entry checks argument types', () => {
  it('a file name where a table is expected: api.badArgument naming function and argument', () => {
    const e = caught(() => api.fitRelation('knots.csv' as never, { target: 'y', terms: ['a'] }));
    expect(e.code).toBe('api.badArgument');
    expect(e.message).toBe('fitRelation: expected table to be a table (from readTable, fromDataFrame or table.tableFromRecords), got the string "knots.csv"');
    expect(e.details).toEqual({ function: 'fitRelation', argument: 'table' });
  });

  it('a number or a bare string where a list of column names is expected', () => {
    expect(caught(() => api.fitRelation(t, { target: 'y', terms: 5 as never })).message).toBe('fitRelation: expected spec.terms to be a list of strings, got the number 5');
    expect(caught(() => api.searchRelations(t, { target: 'y', from: 'a' as never })).message).toBe('searchRelations: expected spec.from to be a list of strings, got the string "a"');
    expect(caught(() => api.buildDataset(t, { target: 'y', features: 'a' as never })).details).toEqual({ function: 'buildDataset', argument: 'spec.features' });
    expect(caught(() => api.findBound(t, { lhs: 'y', rhs: 3 as never })).message).toBe('findBound: expected spec.rhs to be a string or a list of strings, got the number 3');
  });

  it('a danfo.js DataFrame where a table is expected is named as such', async () => {
    const df = await api.toDataFrame(t);
    const e = caught(() => api.deriveColumn(df as never, 'c', 'a + b'));
    expect(e.message).toBe('deriveColumn: expected table to be a table (from readTable, fromDataFrame or table.tableFromRecords), got a danfo.js DataFrame (convert it with fromDataFrame)');
    const back = await api.fromDataFrame(df);
    expect(back.nRows).toBe(4);
  });

  it('async functions refuse through their promise, not by throwing', async () => {
    let p: Promise<unknown> | undefined;
    expect(() => { p = api.rankFeatures(t, { target: 'y', features: 7 as never }); }).not.toThrow();
    await expect(p).rejects.toMatchObject({ code: 'api.badArgument', message: 'rankFeatures: expected options.features to be a list of strings, got the number 7' });
    await expect(api.readTable(42 as never)).rejects.toBeInstanceOf(SurmiseError);
    await expect(api.runCli('rank' as never, {} as never)).rejects.toMatchObject({ details: { function: 'runCli', argument: 'args' } });
  });

  it('an options key the function does not take is refused with a did-you-mean, never ignored', async () => {
    await expect(api.rankFeatures(t, { target: 'y', method: ['saliency'] } as never)).rejects.toMatchObject({
      code: 'api.badArgument',
      message: "rankFeatures: options has no key 'method' (did you mean 'methods'?)",
      details: { function: 'rankFeatures', argument: 'options.method' },
    });
    expect(caught(() => api.fitRelation(t, { target: 'y', terms: ['a'], zzz: 1 } as never)).message).toBe(
      "fitRelation: spec has no key 'zzz'; it takes target, terms, intercept, derive, split, seed, folds, level, keepDuplicates, noisyTerms, keepResiduals",
    );
    // nothing is written: the check comes first (the path is in a folder that does not exist)
    await expect(api.writeTable(t, join(tmpdir(), 'surmise-no-such-dir', 'x.csv'), { forse: true } as never)).rejects.toMatchObject({ code: 'api.badArgument', details: { argument: 'format.forse' } });
  });

  it('right types pass through unchanged (least squares on an exact law returns it: y = 2a + b − 1)', () => {
    const f = api.fitRelation(t, { target: 'y', terms: ['a', 'b'] });
    expect(f.terms.map((x) => x.term)).toEqual(['1', 'a', 'b']);
    expect(f.terms.map((x) => x.coef)).toEqual([expect.closeTo(-1, 9), expect.closeTo(2, 9), expect.closeTo(1, 9)]);
    expect(api.tableFromRecords([{ x: 1 }]).nRows).toBe(1);
    expect(caught(() => api.tableFromRecords({ x: 1 } as never)).code).toBe('api.badArgument');
  });
});

describe('docs/API.md', () => {
  it('documents every function the package exports by name, and each is the checked one', () => {
    const named = Object.entries(lib).filter(([k, v]) => typeof v === 'function' && !['SurmiseError', 'isUserError'].includes(k)).map(([k]) => k);
    expect(named.sort()).toEqual(Object.keys(api).sort());
    for (const k of named) {
      expect(doc, k).toContain(`\`${k}\``);
      expect((lib as Record<string, unknown>)[k]).toBe((api as Record<string, unknown>)[k]);
    }
  });

  it('its example runs from the project folder and prints what the doc says', () => {
    const code = /## Example[\s\S]*?```js\n([\s\S]*?)```/.exec(doc)![1]!;
    expect(code).toContain("from 'surmise'");
    const root = fileURLToPath(new URL('../..', import.meta.url));
    const out = execFileSync(process.execPath, ['--input-type=module', '-e', code], { encoding: 'utf8', cwd: root }).trim().split('\n');
    const expected = [...code.matchAll(/\/\/ → (.*)/g)].map((m) => m[1]!.trim());
    expect(expected.length).toBe(3);
    expect(out).toEqual(expected);
  }, 180_000);
});
