/**
 * `surmise residual TABLE --target EXPR --terms "EXPR; …" [--from a,b]`: fit the formula, rank the
 * remaining columns as predictors of what it leaves over (and of its absolute value) with the
 * network, baselines, methods and noise level of `rank`, and propose the next term. A thin shell
 * over residualRanking (src/run/residual.ts).
 */
import type { Command } from 'commander';
import type { CliIO } from './io.ts';
import { addTableOptions, readTableOptions } from './options.ts';
import { makeProgress } from './progress.ts';
import { withDerived } from '../table/expr/derive.ts';
import { toJson } from '../util/json.ts';
import { RANK_DEFAULTS, type RankResult } from '../attribute/rank.ts';
import { describeProbes } from '../attribute/probes.ts';
import { residualRanking, RESIDUAL_OPTIONS, type ResidualResult, type ResidualSpec } from '../run/residual.ts';
import { RANK_OPTIONS } from '../attribute/options.ts';
import { addReadFlags, parseReadFlags, readWithFlags, type ReadFlags } from './read-flags.ts';
import { rankingTable } from './rank.ts';
import { splitTerms } from './fit.ts';
import { parsePowers } from './search.ts';

interface ResidualCliOptions extends ReadFlags {
  target: string;
  terms: string;
  json?: boolean;
  progress: boolean;
  [table: string]: unknown;
}

/** The ranking options of `rank` that residual takes too (its columns come from --from). */
const RANK_KEYS = RANK_OPTIONS.map((o) => o.key).filter((k) => k !== 'features' && k !== 'exclude');


const f3 = (x: number | null | undefined) => (x === null || x === undefined || !Number.isFinite(x) ? 'n/a' : x.toFixed(3));

function rankingBlock(title: string, r: RankResult): string[] {
  const L = [`${title}: network R² ${f3(r.model.score)} on held-out rows (ridge ${f3(r.model.baselines.ridge.score)}, constant ${f3(r.model.baselines.constant.score)})`];
  if (r.model.score <= Math.max(r.model.baselines.ridge.score, r.model.baselines.constant.score)) L.push('  the network does not beat the baselines: little of it is predictable from these columns');
  L.push(...rankingTable(r.ranking, Math.round(r.interval.level * 100), r.noise?.reference));
  if (r.noise) L.push(`  noise level from ${describeProbes(r.noise.probes)}; ${r.ranking.filter((e) => e.aboveNoise).length} of ${r.ranking.length} columns above it`);
  return L;
}

/** The human-readable report of a residual ranking. */
export function formatResidual(r: ResidualResult, source: string): string {
  const L: string[] = [];
  const fitted = r.fit.terms.map((t) => `${t.coef.toPrecision(6)}${t.term === '1' ? '' : `·${t.term}`}`).join(' + ');
  L.push(`surmise residual: ${r.fit.target} ≈ ${fitted} on ${r.fit.n} rows of ${source} (R² ${r.fit.r2.toFixed(6)}, RMSE ${r.fit.rmse.toPrecision(4)})`);
  L.push(`what is left over, ${r.residualName} = ${r.fit.target} − fit, ranked against ${r.features.length} remaining column${r.features.length === 1 ? '' : 's'}: ${r.features.join(', ')}`);
  for (const n of r.notes) L.push(`note: ${n.text}`);
  L.push('', ...rankingBlock(`${r.residualName}`, r.ranking));
  if (r.absolute) L.push('', ...rankingBlock(`|${r.residualName}| (the size of the error, for bounds)`, r.absolute));
  L.push('');
  if (r.next?.proposal) {
    const p = r.next.proposal;
    L.push(`next term (search over ${r.next.from.join(', ')}; best by selection BIC): ${r.residualName} ≈ ${p.formula}`);
    p.terms.forEach((t, j) => L.push(`  ${t}: ${p.coefs[j]!.toPrecision(6)} [${p.low[j]!.toPrecision(4)}, ${p.high[j]!.toPrecision(4)}]`));
    L.push(`  held-out RMSE of the residual with it ${p.heldOutRmse.toPrecision(4)}, without it ≈ ${r.fit.rmse.toPrecision(4)} (the first fit's RMSE)`);
    L.push(`  try: surmise fit ${source} --target "${r.fit.target}" --terms "${r.next.nextTerms!.join('; ')}"`);
  } else L.push('next term: the search found no candidate');
  L.push('', 'These are statistical evidence about this table, not a proof.');
  return L.join('\n') + '\n';
}

export function registerResidual(program: Command, io: CliIO): void {
  const cmd = program
    .command('residual')
    .description('fit a formula, then rank the remaining columns by how well they predict what it leaves over (and its size), and propose the next term')
    .argument('<table>', 'the table file (.csv .tsv .tab .json .jsonl .ndjson)')
    .requiredOption('--target <expr>', 'expression the formula predicts, e.g. sig')
    .requiredOption('--terms <list>', 'the formula\'s terms separated by ";", e.g. "ux; uy^2"');
  addReadFlags(cmd);
  addTableOptions(cmd, RESIDUAL_OPTIONS);
  addTableOptions(cmd, RANK_OPTIONS, RANK_KEYS);
  cmd
    .option('--json', 'print one JSON object')
    .option('--no-progress', 'do not report progress on stderr')
    .action(async (file: string, o: ResidualCliOptions) => {
      const read = parseReadFlags(o);
      const own = readTableOptions(RESIDUAL_OPTIONS, o, { powers: parsePowers }) as Pick<ResidualSpec, 'intercept' | 'from' | 'absolute'> &
        NonNullable<ResidualSpec['search']>;
      const rank = readTableOptions(RANK_OPTIONS, o, {}, RANK_KEYS) as NonNullable<ResidualSpec['rank']>;
      const seed = rank.seed ?? RANK_DEFAULTS.seed;
      const terms = splitTerms(o.terms);
      const table = withDerived(await readWithFlags(io, file, read, o.progress), read.derive);
      const progress = makeProgress(io, 'residual', o.progress);
      let result: ResidualResult;
      try {
        result = await residualRanking(table, {
          target: o.target,
          terms,
          ...(own.intercept !== undefined ? { intercept: own.intercept } : {}),
          ...(own.from ? { from: own.from } : {}),
          ...(own.absolute !== undefined ? { absolute: own.absolute } : {}),
          rank,
          search: { maxTerms: own.maxTerms, powers: own.powers, columns: own.columns },
          seed,
          onProgress: (e) => progress.update(e.done, e.total, `${e.ranking}: ${e.message}`),
        });
      } finally {
        progress.stop();
      }
      io.stdout(o.json ? toJson({ source: file, ...result }, 2) + '\n' : formatResidual(result, file));
    });
}
