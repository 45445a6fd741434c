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
import { SurmiseError } from '../errors.ts';
import { formatDropReport } from '../table/dataset.ts';
import { rankFeatures, type RankOptions, type RankResult, type RankEntry } from '../attribute/rank.ts';
import type { AttributionMethod } from '../attribute/types.ts';
import { describeProbes } from '../attribute/probes.ts';
import { addTableOptions, collect, parseTableOption, readTableOptions } from './options.ts';
import { RANK_OPTIONS } from '../attribute/options.ts';
import { optionOf } from '../util/option-table.ts';
import { addReadFlags, parseReadFlags, readWithFlags, type ReadFlags } from './read-flags.ts';
import { makeProgress } from './progress.ts';
import { writeFileAtomic } from '../util/atomic-write.ts';
import { toJson } from '../util/json.ts';

interface RankCliOptions extends ReadFlags {
  target: string;
  group: string[];
  json?: boolean;
  out?: string;
  force?: boolean;
  progress: boolean;
  [table: string]: unknown;
}

/** "a, b,c" → ['a', 'b', 'c']; an empty entry is refused naming the option. */
export function parseNameList(option: string, raw: string): string[] {
  const parts = raw.split(',').map((s) => s.trim());
  if (parts.some((s) => s === '')) throw new SurmiseError('option.badList', `${option} ${raw}: expected comma-separated names with none empty`);
  return parts;
}

/** --method: one of the methods, `all`, or a comma list of methods (RANK_OPTIONS.methods). */
export function parseMethods(raw: string): AttributionMethod[] {
  return parseTableOption(optionOf(RANK_OPTIONS, 'methods'), raw) as AttributionMethod[];
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

/** --hidden: layer widths, or none (RANK_OPTIONS.hidden). */
export function parseHidden(raw: string): number[] {
  return parseTableOption(optionOf(RANK_OPTIONS, 'hidden'), raw) as number[];
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
  const cmd = program
    .command('rank')
    .description('rank the features of a table as predictors of a target: network skill against baselines, attribution with intervals')
    .argument('<table>', 'the table file (.csv .tsv .tab .json .jsonl .ndjson)')
    .requiredOption('--target <col>', 'the column (or expression) to predict, e.g. sig')
    .option('--group <name=a,b>', 'score these features as one group (repeatable); a complex column is always one group', collect, []);
  addReadFlags(cmd);
  addTableOptions(cmd, RANK_OPTIONS);
  cmd
    .option('--json', 'print one JSON object instead of the text report')
    .option('--out <dir>', 'also write rank.json into this folder')
    .option('--force', 'replace an existing rank.json in --out')
    .option('--no-progress', 'do not report progress on stderr')
    .action(async (file: string, o: RankCliOptions) => {
      // every option checked here, before any work
      const read = parseReadFlags(o);
      const options = {
        target: o.target,
        derive: read.derive,
        ...(o.group.length ? { groups: parseGroups(o.group) } : {}),
        ...(readTableOptions(RANK_OPTIONS, o) as Omit<RankOptions, 'target'>),
      };
      if (options.folds === 1) throw new SurmiseError('option.badValue', 'expected --folds to be 0 (one random split) or at least 2, got 1', { option: 'folds' });
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
      const table = await readWithFlags(io, file, read, o.progress);
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

/** --probes: an integer in RANK_OPTIONS.probes. */
export function parseProbes(raw: string): number {
  return parseTableOption(optionOf(RANK_OPTIONS, 'probes'), raw) as number;
}

/** Refuse an existing rank.json without --force before any work is done (the final write checks again). */
function writeFileAtomicCheck(path: string, shown: string, force: boolean): void {
  if (!force && existsSync(path)) {
    throw new SurmiseError('output.exists', `${join(shown, 'rank.json')} already exists; pass --force to replace it`, { option: 'force' });
  }
}
