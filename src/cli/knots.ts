/**
 * `surmise knots FILE`: a table of invariants, one row per diagram; `surmise knots generate …`:
 * diagram files of random braids, twisted families and torus knots.
 */
import { existsSync } from 'node:fs';
import { writeFileAtomic } from '../util/atomic-write.ts';
import { resolve } from 'node:path';
import type { Command } from 'commander';
import { SurmiseError, didYouMean } from '../errors.ts';
import type { CliIO } from './io.ts';
import { makeProgress } from './progress.ts';
import { addTableOptions, parseIntOption, parsePositiveInt, readTableOptions } from './options.ts';
import { KNOTS_OPTIONS } from '../knots/options.ts';
import { defaultsOf } from '../util/option-table.ts';
import { readTable } from '../table/read.ts';
import { writeTable } from '../table/write.ts';
import { tableFromRecords } from '../table/columns.ts';
import { quoteField } from '../table/write.ts';
import { formatNumber } from '../table/cell.ts';
import type { Column, Table } from '../table/types.ts';
import { Rng, deriveSeed } from '../util/rng.ts';
import {
  exactOut,
  parseCode,
  randomBraid,
  randomKnotBraid,
  torusBraid,
  twistedBraid,
  addKink,
  analysePD,
  braidClosurePD,
  canonicalLabels,
  pdConnectedSum,
  MAX_CROSSINGS,
  MAX_STRANDS,
  type Braid,
  type Crossing,
  type DiagramKind,
  type InvariantName,
  type KnotInvariants,
} from '../knots/index.ts';
import { invariantColumns, readDiagramFile, tableRecord } from '../knots/batch.ts';
import { invariantsMany } from '../knots/many.ts';
import { gcd } from '../util/gcd.ts';
import { toJson } from '../util/json.ts';

const CONVENTIONS =
  'Conventions: PD crossings X[a,b,c,d] are read counter-clockwise from the incoming under-edge; a crossing is\n' +
  'positive (right-handed) when the over-strand runs d -> b; writhe = sum of signs. Braid generator i (sigma_i)\n' +
  'is a positive crossing, -i its inverse. Signature = sign(V + V^T) for a Seifert matrix V, so the\n' +
  'right-handed trefoil (braid "1 1 1") has signature -2. Alexander polynomial Conway-normalised:\n' +
  'Delta(t) = Delta(1/t), Delta(1) = 1 for knots; determinant = |Delta(-1)|.';

interface KnotsOptions {
  column?: string;
  nameColumn?: string;
  out?: string;
  join?: string;
  on?: string;
  prefix?: string;
  force?: boolean;
  json?: boolean;
  progress?: boolean;
}

/** The options of KNOTS_OPTIONS given on the command line (absent: the table's defaults), `--omega` adding levine_tristram. */
function knotsOptions(o: KnotsOptions): { kind?: DiagramKind; invariants: InvariantName[]; omega?: number; prefix: string; workers: number } {
  const given = { ...defaultsOf(KNOTS_OPTIONS), ...readTableOptions(KNOTS_OPTIONS, o as unknown as Record<string, unknown>) } as {
    kind: DiagramKind | null; invariants: InvariantName[]; omega: number | null; prefix: string | null; workers: number;
  };
  const invariants = [...given.invariants];
  if (given.omega !== null && !invariants.includes('levine_tristram')) invariants.push('levine_tristram');
  return {
    ...(given.kind !== null ? { kind: given.kind } : {}),
    invariants,
    ...(given.omega !== null ? { omega: given.omega } : {}),
    prefix: given.prefix ?? '',
    workers: given.workers,
  };
}

function cellOut(c: Column, i: number): string {
  if (c.missing[i]) return '';
  if (c.kind === 'label') return quoteField(c.values[i]!, ',');
  if (c.kind === 'complex') return `${formatNumber(c.re[i]!)}+${formatNumber(c.im[i]!)}j`;
  return formatNumber(c.values[i]!);
}

function csvText(t: Table): string {
  const lines = [t.columns.map((c) => quoteField(c.name, ',')).join(',')];
  for (let i = 0; i < t.nRows; i++) lines.push(t.columns.map((c) => cellOut(c, i)).join(','));
  return lines.join('\n') + '\n';
}

