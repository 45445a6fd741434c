/**
 * `surmise rank TABLE --target COL`: which inputs predict the target. A thin shell over
 * rankFeatures (src/attribute/rank.ts): parse and check the options, read the table, report
 * progress on stderr, print the model's held-out skill beside the baselines, the row report and
 * the ranking with intervals (or one JSON object with --json), and optionally write rank.json.
 */
import type { Command } from 'commander';
import { existsSync, mkdirSync } from 'node:fs';
import { join, resolve } from 'node:path';
import type { CliIO } from './io.ts';
import { SurmiseError, didYouMean } from '../errors.ts';
import { readTable, TABLE_FORMATS, type TableFormat } from '../table/read.ts';
import { formatDropReport } from '../table/dataset.ts';
import { rankFeatures, RANK_DEFAULTS, type RankResult, type RankEntry } from '../attribute/rank.ts';
import { ATTRIBUTION_METHODS, type AttributionMethod } from '../attribute/types.ts';
import { describeProbes } from '../attribute/probes.ts';
import { collect, parseEngine, parseNonNegativeInt, parsePositiveInt, parseIntOption, rangeHelp } from './options.ts';
import { RANK_LIMITS } from '../attribute/options.ts';
import { tooLarge } from '../util/integer.ts';
import { makeProgress } from './progress.ts';
import { writeFileAtomic } from '../util/atomic-write.ts';
import { toJson } from '../util/json.ts';
import { parseDerive } from '../table/expr/derive.ts';

interface RankCliOptions {
  target: string;
  engine: string;
  features?: string;
  exclude?: string;
  derive: string[];
  group: string[];
  method: string;
  seeds: string;
  folds: string;
  split?: string;
  task?: string;
  hidden: string;
  epochs: string;
  activation: string;
  loss: string;
  patience: string;
  batchSize?: string;
  learningRate: string;
  seed: string;
  dropTop: string;
  workers: string;
  permutationLoss: string;
  probes: string;
  format?: string;
  json?: boolean;
  out?: string;
  force?: boolean;
  progress: boolean;
}

/** "a, b,c" → ['a', 'b', 'c']; an empty entry is refused naming the option. */
export function parseNameList(option: string, raw: string): string[] {
  const parts = raw.split(',').map((s) => s.trim());
  if (parts.some((s) => s === '')) throw new SurmiseError('option.badList', `${option} ${raw}: expected comma-separated names with none empty`);
  return parts;
}

/** --method: one of the methods, `all`, or a comma list of methods. */
export function parseMethods(raw: string): AttributionMethod[] {
  const parts = parseNameList('--method', raw);
  if (parts.length === 1 && parts[0] === 'all') return [...ATTRIBUTION_METHODS];
  for (const m of parts) {
    if (!ATTRIBUTION_METHODS.includes(m as AttributionMethod)) {
      throw new SurmiseError(
        'option.badMethod',
        `--method ${raw}: '${m}' is not an attribution method; expected ${ATTRIBUTION_METHODS.join(', ')} or all${didYouMean(m, [...ATTRIBUTION_METHODS, 'all'])}`,
      );
    }
  }
  return [...new Set(parts)] as AttributionMethod[];
}

/** --group NAME=a,b (repeatable) → { NAME: [a, b] }. */
export function parseGroups(specs: string[]): Record<string, string[]> {
  const out: Record<string, string[]> = {};
  for (const s of specs) {
    const eq = s.indexOf('=');
    const name = eq < 0 ? '' : s.slice(0, eq).trim();
    if (name === '' || eq === s.length - 1) throw new SurmiseError('option.badGroup', `--group ${s}: expected NAME=FEATURE,FEATURE,…, e.g. --group pair=za,zb`);
    if (out[name]) throw new SurmiseError('option.badGroup', `--group ${s}: group '${name}' is declared twice`);
    out[name] = parseNameList(`--group ${name}=`, s.slice(eq + 1));
  }
  return out;
}

function parseChoice<T extends string>(flag: string, raw: string, choices: readonly T[]): T {
  if (!(choices as readonly string[]).includes(raw)) {
    throw new SurmiseError('option.badChoice', `${flag} ${raw}: expected ${choices.join(' or ')}${didYouMean(raw, choices)}`);
  }
  return raw as T;
}

