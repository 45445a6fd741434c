/**
 * readTable: CSV, TSV, JSON (an array of objects) and JSON Lines into typed columns.
 * Delimited files stream through a hand-written RFC 4180 splitter (src/table/delimited.ts);
 * JSON Lines stream line by line; a single JSON document is parsed whole.
 */
import { closeSync, readFileSync } from 'node:fs';
import { extname } from 'node:path';
import { SurmiseError } from '../errors.ts';
import { ColumnBuilder, type Place } from './builder.ts';
import {
  COLUMN_KINDS,
  RecordCollector,
  checkKinds,
  declaredKind,
  checkUniqueNames,
  finishBuilders,
  joinComplexPairs,
  jsonCellText,
  type ComplexPairs,
} from './columns.ts';
import { openForReading, readTextChunks, scanDelimited, unreadable, type DelimitedHandler } from './delimited.ts';
import type { ColumnKind, Table } from './types.ts';

export type TableFormat = 'csv' | 'tsv' | 'json' | 'jsonl';
export const TABLE_FORMATS: readonly TableFormat[] = ['csv', 'tsv', 'json', 'jsonl'];

export interface ReadOptions {
  /** Overrides the format chosen from the extension. */
  format?: TableFormat;
  /** Declared kinds per column name (instead of inference). */
  kinds?: Record<string, ColumnKind>;
  /** 'auto' (default) joins X_re/X_im and X.re/X.im into complex X; 'none' joins nothing; or an explicit list. */
  complexPairs?: ComplexPairs;
  /** Name to use for the file in messages (default: the path as given). */
  displayName?: string;
  /** Called after each chunk with bytes read and file size. */
  onProgress?: (bytes: number, total: number) => void;
}

const EXTENSIONS: Record<string, TableFormat> = {
  '.csv': 'csv',
  '.tsv': 'tsv',
  '.tab': 'tsv',
  '.json': 'json',
  '.jsonl': 'jsonl',
  '.ndjson': 'jsonl',
};

/** The format for `path` from its extension, or `table.unknownFormat`. */
export function formatFromPath(path: string, override?: string, display = path): TableFormat {
  if (override !== undefined) {
    if (!TABLE_FORMATS.includes(override as TableFormat))
      throw new SurmiseError('table.unknownFormat', `\`format\` ${override}: expected one of ${TABLE_FORMATS.join(', ')}`, { option: 'format' });
    return override as TableFormat;
  }
  const f = EXTENSIONS[extname(path).toLowerCase()];
  if (!f)
    throw new SurmiseError(
      'table.unknownFormat',
      `cannot tell the format of ${display} from its extension (${Object.keys(EXTENSIONS).join(' ')}); give \`format\` ${TABLE_FORMATS.join('|')}`,
      { option: 'format' },
    );
  return f;
}

/** Read a table file into typed columns. */
export async function readTable(path: string, opts: ReadOptions = {}): Promise<Table> {
  const display = opts.displayName ?? path;
  const format = formatFromPath(path, opts.format, display);
  if (opts.kinds)
    for (const [name, kind] of Object.entries(opts.kinds))
      if (!COLUMN_KINDS.includes(kind))
        throw new SurmiseError('table.badKind', `\`kinds\` ${name}=${kind}: expected one of ${COLUMN_KINDS.join(', ')}`, { option: 'kinds' });
  let t: Table;
  if (format === 'csv' || format === 'tsv') t = readDelimited(path, display, format === 'csv' ? ',' : '\t', opts);
  else if (format === 'jsonl') t = readJsonLines(path, display, opts);
  else t = readJsonArray(path, display, opts);
  return joinComplexPairs(t, opts.complexPairs ?? 'auto', opts.kinds);
}

class GrowInt32 {
  a = new Int32Array(1024);
  n = 0;
  push(x: number): void {
    if (this.n === this.a.length) {
      const b = new Int32Array(this.a.length * 2);
      b.set(this.a);
      this.a = b;
    }
    this.a[this.n++] = x;
  }
  done(): Int32Array {
    return this.a.slice(0, this.n);
  }
}

const SEPARATOR_NAMES: Record<string, string> = { ',': 'commas', '\t': 'tabs', ';': 'semicolons', '|': 'vertical bars' };

/**
 * A header read as one field that another separator would split (tab-separated text in a .csv
 * file, say) is refused with a hint, rather than read as a table of one column.
 */
