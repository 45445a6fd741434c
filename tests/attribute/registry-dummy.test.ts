/**
 * "A new method is one file and one line": a method added to the one list (list.ts, mocked here
 * to append a test method) reaches every consumer with no other edit — the library, the CLI's
 * --method and its help, the config schema — and rankFeatures runs it.
 */
import { describe, it, expect, vi } from 'vitest';
import type { AttributionStrategy } from '../../src/attribute/methods/strategy.ts';

// every group scores 1: after normalisation each of G groups has share exactly 1/G
const equalShares: AttributionStrategy<'equal-shares'> = {
  name: 'equal-shares',
  label: 'equal shares',
  description: 'a test method: every group scores 1 (test only, 2026)',
  compute: ({ n, groups }) => ({ scores: { scores: new Float64Array(groups.length).fill(1), n } }),
};

vi.mock('../../src/attribute/methods/list.ts', async (importOriginal) => {
  const real = await importOriginal<typeof import('../../src/attribute/methods/list.ts')>();
  return { ATTRIBUTION_REGISTRY: [...real.ATTRIBUTION_REGISTRY, equalShares] };
});

const { ATTRIBUTION_METHODS } = await import('../../src/attribute/methods/index.ts');
const { parseMethods } = await import('../../src/cli/rank.ts');
const { parseConfig } = await import('../../src/run/config.ts');
const { rankFeatures } = await import('../../src/attribute/rank.ts');
const { tableFromRecords } = await import('../../src/table/columns.ts');
const { runCli } = await import('../../src/cli/main.ts');
const { memoryIO } = await import('../../src/cli/io.ts');

describe('a method registered in the one list', () => {
  it('is a choice of the library, the CLI and the config schema', async () => {
    expect(ATTRIBUTION_METHODS).toContain('equal-shares');
    expect(parseMethods('saliency,equal-shares')).toEqual(['saliency', 'equal-shares']);
    expect(parseMethods('all')).toContain('equal-shares');
    expect(parseConfig('table: t.csv\ntarget: y\nattribution:\n  methods: [equal-shares]\n', 'cfg.yaml').config.attribution.methods).toEqual(['equal-shares']);
    const io = memoryIO(process.cwd());
    await runCli(['rank', '--help'], io);
    expect(io.out + io.err).toMatch(/saliency\|smoothgrad\|integrated\|permutation\|equal-shares\|all/);
  });

  it('is run by rankFeatures: three groups get shares of exactly 1/3', async () => {
    const rows = Array.from({ length: 60 }, (_, i) => ({ a: i % 7, b: (i * 3) % 11, c: (i * 5) % 13, y: i % 7 + ((i * 3) % 11) }));
    const r = await rankFeatures(tableFromRecords(rows), { target: 'y', methods: ['equal-shares' as never], seeds: 1, hidden: [4], epochs: 2, probes: 0, resamples: 10, workers: 0 });
    expect(r.rankingMethod).toBe('equal-shares');
    expect(r.ranking.map((e) => e.score)).toEqual([1 / 3, 1 / 3, 1 / 3].map((v) => expect.closeTo(v, 12)));
  });
});