function parseLearningRate(raw: string): number {
  const v = Number(raw);
  if (raw.trim() === '' || !Number.isFinite(v) || v <= 0 || v > 10) {
    throw new SurmiseError('option.badNumber', `expected --learning-rate to be a number in (0, 10], got '${raw}'`);
  }
  return v;
}

export function parseHidden(raw: string): number[] {
  if (raw.trim() === '' || raw.trim() === 'none') return [];
  const widths = raw.split(',').map((s) => parsePositiveInt('--hidden (each layer width)', s.trim(), RANK_LIMITS.hiddenWidth.max));
  if (widths.length > RANK_LIMITS.hiddenLayers.max) throw tooLarge('--hidden', widths.length, RANK_LIMITS.hiddenLayers, '--hidden (number of layers)');
  return widths;
}

const fmt = (x: number | null | undefined, digits = 3): string =>
  x === null || x === undefined || Number.isNaN(x) ? 'n/a' : Number.isFinite(x) ? x.toFixed(digits) : String(x);

function bar(score: number, max: number, width = 30): string {
  if (!(max > 0) || !(score > 0)) return '';
  return '█'.repeat(Math.max(1, Math.round((score / max) * width)));
}

/**
 * The ranking as aligned text. With a noise reference, each row says whether its interval lies
 * above it, and a line marks where the shares fall below the reference.
 */
export function rankingTable(rows: RankEntry[], levelPct: number, noiseRef?: number): string[] {
  const w = Math.max(7, ...rows.map((r) => r.feature.length));
  const max = Math.max(0, ...rows.map((r) => r.score));
  const noise = noiseRef !== undefined && Number.isFinite(noiseRef);
  const lines = [`  ${'#'.padStart(3)}  ${'feature'.padEnd(w)}  ${'share'.padStart(6)}  ${`${levelPct}% interval`.padEnd(17)}${noise ? '  vs noise' : ''}`];
  let lineDrawn = false;
  rows.forEach((r, i) => {
    if (noise && !lineDrawn && r.score <= noiseRef!) {
      lines.push(`  ${'-'.repeat(3)}  noise level ${fmt(noiseRef)} (probes' upper reference) ${'-'.repeat(12)}`);
      lineDrawn = true;
    }
    const iv = `[${fmt(r.low)}, ${fmt(r.high)}]`;
    const vs = noise ? `  ${(r.aboveNoise ? 'above' : 'at noise').padEnd(8)}` : '';
    lines.push(`  ${String(i + 1).padStart(3)}  ${r.feature.padEnd(w)}  ${fmt(r.score).padStart(6)}  ${iv.padEnd(17)}${vs}  ${bar(r.score, max)}`.trimEnd());
  });
  if (noise && !lineDrawn) lines.push(`  ${'-'.repeat(3)}  noise level ${fmt(noiseRef)} (probes' upper reference) ${'-'.repeat(12)}`);
  return lines;
}



