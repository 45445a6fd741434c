/**
 * CLI ⇄ configuration parity, walked from the stages' options tables: every option has a flag on
 * its command and a key in its configuration block with the table's default, and every option
 * either changes the outcome (shown by a run with and without it, on invented data) or says in the
 * table why it does not (`inert`). A new table option without one of these fails here.
 */
import { describe, it, expect, beforeAll } from 'vitest';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { runCli, buildProgram } from '../../src/cli/main.ts';
import { memoryIO } from '../../src/cli/io.ts';
import { parseConfig, RunConfigSchema } from '../../src/run/config.ts';
import { RANK_OPTIONS } from '../../src/attribute/options.ts';
import { FIT_OPTIONS, SEARCH_OPTIONS } from '../../src/relate/options.ts';
import { BOUND_OPTIONS, DISCOVER_OPTIONS } from '../../src/bound/options.ts';
import { RESIDUAL_OPTIONS } from '../../src/run/residual.ts';
import { INSPECT_OPTIONS } from '../../src/table/options.ts';
import { DEMO_DATA_OPTIONS } from '../../src/demo/options.ts';
import { KNOTS_OPTIONS } from '../../src/knots/options.ts';
import { configKeyOf, flagOf, type OptionTable } from '../../src/util/option-table.ts';
import { Rng } from '../../src/util/rng.ts';

interface Stage {
  name: string;
  table: OptionTable;
  command: string;
  /** The configuration block holding the options (`''`: the top level) and a minimal config text around it. */
  path: Array<string | number>;
  yaml: string;
  /** Where the parsed configuration holds the block, when not at `path` (one search block is read as a list of one). */
  parsed?: Array<string | number>;
}

const STAGES: Stage[] = [
  { name: 'rank', table: RANK_OPTIONS, command: 'rank', path: [], yaml: '' },
  { name: 'fit', table: FIT_OPTIONS, command: 'fit', path: ['fits', 0], yaml: 'fits:\n  - target: y\n    terms: [x]\n' },
  { name: 'search', table: SEARCH_OPTIONS, command: 'search', path: ['search'], parsed: ['search', 0], yaml: 'search:\n  target: y\n  from: [x]\n' },
  { name: 'bound', table: BOUND_OPTIONS, command: 'bound', path: ['bounds', 0], yaml: 'bounds:\n  - lhs: y\n    rhs: x\n' },
  { name: 'discover', table: DISCOVER_OPTIONS, command: 'bound', path: ['discover', 0], yaml: 'discover:\n  - lhs: y\n    from: [x]\n' },
  { name: 'residual', table: RESIDUAL_OPTIONS, command: 'residual', path: ['residual'], yaml: 'residual:\n  target: y\n  terms: [x]\n' },
];

const at = (v: unknown, path: ReadonlyArray<string | number>): unknown =>
  path.reduce<unknown>((o, k) => (o === null || typeof o !== 'object' ? undefined : (o as Record<string | number, unknown>)[k]), v);

