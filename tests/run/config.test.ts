import { describe, it, expect, expectTypeOf } from 'vitest';
import { fileURLToPath } from 'node:url';
import { parseConfig, loadConfig, type RunConfig } from '../../src/run/config.ts';
import type { EngineChoice } from '../../src/learn/engines.ts';
import type { AttributionMethod } from '../../src/attribute/types.ts';
import type { BoundForm } from '../../src/bound/options.ts';
import { SurmiseError } from '../../src/errors.ts';

function refusal(text: string): { code: string; message: string } {
  try {
    parseConfig(text, 'cfg.yaml');
  } catch (e) {
    expect(e).toBeInstanceOf(SurmiseError);
    return { code: (e as SurmiseError).code, message: (e as SurmiseError).message };
  }
  throw new Error('expected a refusal');
}

describe('run configuration', () => {
  it('fills documented defaults (README: configuration reference)', () => {
    const { config } = parseConfig('table: t.csv\ntarget: sig\n', 'dir/cfg.yaml');
    expect(config.network.hidden).toEqual([64, 64, 64]);
    expect(config.attribution.seeds).toBe(3);
    expect(config.attribution.methods).toEqual(['saliency', 'smoothgrad', 'integrated', 'permutation']);
    expect(config.split).toBeUndefined(); // random 70/15/15, or kfold:K with attribution.folds K
    expect(config.table.endsWith('dir/t.csv')).toBe(true);
  });

  it('loads the bundled demo configuration', () => {
    const path = fileURLToPath(new URL('../../configs/demo.yaml', import.meta.url));
    const { config } = loadConfig(path);
    expect(config.target).toBe('signature');
    expect(config.bounds[0]!.rhs).toEqual(['crossings - seifert_circles + 1', 'strands']);
  });

  it('accepts a single item where a list is expected (rhs: b = rhs: [b])', () => {
    const { config } = parseConfig('table: a.csv\ntarget: y\nexclude: z\nbounds:\n  - lhs: y\n    rhs: b\n', 'cfg.yaml');
    expect(config.exclude).toEqual(['z']);
    expect(config.bounds[0]!.rhs).toEqual(['b']);
  });

  it('reads the discover key with the bound stage\'s defaults and ranges', () => {
    const { config } = parseConfig('table: a.csv\ntarget: y\ndiscover:\n  - lhs: y\n    from: [amp, gap]\n', 'cfg.yaml');
    expect(config.discover[0]).toMatchObject({ lhs: 'y', from: ['amp', 'gap'], lower: false, maxExponent: 4, maxDenominator: 4, proposals: 5, top: 5, bins: 10 });
    expect(refusal('table: a.csv\ntarget: y\ndiscover:\n  - lhs: y\n    from: amp\n    maxExponent: 40\n').message).toMatch(/^cfg\.yaml:6:18: discover\[0\]\.maxExponent: /);
  });

  it('refuses an empty list where one item is needed', () => {
    expect(refusal('table: a.csv\ntarget: y\nbounds:\n  - lhs: y\n    rhs: []\n')).toEqual({
      code: 'config.badValue',
      message: 'cfg.yaml:5:10: bounds[0].rhs: expected a list of at least 1 item(s), got a list',
    });
  });

  it('refuses an unknown key with its place and a suggestion', () => {
    expect(refusal('table: a.csv\ntarget: sig\natribution:\n  seeds: 2\n')).toEqual({
      code: 'config.unknownKey',
      message: "cfg.yaml:3:1: unknown key 'atribution' (did you mean 'attribution'?)",
    });
  });

  it('refuses an unknown nested key inside a list item', () => {
    expect(refusal('table: a.csv\ntarget: sig\nbounds:\n  - lhs: x\n    rhs: [a]\n    topp: 2\n')).toEqual({
      code: 'config.unknownKey',
      message: "cfg.yaml:6:5: unknown key 'bounds[0].topp' (did you mean 'top'?)",
    });
  });

  it('refuses a number out of range', () => {
    expect(refusal('table: a.csv\ntarget: sig\nattribution:\n  seeds: 0\n')).toEqual({
      code: 'option.badValue',
      message: 'cfg.yaml:4:10: attribution.seeds: expected a number ≥ 1, got 0',
    });
  });

  it('residual: defaults filled; probes and maxTerms have ceilings, refused at their key', () => {
    const { config } = parseConfig('table: a.csv\ntarget: y\nresidual:\n  target: y\n  terms: a^2\n', 'cfg.yaml');
    expect(config.residual).toEqual({ target: 'y', terms: ['a^2'], intercept: true, absolute: true, maxTerms: 1, powers: '-3..3', columns: 3 }); // columns: the new key (RESIDUAL_OPTIONS)
    expect(config.attribution.probes).toBe(6);
    expect(refusal('table: a.csv\ntarget: y\nattribution:\n  probes: 51\n')).toEqual({
      code: 'option.tooLarge',
      message: 'cfg.yaml:4:11: attribution.probes: expected at most 50 (its ceiling), got 51',
    });
    expect(refusal('table: a.csv\ntarget: y\nresidual:\n  target: y\n  terms: [a]\n  maxTerm: 2\n')).toEqual({
      code: 'config.unknownKey',
      message: "cfg.yaml:6:3: unknown key 'residual.maxTerm' (did you mean 'maxTerms'?)",
    });
  });

  it('every list of blocks has a ceiling (fits 50, bounds 50, discover 20, search 20), refused at its key', () => {
    const fits = 'fits:\n' + '  - { target: y, terms: [a] }\n'.repeat(51);
    expect(refusal(`table: a.csv\ntarget: y\n${fits}`)).toEqual({ code: 'option.tooLarge', message: 'cfg.yaml:4:3: fits: expected at most 50 fit blocks (its ceiling), got 51' });
    expect(parseConfig(`table: a.csv\ntarget: y\nfits:\n${'  - { target: y, terms: [a] }\n'.repeat(50)}`, 'cfg.yaml').config.fits).toHaveLength(50);
    const bounds = 'bounds:\n' + '  - { lhs: y, rhs: a }\n'.repeat(51);
    expect(refusal(`table: a.csv\ntarget: y\n${bounds}`)).toEqual({ code: 'option.tooLarge', message: 'cfg.yaml:4:3: bounds: expected at most 50 bound blocks (its ceiling), got 51' });
    const discover = 'discover:\n' + '  - { lhs: y, from: [a] }\n'.repeat(21);
    expect(refusal(`table: a.csv\ntarget: y\n${discover}`)).toEqual({ code: 'option.tooLarge', message: 'cfg.yaml:4:3: discover: expected at most 20 discover blocks (its ceiling), got 21' });
  });

  it('refuses a wrong type', () => {
    expect(refusal('table: a.csv\ntarget: sig\nnetwork:\n  hidden: 12\n')).toEqual({
      code: 'option.badValue',
      message: 'cfg.yaml:4:11: network.hidden: expected a list, got 12',
    });
  });

  it('refuses a value outside an enumeration', () => {
    expect(refusal('table: a.csv\ntarget: sig\nnetwork:\n  activation: tanh\n')).toEqual({
      code: 'option.badValue',
      message: "cfg.yaml:4:15: network.activation: expected one of 'relu', 'gelu', got 'tanh'",
    });
  });

  it('refuses a missing required key', () => {
    expect(refusal('table: a.csv\n')).toEqual({
      code: 'config.missingKey',
      message: "cfg.yaml:1:1: missing required key 'target'",
    });
  });

  it('refuses broken YAML with its line', () => {
    const r = refusal('table: a.csv\ntarget: [sig\n');
    expect(r.code).toBe('config.yaml');
    expect(r.message.startsWith('cfg.yaml:3:1: not valid YAML')).toBe(true);
  });

  it('refuses a top level that is not a mapping', () => {
    expect(refusal('- a\n- b\n')).toEqual({
      code: 'config.notMapping',
      message: 'cfg.yaml: expected a mapping of keys (table, target, ...) at the top level',
    });
  });

  it('reads `search` as one block or a list of blocks, each named (search 1, search 2, … unless named)', () => {
    const one = parseConfig('table: a.csv\ntarget: y\nsearch:\n  target: y\n  from: [a]\n', 'cfg.yaml');
    expect(one.config.search.map((s) => [s.name, s.target, s.maxTerms])).toEqual([['search 1', 'y', 2]]);
    expect(one.searchPath!(0)).toEqual(['search']);
    const two = parseConfig('table: a.csv\ntarget: y\nsearch:\n  - target: y\n    from: [a]\n  - name: second\n    target: z\n    from: [b]\n    maxTerms: 1\n', 'cfg.yaml');
    expect(two.config.search.map((s) => [s.name, s.target, s.maxTerms])).toEqual([['search 1', 'y', 2], ['second', 'z', 1]]);
    expect(two.searchPath!(1)).toEqual(['search', 1]);
    expect(parseConfig('table: a.csv\ntarget: y\n', 'cfg.yaml').config.search).toEqual([]);
    expect(refusal('table: a.csv\ntarget: y\nsearch: 3\n')).toEqual({
      code: 'config.badValue',
      message: 'cfg.yaml:3:9: search: expected a search block (a mapping) or a list of them, got 3',
    });
    expect(refusal('table: a.csv\ntarget: y\nsearch:\n  - name: "a\\nb"\n    target: y\n    from: [a]\n').message).toBe(
      "cfg.yaml:4:11: search[0].name: expected a name on one line, without control characters, got 'a\\nb'", // one line: the newline shown escaped
    );
    expect(refusal('table: a.csv\ntarget: y\nsearch:\n  - target: y\n    from: [a]\n    maxTerm: 2\n')).toEqual({
      code: 'config.unknownKey',
      message: "cfg.yaml:6:5: unknown key 'search[0].maxTerm' (did you mean 'maxTerms'?)",
    });
  });

  it('refuses a malformed power range in search', () => {
    expect(refusal('table: a.csv\ntarget: y\nsearch:\n  target: y\n  from: [a]\n  powers: 1-3\n')).toEqual({
      code: 'option.badValue',
      message: "cfg.yaml:6:11: search.powers: expected a range such as -3..3, got '1-3'",
    });
  });
});