/** The human-readable report of a ranking. */
export function formatRank(r: RankResult, source: string): string {
  const metricName = r.model.metric === 'r2' ? 'R²' : 'accuracy';
  const L: string[] = [];
  L.push(`surmise rank: ${r.target} (${r.task}) from ${r.groups.length} feature groups of ${source}`);
  L.push(`rows: ${formatDropReport(r.rows)}`);
  const constant = [...new Set(r.repeats.flatMap((q) => q.constantFeatures))];
  if (constant.length) L.push(`left out of some repeats as constant on their training rows: ${constant.join(', ')}`);
  L.push(
    `split: ${r.split}; ${r.repeats.length} repeat${r.repeats.length === 1 ? '' : 's'} (${r.seeds.length} seed${r.seeds.length === 1 ? '' : 's'}${r.folds >= 2 ? ` × ${r.folds} folds` : ''}), ` +
      `${r.repeats[0]?.train ?? 0} train / ${r.repeats[0]?.validation ?? 0} validation / ${r.repeats[0]?.test ?? 0} held-out rows in the first`,
  );
  L.push('');
  const sec = r.model.secondary;
  const secName = sec ? (sec.metric === 'rmse' ? 'RMSE' : 'balanced accuracy') : '';
  const also = (s: { secondary?: { score: number } }) => (sec && s.secondary ? `   ${secName} ${fmt(s.secondary.score)}` : '');
  L.push(`held-out ${metricName}${sec ? ` and ${secName}` : ''} (mean over repeats):`);
  L.push(`  network ${r.model.hidden.join('×') || 'linear'} (${r.model.engine} engine)   ${fmt(r.model.score)}${also(r.model)}   (per repeat ${r.model.perRepeat.map((v) => fmt(v)).join(', ')})`);
  L.push(`  ridge baseline       ${fmt(r.model.baselines.ridge.score)}${also(r.model.baselines.ridge)}`);
  L.push(`  constant baseline    ${fmt(r.model.baselines.constant.score)}${also(r.model.baselines.constant)}`);
  if (r.model.roundedExact) {
    const ex = (s: { roundedExact?: { score: number } }) => (s.roundedExact ? fmt(s.roundedExact.score) : 'n/a');
    L.push(`  integer target: rounded prediction exactly right on ${ex(r.model)} of held-out rows (ridge ${ex(r.model.baselines.ridge)}, constant ${ex(r.model.baselines.constant)})`);
  }
  if (r.model.score <= Math.max(r.model.baselines.ridge.score, r.model.baselines.constant.score)) {
    L.push('  the network does not beat the baselines: the ranking below explains little');
  }
  L.push('');
  const methods = Object.keys(r.methods);
  const levelPct = Math.round(r.interval.level * 100);
  L.push(
    r.rankingMethod === 'consensus'
      ? `ranking: consensus of ${methods.join(', ')} (each repeat's shares averaged over the methods)`
      : `ranking: ${r.rankingMethod}`,
  );
  L.push(`  share = fraction of the total attribution; ${levelPct}% bootstrap interval over ${r.interval.resamples} resamples of repeats${r.interval.resampledRows ? ' and held-out rows' : ''}`);
  L.push(...rankingTable(r.ranking, levelPct, r.noise?.reference));
  if (r.noise) {
    const above = r.ranking.filter((e) => e.aboveNoise).length;
    L.push(`  noise level: ${describeProbes(r.noise.probes)} trained and attributed in every repeat; the largest probe upper interval end is ${fmt(r.noise.reference)}.`);
    L.push(`  ${above} of ${r.ranking.length} quantities have their whole interval above it; the rest are indistinguishable from noise here. Probes are not ranked.`);
  }
  L.push('');
  L.push(`rank stability (mean Kendall τ-b between repeats): ${fmt(r.kendallTau, 2)}${r.kendallTau === null ? ' (needs 2 repeats)' : ''}`);
  if (methods.length > 1) {
    for (const [m, v] of Object.entries(r.methods)) {
      L.push(`  ${m.padEnd(12)} τ-b ${fmt(v!.kendallTau, 2).padStart(5)}   top: ${v!.ranking.slice(0, 5).map((e) => e.feature).join(' > ')}`);
    }
  }
  if (r.completeness?.length) {
    const rel = r.completeness.map((c) => c.meanAbsGap / c.meanAbsDelta);
    const relMax = r.completeness.map((c) => c.maxAbsGap / c.meanAbsDelta);
    L.push(`integrated gradients completeness: mean |Σ attributions − (f(x) − f(baseline))| is ${rel.map((v) => `${(100 * v).toFixed(2)}%`).join(', ')} of mean |f(x) − f(baseline)| per repeat; largest gap on one row ${relMax.map((v) => `${(100 * v).toFixed(1)}%`).join(', ')}`);
    if (relMax.some((v) => v > 0.1)) L.push('  integration error on some rows: the largest gap exceeds 10% of mean |f(x) − f(baseline)|; the attributions of those rows do not add up exactly');
  }
  if (r.ablation) {
    const a = r.ablation;
    L.push('');
    L.push(`without ${a.dropped.join(', ')} (retrained on ${a.features.length} features):`);
    L.push(`  network ${fmt(a.model.score)} (with them ${fmt(a.full.score)}), ridge ${fmt(a.ridge.score)}, constant ${fmt(a.constant.score)}`);
    L.push(
      a.model.score > Math.max(a.ridge.score, a.constant.score)
        ? '  skill remains beyond the baselines: look for weaker second-order signals in the rest'
        : '  little skill remains beyond the baselines',
    );
  }
  L.push('');
  L.push('These are statistical evidence about this table, not a proof.');
  return L.join('\n') + '\n';
}