function refuseWrongDelimiter(head: string[], quoted: boolean[], sep: string, display: string, line: number): void {
  if (head.length !== 1 || quoted[0]) return;
  for (const other of ['\t', ',', ';', '|']) {
    if (other === sep) continue;
    const k = head[0]!.split(other).length - 1;
    if (k >= 1) {
      const fmt = other === '\t' ? 'tsv' : other === ',' ? 'csv' : null;
      throw new SurmiseError(
        'table.wrongDelimiter',
        `${display}:${line}: the header has no ${SEPARATOR_NAMES[sep]} but ${k} ${SEPARATOR_NAMES[other]}, so it would be read as one column; ` +
          (fmt ? `read it as ${fmt.toUpperCase()} (format ${fmt}, or name the file .${fmt})` : `write it with ${SEPARATOR_NAMES[sep]} between fields`),
        { line, separator: other },
      );
    }
  }
}

function readDelimited(path: string, display: string, sep: string, opts: ReadOptions): Table {
  const unnamed: string[] = [];
  let header: string[] | null = null;
  let headerLine = 0;
  const head: string[] = [];
  const headQuoted: boolean[] = [];
  let builders: ColumnBuilder[] = [];
  let nCols = 0;
  let rows = 0;
  let estimate = 1024;
  const lines = new GrowInt32();
  const h: DelimitedHandler = {
    cell(col, text, quoted) {
      if (header === null) {
        head.push(text);
        headQuoted.push(quoted);
      } else if (col < nCols) builders[col]!.addText(text, quoted);
    },
    endRow(nFields, line) {
      if (header === null) {
        refuseWrongDelimiter(head, headQuoted, sep, display, line);
        header = head.map((n, j) => (n.trim() === '' ? `column_${j + 1}` : n));
        head.forEach((n, j) => {
          if (n.trim() === '') unnamed.push(`column ${j + 1} has no name in the header (line ${line}); it is called '${header![j]}'`);
        });
        headerLine = line;
        checkUniqueNames(header, display, `line ${line}`);
        checkKinds(opts.kinds, header, display, opts.complexPairs ?? 'auto');
        nCols = header.length;
        const names = header;
        builders = header.map((n, j) => new ColumnBuilder(n, j, declaredKind(opts.kinds, n, (x) => names.includes(x)), estimate));
        lines.a = new Int32Array(estimate);
        return;
      }
      if (nFields !== nCols)
        throw new SurmiseError(
          'table.raggedRow',
          `${display}:${line}: row has ${nFields} field${nFields === 1 ? '' : 's'}, header has ${nCols}`,
        );
      rows++;
      lines.push(line);
    },
    cellAt(col, text, bytes, start, lineEnd, sep) {
      if (header === null || col >= nCols) return -1;
      return builders[col]!.addScanned(text, bytes, start, lineEnd, sep);
    },
    columnLabel(col) {
      if (header === null) return `header field ${col + 1}`;
      return col < nCols ? `column '${header[col]}' (${col + 1})` : `field ${col + 1}`;
    },
  };
  let sawText = false;
  const info = scanDelimited(path, display, sep, h, {
    onFirst(text, bytes) {
      sawText = text.trim().length > 0;
      let nl = 0;
      const lim = Math.min(text.length, 1 << 20);
      for (let i = text.indexOf('\n'); i >= 0 && i < lim; i = text.indexOf('\n', i + 1)) nl++;
      const per = lim / Math.max(1, nl);
      estimate = Math.min(Math.ceil((bytes / per) * 1.05) + 16, 1 << 27);
    },
    onProgress: opts.onProgress,
  });
  if (header === null || !sawText) throw new SurmiseError('table.empty', `${display} is empty: expected a header line and rows`);
  if (rows === 0)
    throw new SurmiseError('table.noRows', `${display} has a header (line ${headerLine}) but no rows`);
  const lineArr = lines.done();
  const place: Place = { source: display, lineOf: (r) => lineArr[r] };
  const t = finishBuilders(builders, place, rows, lineArr, (needs) => {
    // second pass: the raw text of numeric cells in columns that turned out to hold labels
    const want = new Map(needs.map((b) => [b.index, b] as const));
    const limit = Math.max(...needs.map((b) => b.rowsNeedingText()));
    let row = -1;
    const h2: DelimitedHandler = {
      cell(col, text) {
        const b = want.get(col);
        if (b && row >= 0 && row < limit && text.length) b.recoverText(row, text);
      },
      endRow() {
        row++;
      },
      columnLabel: (col) => `column ${col + 1}`,
      done: () => row >= limit,
    };
    // row counts from -1 so that the header record brings it to 0
    scanDelimited(path, display, sep, h2);
  });
  if (info.blankLines > 0) (t.notes ??= []).push(`${info.blankLines} blank line${info.blankLines === 1 ? '' : 's'} skipped`);
  if (unnamed.length) (t.notes ??= []).push(...unnamed);
  return t;
}