describe('every table option has a flag and a config key with the same default', () => {
  const program = buildProgram(memoryIO());
  for (const s of STAGES) {
    it(`${s.name}: flags on '${s.command}', keys under ${s.path.length ? s.path.join('.') : 'the top level'}`, () => {
      const cmd = program.commands.find((c) => c.name() === s.command)!;
      const { config } = parseConfig(`table: t.csv\ntarget: y\n${s.yaml}`, 'cfg.yaml');
      const block = at(config, s.parsed ?? s.path);
      for (const o of s.table) {
        const flag = flagOf(o);
        if (flag === null) expect(o.cliAbsent, `${s.name}.${o.key}: no flag and no reason`).toBeTruthy();
        else {
          const long = o.type === 'boolean' && o.default === true ? flag.replace(/^--/, '--no-') : flag;
          expect(cmd.options.some((c) => c.long === long), `${s.name}.${o.key}: no ${long} on ${s.command}`).toBe(true);
        }
        const key = configKeyOf(o);
        if (key === null) {
          expect(o.configAbsent, `${s.name}.${o.key}: no config key and no reason`).toBeTruthy();
          continue;
        }
        const got = at(block, key.split('.'));
        // a block's seed left out takes the top-level seed, whose default is the table's
        const value = o.key === 'seed' && got === undefined ? config.seed : got;
        if (o.default === null) expect(value, `${s.name}.${key}`).toBeUndefined();
        else expect(value, `${s.name}.${key}`).toEqual(o.default);
      }
    });
  }

  it('the configuration knows no option key the tables do not list (besides what to compute and where)', () => {
    const listed = new Set(RANK_OPTIONS.map((o) => (configKeyOf(o) ?? '').split('.')[0]));
    const own = ['table', 'format', 'kinds', 'complexPairs', 'derive', 'target', 'groups', 'network', 'attribution', 'fits', 'search', 'residual', 'bounds', 'discover', 'output'];
    for (const k of Object.keys(RunConfigSchema.shape)) expect(listed.has(k) || own.includes(k), k).toBe(true);
  });
});

// ---------------------------------------------------------------------------------------------
// Each option changes the outcome: one run with the base flags, one with the option changed.

let dir: string;
beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), 'surmise-parity-'));
  const rng = new Rng(5);
  // invented data for the machinery: y = 2·x1 + x2 + noise, class c from x1, k an integer target
  const rows = ['name,x1,x2,x3,y,c,k,r'];
  for (let i = 0; i < 160; i++) {
    const x = [rng.next(), rng.next(), rng.next()];
    const y = 2 * x[0]! + x[1]! + 0.1 * rng.normal();
    const c = x[0]! < 0.33 ? 0 : x[0]! < 0.66 ? 1 : 2;
    const k = Math.round(4 * x[0]! + 2 * x[1]!);
    rows.push([`n${i}`, ...x.map((v) => v.toFixed(5)), y.toFixed(5), c, k, (1 + x[2]!).toFixed(5)].join(','));
  }
  // two exact repeats (for keepDuplicates)
  rows.push(rows[1]!, rows[2]!);
  writeFileSync(join(dir, 't.csv'), rows.join('\n') + '\n');
});

/** The run's JSON, or `{ refused: code }` when it refuses the input (exit 2). */
async function json(args: string[]): Promise<Record<string, unknown>> {
  const io = memoryIO(dir);
  const code = await runCli([...args, '--json', ...(args[0] === 'fit' ? [] : ['--no-progress'])], io);
  if (code === 2) return { refused: /\[([\w.]+)\]\n$/.exec(io.err)?.[1] };
  expect(code, `${args.join(' ')}: ${io.err}`).toBe(0);
  return JSON.parse(io.out) as Record<string, unknown>;
}

type RankOutcome = { model: { score: number }; ranking: unknown };

/** What a run found, without the settings it echoes back (those always differ). */
function outcome(r: Record<string, unknown>, stage: string): string {
  if (r.refused !== undefined) return `refused: ${String(r.refused)}`;
  const pick = (o: Record<string, unknown>, keys: string[]) => Object.fromEntries(keys.map((k) => [k, o[k]]));
  if (stage === 'rank') {
    const m = r.model as Record<string, unknown>;
    return JSON.stringify({ score: m.score, perRepeat: m.perRepeat, ranking: r.ranking, methods: r.methods, ablation: r.ablation, task: r.task, groups: r.groups });
  }
  if (stage === 'fit') return JSON.stringify(pick(r, ['terms', 'n', 'r2', 'rmse', 'cvRmse', 'heldOut', 'orthogonal', 'errorsInVariables']));
  if (stage === 'search') return JSON.stringify(pick(r, ['candidates', 'front', 'lattice', 'nCandidateTerms', 'nCandidatesTried', 'selectionRows']));
  if (stage === 'bound') return JSON.stringify(pick(r, ['results', 'n', 'dropped', 'form']));
  if (stage === 'residual') {
    const ranked = (k: RankOutcome | null) => (k ? { score: k.model.score, ranking: k.ranking } : null);
    const next = r.next as { from: string[]; proposal: unknown; search: { nCandidatesTried: number; nCandidateTerms: number } } | null;
    return JSON.stringify({ fit: r.fit, features: r.features, ranking: ranked(r.ranking as RankOutcome), absolute: ranked(r.absolute as RankOutcome | null), next: next && { from: next.from, proposal: next.proposal, tried: next.search.nCandidatesTried, terms: next.search.nCandidateTerms } });
  }
  return JSON.stringify(pick(r, ['proposals', 'used', 'selectionRows', 'dropped', 'form']));
}