function jsonRow(name: string, r: KnotInvariants, inv: readonly InvariantName[]): Record<string, unknown> {
  const o: Record<string, unknown> = { name };
  for (const k of inv) {
    if (k === 'alexander') {
      // exact: numbers up to 2^53 − 1, decimal strings beyond
      o.alexander = r.alexander ? r.alexander.coefficients.map(exactOut) : null;
      o.alexander_lowest_exponent = r.alexander?.lowestExponent ?? null;
      o.alexander_text = r.alexanderText ?? null;
      o.alexander_sign_fixed = r.alexanderSignFixed ?? null;
    } else if (k === 'linking') o.linking = r.linking ?? [];
    else if (k === 'jumps') o.jumps = r.jumps ?? null;
    else if (k === 'unit_roots') o.unit_roots = r.unitRoots ?? null;
    else if (k === 'hyperbolic') {
      const h = r.hyperbolic;
      o.geometry = h?.geometry ?? null;
      o.geometry_reason = h?.reason ?? null;
      o.volume = h?.volume ?? null;
      o.cusp_shape = h?.cuspShape ?? null;
      o.natural_slope = h?.naturalSlope ?? null;
      o.cusp_volume = h?.maximalCusp?.volume ?? null;
      o.meridian_length = h?.maximalCusp?.meridianLength ?? null;
      o.longitude_length = h?.maximalCusp?.longitudeLength ?? null;
      o.tetrahedra = h?.tetrahedra ?? null;
    }
    else if (k === 'levine_tristram') {
      o.levine_tristram = r.levineTristram ?? null;
      o.omega = r.omega ?? null;
    } else o[k] = tableRecord(name, r, [k])[k];
  }
  return o;
}