export function registerRank(program: Command, io: CliIO): void {
  program
    .command('rank')
    .description('rank the features of a table as predictors of a target: network skill against baselines, attribution with intervals')
    .argument('<table>', 'the table file (.csv .tsv .tab .json .jsonl .ndjson)')
    .requiredOption('--target <col>', 'the column (or expression) to predict, e.g. sig')
    .option('--features <a,b,c>', 'use only these features (default: every numeric column but the target)')
    .option('--exclude <a,b>', 'leave these columns out of the features')
    .option('--derive <name=expr>', 'add a computed column first (repeatable), e.g. ratio=re(zb/za)', collect, [])
    .option('--group <name=a,b>', 'score these features as one group (repeatable); a complex column is always one group', collect, [])
    .option('--method <m>', `attribution method: ${ATTRIBUTION_METHODS.join('|')}|all, or a comma list`, 'all')
    .option('--seeds <n>', `networks per split${rangeHelp(RANK_LIMITS.seeds)}`, String(RANK_DEFAULTS.seeds))
    .option('--folds <k>', `0 = one random split per seed; k ≥ 2 = k-fold cross-validation (at most ${RANK_LIMITS.folds.max})`, String(RANK_DEFAULTS.folds))
    .option('--split <spec>', 'random | random:TRAIN,VALIDATION,TEST | kfold:K | where:CONDITION (condition true = training side)')
    .option('--task <task>', 'regression | classification (default: chosen from the target)')
    .option('--hidden <widths>', `hidden layer widths (at most ${RANK_LIMITS.hiddenLayers.max} layers of width ${RANK_LIMITS.hiddenWidth.max})`, RANK_DEFAULTS.hidden.join(','))
    .option('--epochs <n>', `most training epochs (early stopping on the validation rows)${rangeHelp(RANK_LIMITS.epochs)}`, String(RANK_DEFAULTS.epochs))
    .option('--activation <f>', 'hidden-layer activation: relu | gelu', RANK_DEFAULTS.activation)
    .option('--loss <loss>', 'regression loss: mse | huber', RANK_DEFAULTS.loss)
    .option('--patience <n>', `epochs without improvement on the validation rows before stopping${rangeHelp(RANK_LIMITS.patience)}`, String(RANK_DEFAULTS.patience))
    .option('--batch-size <n>', `mini-batch size${rangeHelp(RANK_LIMITS.batchSize)} (default: chosen from the training rows)`)
    .option('--learning-rate <x>', 'Adam learning rate', String(RANK_DEFAULTS.learningRate))
    .option('--seed <s>', 'the seed every other seed is derived from', String(RANK_DEFAULTS.seed))
    .option('--drop-top <k>', `also retrain without the k best groups and report the skill left${rangeHelp(RANK_LIMITS.dropTop)}`, '0')
    .option('--permutation-loss <loss>', 'classification loss for permutation importance: error (drop in accuracy) | cross-entropy', 'error')
    .option('--workers <n>', `worker threads for training (0 = train in this thread)${rangeHelp(RANK_LIMITS.workers)}`, String(RANK_DEFAULTS.workers))
    .option('--probes <n>', `noise probes per repeat: half permuted copies of features, half Gaussian columns; 0 = none${rangeHelp(RANK_LIMITS.probes)}`, String(RANK_DEFAULTS.probes))
    .option('--engine <engine>', 'network engine: auto (native when it loads) | native | tfjs', 'auto')
    .option('--format <format>', `read the file as ${TABLE_FORMATS.join(', ')} whatever its extension`)
    .option('--json', 'print one JSON object instead of the text report')
    .option('--out <dir>', 'also write rank.json into this folder')
    .option('--force', 'replace an existing rank.json in --out')
    .option('--no-progress', 'do not report progress on stderr')
    .action(async (file: string, o: RankCliOptions) => {
      // every option checked here, before any work
      if (o.format !== undefined && !TABLE_FORMATS.includes(o.format as TableFormat)) {
        throw new SurmiseError('cli.badFormat', `--format ${o.format}: expected one of ${TABLE_FORMATS.join(', ')}${didYouMean(o.format, TABLE_FORMATS)}`);
      }
      if (o.task !== undefined && o.task !== 'regression' && o.task !== 'classification') {
        throw new SurmiseError('option.badTask', `--task ${o.task}: expected regression or classification${didYouMean(o.task, ['regression', 'classification'])}`);
      }
      if (o.permutationLoss !== 'error' && o.permutationLoss !== 'cross-entropy') {
        throw new SurmiseError('option.badLoss', `--permutation-loss ${o.permutationLoss}: expected error or cross-entropy${didYouMean(o.permutationLoss, ['error', 'cross-entropy'])}`);
      }
      const folds = parseNonNegativeInt('--folds', o.folds, RANK_LIMITS.folds.max);
      if (folds === 1) throw new SurmiseError('option.badInteger', 'expected --folds to be 0 (one random split) or at least 2, got 1');
      const seed = parseIntOption('--seed', o.seed);
      if (seed < 0 || seed > 0xffffffff) throw new SurmiseError('option.badInteger', `expected --seed to be an integer in [0, 4294967295], got ${o.seed}`);
      const options = {
        target: o.target,
        ...(o.features !== undefined ? { features: parseNameList('--features', o.features) } : {}),
        ...(o.exclude !== undefined ? { exclude: parseNameList('--exclude', o.exclude) } : {}),
        derive: o.derive.map((d) => parseDerive(d)),
        ...(o.group.length ? { groups: parseGroups(o.group) } : {}),
        methods: parseMethods(o.method),
        seeds: parsePositiveInt('--seeds', o.seeds, RANK_LIMITS.seeds.max),
        folds,
        ...(o.split !== undefined ? { split: o.split } : {}),
        ...(o.task !== undefined ? { task: o.task as 'regression' | 'classification' } : {}),
        hidden: parseHidden(o.hidden),
        epochs: parsePositiveInt('--epochs', o.epochs, RANK_LIMITS.epochs.max),
        activation: parseChoice('--activation', o.activation, ['relu', 'gelu'] as const),
        loss: parseChoice('--loss', o.loss, ['mse', 'huber'] as const),
        patience: parseNonNegativeInt('--patience', o.patience, RANK_LIMITS.patience.max),
        ...(o.batchSize !== undefined ? { batchSize: parsePositiveInt('--batch-size', o.batchSize, RANK_LIMITS.batchSize.max) } : {}),
        learningRate: parseLearningRate(o.learningRate),
        seed,
        dropTop: parseNonNegativeInt('--drop-top', o.dropTop, RANK_LIMITS.dropTop.max),
        workers: parseNonNegativeInt('--workers', o.workers, RANK_LIMITS.workers.max),
        probes: parseProbes(o.probes),
        engine: parseEngine(o.engine),
        permutationLoss: o.permutationLoss as 'error' | 'cross-entropy',
      };
      let outFile: string | undefined;
      if (o.out !== undefined) {
        const dir = resolve(io.cwd, o.out);
        try {
          mkdirSync(dir, { recursive: true });
        } catch (e) {
          throw new SurmiseError('output.unwritable', `--out ${o.out}: cannot create the folder: ${(e as Error).message}`);
        }
        outFile = join(dir, 'rank.json');
        // refuse before the work, not after it
        writeFileAtomicCheck(outFile, o.out, Boolean(o.force));
      }
      const table = await readTable(resolve(io.cwd, file), { displayName: file, ...(o.format ? { format: o.format as TableFormat } : {}) });
      const progress = makeProgress(io, 'rank', o.progress);
      let result: RankResult;
      try {
        result = await rankFeatures(table, { ...options, onProgress: (e) => progress.update(e.done, e.total, e.message) });
      } finally {
        progress.stop();
      }
      const json = toJson({ source: file, ...result });
      if (outFile) writeFileAtomic(outFile, json + '\n', { force: Boolean(o.force) });
      if (o.json) io.stdout(json + '\n');
      else io.stdout(formatRank(result, file) + (outFile ? `wrote ${join(o.out!, 'rank.json')}\n` : ''));
    });
}

/** --probes: an integer in RANK_LIMITS.probes. */
export function parseProbes(raw: string): number {
  return parseNonNegativeInt('--probes', raw, RANK_LIMITS.probes.max);
}

/** Refuse an existing rank.json without --force before any work is done (the final write checks again). */
function writeFileAtomicCheck(path: string, shown: string, force: boolean): void {
  if (!force && existsSync(path)) {
    throw new SurmiseError('output.exists', `${join(shown, 'rank.json')} already exists; pass --force to replace it`);
  }
}
