import { describe, it, expect } from 'vitest';
import { ATTRIBUTION_METHODS, ATTRIBUTION_REGISTRY, attributionStrategy } from '../../src/attribute/methods/index.ts';
import { ATTRIBUTION_METHODS as FROM_TYPES } from '../../src/attribute/types.ts';
import { attributeRepeat } from '../../src/attribute/repeat.ts';
import { defaultGroups } from '../../src/attribute/groups.ts';
import { parseMethods } from '../../src/cli/rank.ts';
import { parseConfig } from '../../src/run/config.ts';
import { rankFeatures } from '../../src/attribute/rank.ts';
import { tableFromRecords } from '../../src/table/columns.ts';
import { caught } from '../helpers/errors.ts';
import { linearModel, normalRows } from './analytic.ts';

const SETTINGS = { seed: 7, smoothGradSamples: 8, smoothGradNoise: 0.15, integratedSteps: 16, permutationRepeats: 20 };

describe('the attribution-method registry', () => {
  it('has unique lower-case names, each with a label and a description naming its source', () => {
    const names = ATTRIBUTION_REGISTRY.map((m) => m.name);
    expect(new Set(names).size).toBe(names.length);
    for (const m of ATTRIBUTION_REGISTRY) {
      expect(m.name).toMatch(/^[a-z][a-z-]*$/);
      expect(m.label.length).toBeGreaterThan(0);
      expect(m.description).toMatch(/\d{4}/); // a year: the published source
    }
  });

  it('every consumer reads the list: types, the CLI --method, the config schema', () => {
    expect([...FROM_TYPES]).toEqual(ATTRIBUTION_REGISTRY.map((m) => m.name));
    expect([...ATTRIBUTION_METHODS]).toEqual(ATTRIBUTION_REGISTRY.map((m) => m.name));
    expect(parseMethods('all')).toEqual([...ATTRIBUTION_METHODS]);
    for (const m of ATTRIBUTION_METHODS) expect(parseMethods(m)).toEqual([m]);
    const { config } = parseConfig('table: t.csv\ntarget: y\n', 'cfg.yaml');
    expect(config.attribution.methods).toEqual([...ATTRIBUTION_METHODS]);
    for (const m of ATTRIBUTION_METHODS) {
      expect(parseConfig(`table: t.csv\ntarget: y\nattribution:\n  methods: [${m}]\n`, 'cfg.yaml').config.attribution.methods).toEqual([m]);
    }
    expect(() => parseConfig('table: t.csv\ntarget: y\nattribution:\n  methods: [lime]\n', 'cfg.yaml')).toThrow(/cfg\.yaml:4/);
  });

  it('an unknown name is refused with option.badValue by the library, naming the registered ones', async () => {
    const e = caught(() => attributionStrategy('lime'));
    expect(e.code).toBe('option.badValue');
    expect(e.message).toBe(`'lime' in \`methods\` is not an attribution method; expected ${ATTRIBUTION_METHODS.join(', ')}`);
    const t = tableFromRecords([{ a: 1, y: 2 }, { a: 2, y: 3 }]);
    await expect(rankFeatures(t, { target: 'y', methods: ['lime' as never] })).rejects.toMatchObject({ code: 'option.badValue' });
  });

  // f(x) = w·x: ∂f/∂x_j = w_j on every row, so saliency and SmoothGrad are |w_j| exactly; integrated
  // gradients from 0 give a_ij = w_j x_ij, which add up to f(x) − f(0) (completeness, Sundararajan,
  // Taly & Yan 2017); shuffling column j of N(0,1) rows raises the squared error by
  // E[w_j²(x − x′)²] = 2w_j² (common practice; sampling error ~ a few % at n = 4000)
  it('through the registry, each method gives its known answer on a linear model', () => {
    const w = [3, -1, 0.5, 0];
    const model = linearModel(w);
    const n = 4000;
    const x = normalRows(n, 4, 5);
    const y = model.predict(x, n);
    const groups = defaultGroups(['a', 'b', 'c', 'd']);
    const r = attributeRepeat(model, x, y, n, groups, { methods: ATTRIBUTION_METHODS, ...SETTINGS });
    expect(Object.keys(r.scores)).toEqual([...ATTRIBUTION_METHODS]);
    for (let j = 0; j < 4; j++) {
      expect(r.scores.saliency!.scores[j]).toBeCloseTo(Math.abs(w[j]!), 12);
      expect(r.scores.smoothgrad!.scores[j]).toBeCloseTo(Math.abs(w[j]!), 12);
      const expected = 2 * w[j]! ** 2;
      if (expected === 0) expect(r.scores.permutation!.scores[j]).toBe(0); // shuffling an unused column changes nothing
      else expect(Math.abs(r.scores.permutation!.scores[j]! / expected - 1)).toBeLessThan(0.05);
    }
    expect(r.completeness!.maxAbsGap).toBeLessThan(1e-9);
    expect(r.baseLoss).toBe(0);
  });
});