async function runKnots(file: string, o: KnotsOptions, io: CliIO): Promise<void> {
  // options, checked once
  const { kind, invariants: inv, omega, prefix, workers } = knotsOptions(o);
  if ((o.join === undefined) !== (o.on === undefined)) throw new SurmiseError('knots.option', '--join TABLE and --on KEY go together');
  const path = resolve(io.cwd, file);
  const sources = await readDiagramFile(path, { column: o.column, nameColumn: o.nameColumn, displayName: file });
  if (sources.length === 0) throw new SurmiseError('knots.empty', `${file} holds no diagrams`);
  const slow = inv.includes('hyperbolic');
  // long batches: many diagrams, or long ones (a few hundred crossings and up), or the slow hyperbolic invariants; lines at most every 5 s on a pipe
  const long = sources.length >= 200 || sources.some((s) => s.code.length > 2000) || (slow && sources.length >= 20);
  const progress = makeProgress(io, 'knots', o.progress !== false && long);
  let results: KnotInvariants[];
  try {
    results = await invariantsMany(sources, file, kind, { invariants: inv, omega }, { workers, onProgress: (d, t) => progress.update(d, t) });
  } finally {
    progress.stop();
  }

  const records = sources.map((s, k) => tableRecord(s.name, results[k]!, inv));
  const kinds: Record<string, 'label' | 'integer' | 'real' | 'complex'> = { name: 'label' };
  for (const k of inv) kinds[k] = k === 'alexander' || k === 'linking' || k === 'jumps' || k === 'unit_roots' ? 'label' : k === 'levine_tristram' || k === 'genus_bound' ? 'real' : 'integer';
  if (inv.includes('hyperbolic')) {
    delete kinds.hyperbolic;
    Object.assign(kinds, { geometry: 'label', geometry_reason: 'label', volume: 'real', cusp_shape: 'complex', natural_slope: 'real', cusp_volume: 'real', meridian_length: 'real', longitude_length: 'real' });
  }
  const cols = invariantColumns(inv);
  // a determinant beyond 2^53 − 1 is a decimal string (exact); the column is then text so no digit is rounded
  if (records.some((r) => typeof r.determinant === 'string')) kinds.determinant = 'label';
  let table: Table;
  let unmatched: { diagrams: string[]; rows: string[] } | undefined;
  if (o.join !== undefined) {
    const census = await readTable(resolve(io.cwd, o.join), { displayName: o.join });
    const keyCol = census.columns.find((c) => c.name === o.on);
    if (!keyCol)
      throw new SurmiseError('knots.noColumn', `--on ${o.on}: ${o.join} has no column '${o.on}'${didYouMean(o.on!, census.columns.map((c) => c.name))}`);
    if (keyCol.kind === 'complex') throw new SurmiseError('knots.option', `--on ${o.on}: a complex column cannot be a key`);
    const newNames = cols.map((k) => prefix + k);
    for (const n of newNames)
      if (census.columns.some((c) => c.name === n))
        throw new SurmiseError('knots.columnExists', `${o.join} already has a column '${n}'; give --prefix to name the new columns differently`);
    const byName = new Map<string, number>();
    sources.forEach((s, k) => byName.set(s.name, k));
    const used = new Set<string>();
    const rowsUnmatched: string[] = [];
    const joined: Record<string, unknown>[] = [];
    for (let i = 0; i < census.nRows; i++) {
      const key = keyCol.missing[i] ? undefined : keyCol.kind === 'label' ? keyCol.values[i]! : String(keyCol.values[i]!);
      const k = key === undefined ? undefined : byName.get(key);
      const rec: Record<string, unknown> = {};
      for (const kk of cols) rec[prefix + kk] = k === undefined ? null : records[k]![kk];
      if (k === undefined) rowsUnmatched.push(key ?? `(empty key, line ${census.lines ? census.lines[i] : i + 2})`);
      else used.add(key!);
      joined.push(rec);
    }
    const diagramsUnmatched = sources.filter((s) => !used.has(s.name)).map((s) => s.name);
    unmatched = { diagrams: diagramsUnmatched, rows: rowsUnmatched };
    const pk: Record<string, 'label' | 'integer' | 'real' | 'complex'> = {};
    for (const k of cols) pk[prefix + k] = kinds[k]!;
    const added = tableFromRecords(joined, '(knots)', { kinds: pk, complexPairs: 'none' });
    table = { source: census.source, nRows: census.nRows, columns: [...census.columns, ...added.columns], lines: census.lines };
    const show = (xs: string[]): string => xs.slice(0, 5).join(', ') + (xs.length > 5 ? `, … (${xs.length - 5} more)` : '');
    if (rowsUnmatched.length > 0)
      io.stderr(`surmise knots: ${rowsUnmatched.length} row(s) of ${o.join} have no diagram in ${file} (their new cells are empty): ${show(rowsUnmatched)}\n`);
    if (diagramsUnmatched.length > 0)
      io.stderr(`surmise knots: ${diagramsUnmatched.length} diagram(s) of ${file} match no '${o.on}' in ${o.join} (not in the output): ${show(diagramsUnmatched)}\n`);
  } else {
    const recs = records.map((r) => {
      const x: Record<string, unknown> = {};
      for (const [k, v] of Object.entries(r)) x[k === 'name' ? 'name' : prefix + k] = v;
      return x;
    });
    const pk: Record<string, 'label' | 'integer' | 'real' | 'complex'> = {};
    for (const [k, v] of Object.entries(kinds)) pk[k === 'name' ? 'name' : prefix + k] = v;
    table = tableFromRecords(recs, file, { kinds: pk, complexPairs: 'none' });
  }
  if (o.out !== undefined) await writeTable(table, resolve(io.cwd, o.out), { force: o.force === true });
  if (o.json) {
    io.stdout(
      toJson({
        command: 'knots',
        file,
        diagrams: sources.length,
        invariants: inv,
        conventions: { signature: 'sign(V + V^T); right-handed trefoil -2', alexander: 'Conway-normalised, coefficients lowest power first' },
        out: o.out ?? null,
        join: o.join ? { table: o.join, on: o.on, unmatched } : null,
        rows: sources.map((s, k) => jsonRow(s.name, results[k]!, inv)),
      }) + '\n',
    );
  } else if (o.out === undefined) io.stdout(csvText(table));
  else io.stderr(`surmise knots: wrote ${table.nRows} rows to ${o.out}\n`);
}

/**
 * Ceilings of the generators' count options (a larger value is refused, `knots.tooLarge`): they keep
 * a file within memory and every diagram within what `surmise knots` reads (MAX_STRANDS strands,
 * MAX_CROSSINGS crossings). --twists and --q bound |value|.
 */