interface Variant {
  /** Flags added to the base run, and the flags replacing base ones for both runs (`with`). */
  args: string[];
  with?: string[];
}

const RANK_BASE = ['rank', 't.csv', '--target', 'y', '--features', 'x1,x2,x3', '--epochs', '3', '--seeds', '1', '--hidden', '4', '--probes', '0', '--resamples', '10', '--method', 'saliency', '--attribution-rows', '30'];
const RANK_VARIANTS: Record<string, Variant> = {
  features: { args: ['--features', 'x1,x2'] },
  exclude: { args: ['--exclude', 'x3'] },
  methods: { args: ['--method', 'permutation'] },
  seeds: { args: ['--seeds', '2'] },
  folds: { args: ['--folds', '2'] },
  split: { args: ['--split', 'random:0.5,0.25,0.25'] },
  task: { args: ['--task', 'regression'], with: ['--target', 'c'] },
  hidden: { args: ['--hidden', '6,3'] },
  epochs: { args: ['--epochs', '5'] },
  activation: { args: ['--activation', 'gelu'] },
  loss: { args: ['--loss', 'huber'] },
  patience: { args: ['--patience', '0'], with: ['--epochs', '40', '--learning-rate', '0.2'] },
  batchSize: { args: ['--batch-size', '64'] },
  learningRate: { args: ['--learning-rate', '0.05'] },
  seed: { args: ['--seed', '7'] },
  dropTop: { args: ['--drop-top', '1'] },
  probes: { args: ['--probes', '2'] },
  permutationLoss: { args: ['--permutation-loss', 'cross-entropy'], with: ['--target', 'c', '--method', 'permutation'] },
  attributionRows: { args: ['--attribution-rows', '10'] },
  smoothGradSamples: { args: ['--smooth-grad-samples', '3'], with: ['--method', 'smoothgrad'] },
  smoothGradNoise: { args: ['--smooth-grad-noise', '0.5'], with: ['--method', 'smoothgrad'] },
  integratedSteps: { args: ['--integrated-steps', '2'], with: ['--method', 'integrated'] },
  permutationRepeats: { args: ['--permutation-repeats', '1'], with: ['--method', 'permutation'] },
  resamples: { args: ['--resamples', '20'] },
};

const FIT_BASE = ['fit', 't.csv', '--target', 'y', '--terms', 'x1; x2'];
const FIT_VARIANTS: Record<string, Variant> = {
  intercept: { args: ['--no-intercept'] },
  split: { args: ['--split', 'random:0.6,0.2,0.2'] },
  seed: { args: ['--seed', '7'] },
  folds: { args: ['--folds', '3'] },
  level: { args: ['--level', '0.5'] },
  keepDuplicates: { args: ['--keep-duplicates'] },
  noisyTerms: { args: ['--noisy', 'x1'] },
};