function parseJsonLine(text: string, display: string, line: number): unknown {
  try {
    return JSON.parse(text);
  } catch (e) {
    throw new SurmiseError('table.badJson', `${display}:${line}: not valid JSON: ${(e as Error).message}`);
  }
}

function readJsonLines(path: string, display: string, opts: ReadOptions): Table {
  const col = new RecordCollector(display, opts.kinds, 1024);
  let line = 1;
  let any = false;
  const scan = (onRecord: (rec: unknown, line: number) => void, stop?: () => boolean) => {
    line = 1;
    readTextChunks(
      path,
      display,
      (chunk, final) => {
        const text = chunk.text();
        let pos = 0;
        while (pos < text.length) {
          let nl = text.indexOf('\n', pos);
          if (nl < 0) {
            if (!final) break;
            nl = text.length;
          }
          const s = text.substring(pos, nl).trim();
          if (s.length > 0) {
            any = true;
            onRecord(parseJsonLine(s, display, line), line);
          }
          line++;
          pos = nl + 1;
        }
        return pos;
      },
      { onProgress: opts.onProgress, stop },
    );
  };
  scan((rec, ln) => col.add(rec, ln));
  if (!any) throw new SurmiseError('table.empty', `${display} is empty: expected one JSON object per line`);
  checkKinds(
    opts.kinds,
    col.order.map((b) => b.name),
    display,
    opts.complexPairs ?? 'auto',
  );
  if (col.order.length === 0) throw new SurmiseError('table.noRows', `${display}: the records have no fields`);
  return finishBuilders(col.order, col.place(), col.rows, col.lines(), (needs) => {
    const limit = Math.max(...needs.map((b) => b.rowsNeedingText()));
    let row = 0;
    scan(
      (rec) => {
        for (const b of needs) {
          const v = (rec as Record<string, unknown>)[b.name];
          if (row < b.rowsNeedingText() && v !== null && v !== undefined) b.recoverText(row, jsonCellText(v));
        }
        row++;
      },
      () => row >= limit,
    );
  });
}

function readJsonArray(path: string, display: string, opts: ReadOptions): Table {
  const { fd, size } = openForReading(path, display);
  let text: string;
  try {
    if (size > 400 * 1024 * 1024)
      throw new SurmiseError(
        'table.tooLarge',
        `${display} is ${(size / 2 ** 20).toFixed(0)} MB: a single JSON document this large cannot be read whole; write it as JSON Lines (.jsonl, one object a line)`,
      );
    text = readFileSync(fd, 'utf8');
  } catch (e) {
    if (e instanceof SurmiseError) throw e;
    throw unreadable(display, e);
  } finally {
    void fd;
  }
  if (text.charCodeAt(0) === 0xfeff) text = text.slice(1);
  if (text.trim().length === 0) throw new SurmiseError('table.empty', `${display} is empty: expected a JSON array of objects`);
  let doc: unknown;
  try {
    doc = JSON.parse(text);
  } catch (e) {
    const msg = (e as Error).message;
    const m = /position (\d+)/.exec(msg);
    let where = '';
    if (m) {
      const p = Number(m[1]);
      const before = text.slice(0, p);
      const ln = before.split('\n').length;
      where = `:${ln}:${p - before.lastIndexOf('\n')}`;
    }
    throw new SurmiseError('table.badJson', `${display}${where}: not valid JSON: ${msg}`);
  }
  if (!Array.isArray(doc))
    throw new SurmiseError(
      'table.badJson',
      `${display}: expected a JSON array of objects ([{"name": value, ...}, ...]), got ${doc === null ? 'null' : typeof doc}`,
    );
  if (doc.length === 0) throw new SurmiseError('table.noRows', `${display}: the array has no records`);
  const col = new RecordCollector(display, opts.kinds, doc.length);
  for (const r of doc) col.add(r);
  checkKinds(
    opts.kinds,
    col.order.map((b) => b.name),
    display,
    opts.complexPairs ?? 'auto',
  );
  return finishBuilders(col.order, col.place(), col.rows, undefined, (needs) => {
    for (const b of needs)
      for (let r = 0; r < b.rowsNeedingText(); r++) {
        const v = (doc as Record<string, unknown>[])[r]![b.name];
        if (v !== null && v !== undefined) b.recoverText(r, jsonCellText(v));
      }
  });
}
