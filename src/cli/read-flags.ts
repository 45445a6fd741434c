/**
 * The reading flags every table command shares — `--derive`, `--kind`, `--complex-pairs`,
 * `--format` — declared once, checked once before any work, and the table read with them.
 * They are the command-line form of readTable's options and withDerived's derived columns (the
 * run configuration's `derive`, `kinds`, `complexPairs`, `format` keys).
 */
import { Option, type Command } from 'commander';
import { resolve } from 'node:path';
import { SurmiseError, didYouMean } from '../errors.ts';
import { COLUMN_KINDS } from '../table/columns.ts';
import type { ComplexPairs } from '../table/columns.ts';
import { parseComplexPairsOption } from '../table/complex-pairs.ts';
import { parseDerive, type DeriveSpec } from '../table/expr/index.ts';
import { readTable, TABLE_FORMATS, type TableFormat } from '../table/read.ts';
import type { ColumnKind, Table } from '../table/types.ts';
import type { CliIO } from './io.ts';
import { collect } from './options.ts';
import { readingProgress } from './progress.ts';

/** What commander hands over for the reading flags. */
export interface ReadFlags {
  derive: string[];
  kind: string[];
  complexPairs: string[];
  format?: string;
  /** `--no-progress` where the command has it. */
  progress?: boolean;
}

/** The reading flags checked and parsed: readTable's options and the derived columns. */
export interface ReadChoices {
  format?: TableFormat;
  kinds?: Record<string, ColumnKind>;
  complexPairs: ComplexPairs;
  derive: DeriveSpec[];
}

/** Adds `--derive`, `--kind`, `--complex-pairs` and `--format` to `cmd`, with one wording for all commands. */
export function addReadFlags(cmd: Command): Command {
  return cmd
    .option('--derive <name=expr>', 'add a computed column first (repeatable), e.g. ratio=re(zb/za)', collect, [] as string[])
    .option('--kind <name=kind>', `declare a column's kind: ${COLUMN_KINDS.join(', ')} (repeatable)`, collect, [] as string[])
    .addOption(
      new Option(
        '--complex-pairs <rule>',
        'join real/imaginary column pairs: auto (X_re/X_im and X.re/X.im, unless a kind is declared for a part or, other than complex, for X), none, or NAME=RE,IM (repeatable)',
      )
        .argParser(collect)
        // no value given is the rule `auto` (parseComplexPairsOption), not `none`
        .default([] as string[], 'auto'),
    )
    .option('--format <format>', `read the file as ${TABLE_FORMATS.join(', ')} whatever its extension`);
}

/** `--kind name=kind` values into a kinds record (errors name the flag). */
export function parseKindOptions(specs: readonly string[]): Record<string, ColumnKind> {
  const kinds: Record<string, ColumnKind> = {};
  for (const s of specs) {
    const eq = s.lastIndexOf('=');
    const name = eq < 0 ? '' : s.slice(0, eq).trim();
    const kind = eq < 0 ? '' : s.slice(eq + 1).trim();
    if (eq < 0 || name === '') throw new SurmiseError('cli.badKind', `--kind ${s}: expected NAME=KIND, e.g. --kind crossings=integer`);
    if (Object.hasOwn(kinds, name)) throw new SurmiseError('cli.badKind', `--kind ${s}: column '${name}' already has a kind (${kinds[name]}); give each column one --kind`);
    if (!COLUMN_KINDS.includes(kind as ColumnKind))
      throw new SurmiseError('cli.badKind', `--kind ${s}: '${kind}' is not a column kind; expected one of ${COLUMN_KINDS.join(', ')}${didYouMean(kind, COLUMN_KINDS)}`);
    kinds[name] = kind as ColumnKind;
  }
  return kinds;
}

/** Every reading flag checked and parsed, before any work. */
export function parseReadFlags(o: ReadFlags): ReadChoices {
  if (o.format !== undefined && !TABLE_FORMATS.includes(o.format as TableFormat))
    throw new SurmiseError('cli.badFormat', `--format ${o.format}: expected one of ${TABLE_FORMATS.join(', ')}${didYouMean(o.format, TABLE_FORMATS)}`);
  const kinds = parseKindOptions(o.kind);
  return {
    ...(o.format !== undefined ? { format: o.format as TableFormat } : {}),
    ...(Object.keys(kinds).length ? { kinds } : {}),
    complexPairs: parseComplexPairsOption(o.complexPairs),
    derive: o.derive.map((d) => parseDerive(d)),
  };
}

/** Reads `file` (relative to the working folder) as the parsed flags say, with reading progress where enabled; no derived columns yet. */
export async function readWithFlags(io: CliIO, file: string, choices: ReadChoices, progress = false): Promise<Table> {
  const reading = readingProgress(io, file, progress);
  try {
    return await readTable(resolve(io.cwd, file), {
      displayName: file,
      ...(choices.format ? { format: choices.format } : {}),
      ...(choices.kinds ? { kinds: choices.kinds } : {}),
      complexPairs: choices.complexPairs,
      onProgress: reading.onProgress,
    });
  } finally {
    reading.stop();
  }
}