export const GENERATE_CEILINGS: Readonly<Record<string, { max: number; unit: string }>> = {
  '--count': { max: 1_000_000, unit: 'diagrams' },
  '--strands': { max: MAX_STRANDS, unit: 'strands' },
  '--length': { max: MAX_CROSSINGS, unit: 'letters' },
  '--summands': { max: 100, unit: 'summands' },
  '--kinks': { max: MAX_CROSSINGS, unit: 'kinks' },
  '--twists': { max: MAX_CROSSINGS, unit: 'full twists in absolute value' },
  '--p': { max: MAX_STRANDS, unit: 'strands' },
  '--q': { max: MAX_CROSSINGS, unit: 'in absolute value' },
};

function ceiling(name: string, v: number): number {
  const c = GENERATE_CEILINGS[name]!;
  if (Math.abs(v) > c.max) throw new SurmiseError('knots.tooLarge', `${name} ${v}: at most ${c.max} ${c.unit} (the ceiling of ${name})`);
  return v;
}

/** A generated diagram must be one that `surmise knots` reads. */
function generatedSize(crossings: number, what: string): void {
  if (crossings > MAX_CROSSINGS)
    throw new SurmiseError('knots.tooLarge', `${what} would have up to ${crossings} crossings; at most ${MAX_CROSSINGS} crossings are accepted`);
}

function parseRange(name: string, raw: string): [number, number] {
  const m = /^\s*(-?\d+)\s*(?:\.\.\s*(-?\d+)\s*)?$/.exec(raw);
  if (!m) throw new SurmiseError('knots.option', `${name} ${raw}: expected an integer or a range a..b`);
  const a = Number(m[1]);
  const b = m[2] === undefined ? a : Number(m[2]);
  if (GENERATE_CEILINGS[name]) for (const v of [a, b]) ceiling(name, v);
  if (b < a) throw new SurmiseError('knots.option', `${name} ${raw}: the range is empty (${a} > ${b})`);
  return [a, b];
}

function emit(lines: string[], out: string | undefined, force: boolean, io: CliIO, json: boolean, what: string): void {
  const text = lines.join('\n') + '\n';
  if (out !== undefined) {
    writeFileAtomic(resolve(io.cwd, out), text, { force, display: out, codePrefix: 'knots' });
    if (json) io.stdout(JSON.stringify({ command: `knots generate ${what}`, out, diagrams: lines.length }) + '\n');
    else io.stderr(`surmise knots generate: wrote ${lines.length} diagrams to ${out}\n`);
  } else if (json) io.stdout(JSON.stringify({ command: `knots generate ${what}`, out: null, diagrams: lines.map((l) => ({ name: l.split('\t')[0], code: l.split('\t')[1] })) }) + '\n');
  else io.stdout(text);
}


const braidText = (strands: number, word: number[]): string => `${strands}: ${word.join(' ')}`;