const SEARCH_BASE = ['search', 't.csv', '--target', 'y', '--from', 'x1,x2,x3', '--max-terms', '2', '--max-complexity', '3'];
const SEARCH_VARIANTS: Record<string, Variant> = {
  maxTerms: { args: ['--max-terms', '1'] },
  powers: { args: ['--powers', '1..2'] },
  maxComplexity: { args: ['--max-complexity', '2'] },
  lattice: { args: ['--lattice', 'off'], with: ['--target', 'k'] },
  split: { args: ['--split', 'random:0.5,0.1,0.4'] },
  top: { args: ['--top', '2'] },
  seed: { args: ['--seed', '7'] },
  keepDuplicates: { args: ['--keep-duplicates'] },
  beam: { args: ['--beam', '2'] },
  maxExhaustive: { args: ['--max-exhaustive', '3'] },
  screenRows: { args: ['--screen-rows', '50'] },
  maxCells: { args: ['--max-cells', '10000'] },
};

const BOUND_BASE = ['bound', 't.csv', '--lhs', 'y', '--rhs', 'r'];
const BOUND_VARIANTS: Record<string, Variant> = {
  by: { args: ['--by', 'x1'] },
  bins: { args: ['--bins', '3'] },
  top: { args: ['--top', '2'] },
  id: { args: ['--id', 'c'] },
  skipInvalid: { args: ['--skip-invalid'], with: ['--rhs', 'x1 - 0.05'] },
  lower: { args: ['--lower'] },
  form: { args: ['--form', 'affine'] },
};

const DISCOVER_BASE = ['bound', 't.csv', '--lhs', 'y', '--from', 'r,x2'];
const DISCOVER_VARIANTS: Record<string, Variant> = {
  id: { args: ['--id', 'c'] },
  skipInvalid: { args: ['--skip-invalid'], with: ['--from', 'r,x2 - 0.05'] },
  lower: { args: ['--lower'] },
  maxExponent: { args: ['--max-exponent', '1'] },
  maxDenominator: { args: ['--max-denominator', '1'] },
  proposals: { args: ['--proposals', '1'] },
  top: { args: ['--top', '2'] },
  bins: { args: ['--bins', '3'] },
  seed: { args: ['--seed', '7'] },
  heldOut: { args: ['--held-out', '0.2'] },
  exceedances: { args: ['--exceedances', '30'] },
};

// residual: y = 2·x1 + x2 + noise, fitted on x1 alone; the rest ranked on what it leaves over
const RESIDUAL_BASE = ['residual', 't.csv', '--target', 'y', '--terms', 'x1', '--from', 'x2,x3,r', '--epochs', '3', '--seeds', '1', '--hidden', '4', '--probes', '0', '--resamples', '10', '--method', 'saliency', '--attribution-rows', '30'];
const RESIDUAL_VARIANTS: Record<string, Variant> = {
  intercept: { args: ['--no-intercept'] },
  from: { args: ['--from', 'x2,x3'] },
  absolute: { args: ['--no-absolute'] },
  maxTerms: { args: ['--max-terms', '2'], with: ['--columns', '3'] },
  powers: { args: ['--powers', '1..2'] },
  columns: { args: ['--columns', '1'] },
};

/** Replace the values of flags given in `w` (each flag followed by one value, or alone when boolean). */
function withFlags(base: string[], w: string[] = []): string[] {
  const out = [...base];
  for (let i = 0; i < w.length; i++) {
    const flag = w[i]!;
    const value = w[i + 1] !== undefined && !w[i + 1]!.startsWith('--') ? w[++i]! : undefined;
    const j = out.indexOf(flag);
    if (j >= 0 && value !== undefined) out[j + 1] = value;
    else out.push(flag, ...(value !== undefined ? [value] : []));
  }
  return out;
}

const RUNS: Array<[string, OptionTable, string[], Record<string, Variant>]> = [
  ['rank', RANK_OPTIONS, RANK_BASE, RANK_VARIANTS],
  ['fit', FIT_OPTIONS, FIT_BASE, FIT_VARIANTS],
  ['search', SEARCH_OPTIONS, SEARCH_BASE, SEARCH_VARIANTS],
  ['bound', BOUND_OPTIONS, BOUND_BASE, BOUND_VARIANTS],
  ['discover', DISCOVER_OPTIONS, DISCOVER_BASE, DISCOVER_VARIANTS],
  ['residual', RESIDUAL_OPTIONS, RESIDUAL_BASE, RESIDUAL_VARIANTS],
];

