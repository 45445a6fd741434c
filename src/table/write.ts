/**
 * writeTable: CSV, TSV, JSON (an array of objects) or JSON Lines. Numbers are written in their
 * shortest round-tripping form (ECMAScript Number::toString), −0 as `-0`, non-finite values as
 * `nan`/`inf`/`-inf`, complex values as `a+bj` (JSON: {"re": a, "im": b}), missing cells empty
 * (JSON: null). Delimited fields are quoted per RFC 4180 when they hold the separator, a quote,
 * CR or LF (and label cells that would otherwise read back as missing or with trimmed blanks).
 * The file is written under a partial name in the same folder and renamed into place
 * (src/util/partial.ts: removed on SIGINT/SIGTERM, and by the next write after a SIGKILL).
 */
import { closeSync, existsSync, openSync, renameSync, writeSync } from 'node:fs';
import { SurmiseError } from '../errors.ts';
import { beginPartial, discardPartial, endPartial, removeStalePartials } from '../util/partial.ts';
import { formatComplex, formatNumber, isMissingText } from './cell.ts';
import { formatFromPath, type TableFormat } from './read.ts';
import type { Column, Table } from './types.ts';

export interface WriteOptions {
  /** Replace an existing file (default: refuse with `table.exists`). */
  force?: boolean;
}

/** A delimited field, quoted when needed (RFC 4180 section 2, rules 5–7). */
export function quoteField(s: string, sep: string, forceQuote = false): string {
  if (forceQuote || s.includes(sep) || s.includes('"') || s.includes('\n') || s.includes('\r'))
    return `"${s.replaceAll('"', '""')}"`;
  return s;
}

function labelNeedsQuote(s: string): boolean {
  return isMissingText(s) || (s.length > 0 && (s.trim() !== s));
}

function cellText(c: Column, i: number, sep: string, single: boolean): string {
  // a lone empty line would read as a blank line: a one-column table writes a missing cell as ""
  if (c.missing[i]) return single ? '""' : '';
  if (c.kind === 'complex') return formatComplex(c.re[i]!, c.im[i]!);
  if (c.kind === 'label') {
    const s = c.values[i]!;
    return quoteField(s, sep, labelNeedsQuote(s));
  }
  return formatNumber(c.values[i]!);
}

function jsonNumber(x: number): string {
  return Number.isFinite(x) ? formatNumber(x) : JSON.stringify(formatNumber(x));
}

function jsonCell(c: Column, i: number): string {
  if (c.missing[i]) return 'null';
  if (c.kind === 'complex') return `{"re":${jsonNumber(c.re[i]!)},"im":${jsonNumber(c.im[i]!)}}`;
  if (c.kind === 'label') return JSON.stringify(c.values[i]!);
  return jsonNumber(c.values[i]!);
}

/** Write `table` to `path` (format from the extension unless given). */
export async function writeTable(
  table: Table,
  path: string,
  format?: TableFormat | WriteOptions,
  opts: WriteOptions = {},
): Promise<void> {
  if (typeof format === 'object') {
    opts = format;
    format = undefined;
  }
  const fmt = formatFromPath(path, format);
  if (!opts.force && existsSync(path))
    throw new SurmiseError('table.exists', `${path} already exists; not overwriting it (pass \`force\` to replace it)`, { option: 'force' });
  removeStalePartials(path);
  const tmp = beginPartial(path);
  let fd: number;
  try {
    fd = openSync(tmp, 'wx');
  } catch (e) {
    endPartial(tmp);
    throw new SurmiseError('table.unwritable', `cannot write ${path}: ${(e as Error).message}`);
  }
  let parts: string[] = [];
  let size = 0;
  const out = (s: string) => {
    parts.push(s);
    size += s.length;
    if (size > 1 << 20) {
      writeSync(fd, parts.join(''));
      parts = [];
      size = 0;
    }
  };
  try {
    const cols = table.columns;
    const n = table.nRows;
    if (fmt === 'csv' || fmt === 'tsv') {
      const sep = fmt === 'csv' ? ',' : '\t';
      out(cols.map((c) => quoteField(c.name, sep)).join(sep) + '\n');
      for (let i = 0; i < n; i++) {
        let line = '';
        for (let j = 0; j < cols.length; j++) line += (j ? sep : '') + cellText(cols[j]!, i, sep, cols.length === 1);
        out(line + '\n');
      }
    } else {
      const keys = cols.map((c) => JSON.stringify(c.name) + ':');
      if (fmt === 'json') out('[\n');
      for (let i = 0; i < n; i++) {
        let rec = '{';
        for (let j = 0; j < cols.length; j++) rec += (j ? ',' : '') + keys[j] + jsonCell(cols[j]!, i);
        rec += '}';
        if (fmt === 'json') out(rec + (i + 1 < n ? ',\n' : '\n'));
        else out(rec + '\n');
      }
      if (fmt === 'json') out(']\n');
    }
    if (parts.length) writeSync(fd, parts.join(''));
    closeSync(fd);
    renameSync(tmp, path);
    endPartial(tmp);
  } catch (e) {
    try {
      closeSync(fd);
    } catch {
      /* already closed */
    }
    discardPartial(tmp);
    throw e;
  }
}