export function registerKnots(program: Command, io: CliIO): void {
  const knots = program
    .command('knots')
    .description('Invariants of knots and links from PD codes, braid words or DT codes, one table row per diagram')
    .argument('[file]', 'diagrams: lines "name<TAB>code", or a CSV/JSON table with a column of codes')
    .option('--out <table>', 'write the table (CSV/TSV/JSON by extension) instead of CSV on stdout')
    .option('--join <table>', 'add the new columns to this table, matching diagram names to --on')
    .option('--on <key>', 'key column of the --join table')
    .option('--force', 'replace an existing output file')
    .option('--json', 'print one JSON object (Alexander polynomials as coefficient lists, lowest power first)')
    .option('--no-progress', 'no progress on stderr');
  addTableOptions(knots, KNOTS_OPTIONS);
  knots
    .addHelpText('after', `\n${CONVENTIONS}\n\nCodes: PD [[1,5,2,4],[3,1,4,6],[5,3,6,2]] or X[1,5,2,4] X[3,1,4,6] X[5,3,6,2]; braid "1 -2 1 -2",\n"4: 1 2 3" (4 strands) or {"strands":4,"word":[1,2,3]}; DT[4,6,2] (or "4 6 2" with --kind dt).\nA DT code fixes a knot only up to mirror image.\n`)
    .action(async (file: string | undefined, o: KnotsOptions) => {
      if (file === undefined) throw new SurmiseError('knots.option', 'give a file of diagrams (surmise knots FILE), or a subcommand: generate');
      await runKnots(file, o, io);
    });

  const gen = knots.command('generate').description('write diagram files (name<TAB>code) for stress tests along families');
  gen
    .command('braid')
    .description('random braid words, each letter uniform on ±1..±(strands−1)')
    .requiredOption('--strands <n>', 'number of strands (≥ 2)')
    .requiredOption('--length <n>', 'letters per word')
    .option('--count <n>', 'number of words (at most 1000000)', '100')
    .option('--seed <n>', 'seed', '1')
    .action((_o: unknown, cmd: Command) => {
      // options shared by name with `knots` (--out, --force, --json) may be parsed by it: merge
      const o = cmd.optsWithGlobals() as { strands: string; length: string; count: string; seed: string; out?: string; force?: boolean; json?: boolean };
      const strands = ceiling('--strands', parsePositiveInt('--strands', o.strands));
      const length = ceiling('--length', parsePositiveInt('--length', o.length));
      const count = ceiling('--count', parsePositiveInt('--count', o.count));
      const seed = parseIntOption('--seed', o.seed);
      const rng = new Rng(deriveSeed(seed, 'knots', 'generate', 'braid'));
      const width = String(count).length;
      const lines: string[] = [];
      for (let k = 0; k < count; k++) {
        const b = randomBraid(rng, strands, length);
        lines.push(`braid_${String(k + 1).padStart(width, '0')}\t${braidText(b.strands, b.word)}`);
      }
      emit(lines, o.out, o.force === true, io, o.json === true, 'braid');
    });
  gen
    .command('pd')
    .description('random PD codes of knots: connected sums of closed random braids, with Reidemeister I kinks')
    .requiredOption('--strands <n>', 'strands of each random braid (≥ 2)')
    .requiredOption('--length <n>', 'letters of each random braid (its parity may be changed by one so the closure is a knot)')
    .option('--count <n>', 'number of codes (at most 1000000)', '100')
    .option('--summands <a..b>', 'number of connected summands', '1')
    .option('--kinks <a..b>', 'number of R1 kinks added', '0')
    .option('--seed <n>', 'seed', '1')
    .action((_o: unknown, cmd: Command) => {
      const o = cmd.optsWithGlobals() as { strands: string; length: string; count: string; summands: string; kinks: string; seed: string; out?: string; force?: boolean; json?: boolean };
      const strands = ceiling('--strands', parsePositiveInt('--strands', o.strands));
      const length = ceiling('--length', parsePositiveInt('--length', o.length));
      const count = ceiling('--count', parsePositiveInt('--count', o.count));
      const [s0, s1] = parseRange('--summands', o.summands);
      const [k0, k1] = parseRange('--kinks', o.kinks);
      generatedSize(s1 * (length + 1) + k1, `with --summands ${o.summands}, --length ${length} and --kinks ${o.kinks} a PD code`);
      if (s0 < 1) throw new SurmiseError('knots.option', `--summands ${o.summands}: at least 1`);
      if (k0 < 0) throw new SurmiseError('knots.option', `--kinks ${o.kinks}: at least 0`);
      if (strands < 2) throw new SurmiseError('knots.option', `--strands must be an integer ≥ 2, got ${strands}`);
      const seed = parseIntOption('--seed', o.seed);
      const rng = new Rng(deriveSeed(seed, 'knots', 'generate', 'pd'));
      const width = String(count).length;
      const lines: string[] = [];
      for (let k = 0; k < count; k++) {
        const summands = s0 + rng.int(s1 - s0 + 1);
        let pd: Crossing[] | undefined;
        for (let j = 0; j < summands; j++) {
          const piece = braidClosurePD(randomKnotBraid(rng, strands, length)).pd;
          pd = pd === undefined ? piece : pdConnectedSum(pd, piece, pd[rng.int(pd.length)]![rng.int(4)]!, piece[rng.int(piece.length)]![rng.int(4)]!);
        }
        const kinks = k0 + rng.int(k1 - k0 + 1);
        for (let j = 0; j < kinks; j++) pd = addKink(pd!, pd![rng.int(pd!.length)]![rng.int(4)]!, rng.int(4));
        lines.push(`pd_${String(k + 1).padStart(width, '0')}\t${JSON.stringify(canonicalLabels(analysePD(pd!)))}`);
      }
      emit(lines, o.out, o.force === true, io, o.json === true, 'pd');
    });
  gen
    .command('twist')
    .description('a braid followed by q full twists on strands i..j, for q in a range')
    .requiredOption('--braid <word>', 'the braid word, e.g. "1 -2 1 -2"')
    .option('--strands <n>', 'number of strands (default: max |generator| + 1)')
    .option('--on <i..j>', 'strands that get the full twists, e.g. 1..2 (required)')
    .requiredOption('--twists <a..b>', 'numbers of full twists, e.g. 0..20 (negative: left-handed)')
    .option('--name <prefix>', 'name prefix', 'twist')
    .action((_o: unknown, cmd: Command) => {
      const o = cmd.optsWithGlobals() as { braid: string; strands?: string; on?: string; twists: string; name: string; out?: string; force?: boolean; json?: boolean };
      if (o.on === undefined) throw new SurmiseError('knots.option', "required option '--on <i..j>' not specified (the strands that get the full twists, e.g. 1..2)");
      const parsed = parseCode(o.strands !== undefined ? `${parsePositiveInt('--strands', o.strands)}: ${o.braid}` : o.braid, 'braid');
      if (parsed.kind !== 'braid') throw new SurmiseError('knots.option', '--braid must be a braid word');
      const [i, j] = parseRange('--on', o.on);
      const [q0, q1] = parseRange('--twists', o.twists);
      const perTwist = (j - i + 1) * (j - i);
      generatedSize(parsed.braid.word.length + Math.max(Math.abs(q0), Math.abs(q1)) * perTwist, `with --twists ${o.twists} on ${i}..${j} the braid`);
      const lines: string[] = [];
      for (let q = q0; q <= q1; q++) {
        const b = twistedBraid(parsed.braid, i, j, q);
        lines.push(`${o.name}_q${q}\t${braidText(b.strands, b.word)}`);
      }
      emit(lines, o.out, o.force === true, io, o.json === true, 'twist');
    });
  gen
    .command('torus')
    .description('torus knots and links T(p, q) as closed braids (σ1…σ_{p−1})^q')
    .requiredOption('--p <a..b>', 'range of p (strands, ≥ 2)')
    .requiredOption('--q <a..b>', 'range of q')
    .option('--coprime', 'only coprime p, q (knots)')
    .action((_o: unknown, cmd: Command) => {
      const o = cmd.optsWithGlobals() as { p: string; q: string; coprime?: boolean; out?: string; force?: boolean; json?: boolean };
      const [p0, p1] = parseRange('--p', o.p);
      const [q0, q1] = parseRange('--q', o.q);
      generatedSize((p1 - 1) * Math.max(Math.abs(q0), Math.abs(q1)), `with --p ${o.p} and --q ${o.q} the braid of T(p, q)`);
      const lines: string[] = [];
      for (let p = p0; p <= p1; p++)
        for (let q = q0; q <= q1; q++) {
          if (q === 0 || (o.coprime && gcd(p, q) !== 1)) continue;
          const b = torusBraid(p, q);
          lines.push(`T(${p},${q})\t${braidText(b.strands, b.word)}`);
        }
      if (lines.length === 0) throw new SurmiseError('knots.option', 'no (p, q) in the ranges');
      emit(lines, o.out, o.force === true, io, o.json === true, 'torus');
    });
  // every generator writes a diagram file the same way (--out, --force, --json)
  for (const c of gen.commands) {
    c.option('--out <file>', 'diagram file to write (default: stdout)')
      .option('--force', 'replace an existing file')
      .option('--json', 'print one JSON object');
  }
  // nested commands report through the same IO and never exit the process
  for (const c of [gen, ...gen.commands]) {
    c.exitOverride();
    c.configureOutput({ writeOut: (s) => io.stdout(s), writeErr: (s) => io.stderr(s) });
  }
}