describe('every option changes the outcome, or its table says why not', () => {
  for (const [stage, table, base, variants] of RUNS) {
    it(`${stage}: a demonstration for every option that is not inert`, () => {
      for (const o of table) {
        if (o.inert) expect(variants[o.key], `${stage}.${o.key} is inert and also demonstrated`).toBeUndefined();
        else expect(variants[o.key], `${stage}.${o.key}: neither inert nor demonstrated`).toBeDefined();
      }
    });
    it(`${stage}: the same flags give the same outcome (so a difference below is the option's)`, async () => {
      const once = outcome(await json(base), stage);
      expect(once).not.toMatch(/^refused/);
      expect(outcome(await json(base), stage)).toBe(once);
    }, 120_000);
    for (const [key, v] of Object.entries(variants)) {
      it(`${stage}: ${v.args.join(' ')} changes the outcome`, async () => {
        const b = withFlags(base, v.with);
        const before = outcome(await json(b), stage);
        const after = outcome(await json(withFlags(b, v.args)), stage);
        expect(after, `${stage}.${key}`).not.toBe(before);
      }, 120_000);
    }
  }
});

describe('one failure, one code: a value below an option\'s range is option.badValue on the command line and in a configuration', () => {
  const BASES: Record<string, string[]> = { rank: RANK_BASE, fit: FIT_BASE, search: SEARCH_BASE, bound: BOUND_BASE, discover: DISCOVER_BASE, residual: RESIDUAL_BASE };
  for (const s of STAGES) {
    it(s.name, async () => {
      let checked = 0;
      for (const o of s.table) {
        if (o.type !== 'integer' || flagOf(o) === null || configKeyOf(o) === null) continue;
        checked++;
        const low = String(o.min - 1);
        const io = memoryIO(dir);
        expect(await runCli([...BASES[s.name]!, flagOf(o)!, low], io), `${s.name} ${flagOf(o)}`).toBe(2);
        expect(io.err, `${s.name} ${flagOf(o)}`).toMatch(new RegExp(`${flagOf(o)}.*\\[option\\.badValue\\]\\n$`));
        // the same in the configuration, at the option's key path (a block's list index included)
        const keyPath = [...s.path.filter((p) => typeof p === 'string'), ...configKeyOf(o)!.split('.')];
        const nest = (keys: string[], indent: string): string =>
          keys.length === 1 ? `${indent}${keys[0]}: ${low}\n` : `${indent}${keys[0]}:\n${nest(keys.slice(1), indent + '  ')}`;
        let yaml = `table: t.csv\ntarget: y\n`;
        if (s.path.length === 0) yaml += nest(keyPath, '');
        else {
          const item = s.yaml.split('\n').slice(1).filter(Boolean).join('\n');
          const list = typeof s.path[1] === 'number';
          yaml += `${s.path[0]}:\n${item}\n${list ? '    ' : '  '}${configKeyOf(o)}: ${low}\n`;
        }
        let e: unknown;
        try {
          parseConfig(yaml, 'cfg.yaml');
        } catch (x) {
          e = x;
        }
        expect((e as { code?: string })?.code, `${s.name}.${o.key}: ${yaml}`).toBe('option.badValue');
        expect((e as { details?: { option?: string } }).details?.option, `${s.name}.${o.key}`).toBe(o.key);
      }
      expect(checked).toBeGreaterThan(1);
    }, 120_000);
  }
});

describe('an inert option leaves the outcome as it is', () => {
  it('rank --workers 1 (training in a worker thread) gives the outcome of --workers 0', async () => {
    const here = outcome(await json([...RANK_BASE, '--workers', '0']), 'rank');
    expect(outcome(await json([...RANK_BASE, '--workers', '1']), 'rank')).toBe(here);
  }, 120_000);
  it('search --time 600 gives the outcome of the default budget when the budget is not reached', async () => {
    const r = await json([...SEARCH_BASE, '--time', '600']);
    expect((r.cuts as { time: boolean }).time).toBe(false);
    expect(outcome(r, 'search')).toBe(outcome(await json(SEARCH_BASE), 'search'));
  }, 120_000);
});