describe('RunConfig is the schema\'s output type, built from the options tables', () => {
  it('keys and value types follow the tables (these checks are made by tsc in npm test)', () => {
    expectTypeOf<RunConfig['network']['epochs']>().toEqualTypeOf<number>();
    expectTypeOf<RunConfig['network']['batchSize']>().toEqualTypeOf<number | undefined>(); // no default in the table: optional
    expectTypeOf<RunConfig['network']['engine']>().toEqualTypeOf<EngineChoice>();
    expectTypeOf<RunConfig['attribution']['methods']>().toEqualTypeOf<AttributionMethod[]>();
    expectTypeOf<RunConfig['bounds'][number]['form']>().toEqualTypeOf<BoundForm>();
    expectTypeOf<RunConfig['search'][number]['maxTerms']>().toEqualTypeOf<number>();
    expectTypeOf<NonNullable<RunConfig['residual']>['columns']>().toEqualTypeOf<number>();
    expectTypeOf<RunConfig['seed']>().toEqualTypeOf<number>();
    expectTypeOf<RunConfig['features']>().toEqualTypeOf<string[] | undefined>();
    // and at run time the parsed values are those types
    const { config } = parseConfig('table: t.csv\ntarget: y\n', 'cfg.yaml');
    expect(config.network.epochs).toBe(60);
    expect(config.network.batchSize).toBeUndefined();
    expect(config.attribution.methods).toEqual(['saliency', 'smoothgrad', 'integrated', 'permutation']);
  });
});