// ---------------------------------------------------------------------------------------------
// Tables of commands that make or look at tables outside a run (inspect, demo-data, knots): every
// option has a flag on its command, says why the configuration has no key, and changes what the
// command prints (or says in the table why not).

interface CommandTable {
  name: string;
  table: OptionTable;
  /** The command path (`knots`, `demo-data`) and the base arguments after it. */
  base: string[];
  variants: Record<string, Variant>;
}

const COMMAND_TABLES: CommandTable[] = [
  {
    name: 'inspect',
    table: INSPECT_OPTIONS,
    base: ['inspect', 't.csv', '--json', '--no-progress'],
    variants: { sampleRows: { args: ['--sample-rows', '50'] }, seed: { args: ['--seed', '7'], with: ['--sample-rows', '50'] } },
  },
  { name: 'demo-data', table: DEMO_DATA_OPTIONS, base: ['demo-data', '--no-progress'], variants: { seed: { args: ['--seed', '2'] } } },
  {
    name: 'knots',
    table: KNOTS_OPTIONS,
    // codes.csv: the trefoil's DT code 4 6 2 (read as a braid it is another link), its braid word 1 1 1
    base: ['knots', 'codes.csv', '--kind', 'braid', '--column', 'code', '--no-progress'],
    variants: {
      kind: { args: ['--kind', 'dt'] },
      column: { args: ['--column', 'alt'] },
      nameColumn: { args: ['--name-column', 'id'] },
      invariants: { args: ['--invariants', 'crossings'] },
      omega: { args: ['--omega', '0.25'] },
      prefix: { args: ['--prefix', 'k_'] },
    },
  },
];

/** What a command printed, or `refused: code`. */
async function printed(args: string[]): Promise<string> {
  const io = memoryIO(dir);
  const code = await runCli(args, io);
  if (code === 2) return `refused: ${/\[([\w.]+)\]\n$/.exec(io.err)?.[1]}`;
  expect(code, `${args.join(' ')}: ${io.err}`).toBe(0);
  return io.out;
}

describe('command-only tables: a flag each, no configuration key (and why), and each option changes what is printed', () => {
  beforeAll(() => {
    writeFileSync(join(dir, 'codes.csv'), 'name,code,alt,id\ntrefoil,4 6 2,1 1 1,k3a1\n');
  });
  const program = buildProgram(memoryIO());
  for (const c of COMMAND_TABLES) {
    it(`${c.name}: every option has a flag and says why it has no configuration key`, () => {
      const cmd = program.commands.find((x) => x.name() === c.base[0])!;
      for (const o of c.table) {
        const flag = flagOf(o)!;
        expect(cmd.options.some((x) => x.long === flag), `${c.name}.${o.key}: no ${flag}`).toBe(true);
        expect(configKeyOf(o) === null || o.configAbsent !== undefined, `${c.name}.${o.key}`).toBe(true);
        expect(o.configAbsent, `${c.name}.${o.key}: no reason for the missing configuration key`).toBeTruthy();
        if (o.inert) expect(c.variants[o.key], `${c.name}.${o.key} is inert and also demonstrated`).toBeUndefined();
        else expect(c.variants[o.key], `${c.name}.${o.key}: neither inert nor demonstrated`).toBeDefined();
      }
    });
    for (const [key, v] of Object.entries(c.variants)) {
      it(`${c.name}: ${v.args.join(' ')} changes what is printed`, async () => {
        const b = withFlags(c.base, v.with);
        const before = await printed(b);
        expect(before).not.toMatch(/^refused/);
        expect(await printed(withFlags(b, v.args)), `${c.name}.${key}`).not.toBe(before);
      }, 120_000);
    }
  }
});
