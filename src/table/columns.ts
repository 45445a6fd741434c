/**
 * Whole-table helpers shared by the readers: building a Table from column builders, joining
 * real/imaginary column pairs into complex columns, looking a column up by name, and building
 * tables from in-memory records or columns.
 */
import { SurmiseError, didYouMean, printable } from '../errors.ts';
import { formatComplex, formatNumber } from './cell.ts';
import { ColumnBuilder, type Place } from './builder.ts';
import type { Column, ColumnKind, Table } from './types.ts';

export type ComplexPairs = 'auto' | 'none' | Array<{ name: string; re: string; im: string }>;

export const COLUMN_KINDS: readonly ColumnKind[] = ['real', 'integer', 'complex', 'label'];

/** The column called `name`, or `table.unknownColumn` with a did-you-mean suggestion. */
export function getColumn(table: Table, name: string): Column {
  for (const c of table.columns) if (c.name === name) return c;
  const names = table.columns.map((c) => c.name);
  throw new SurmiseError(
    'table.unknownColumn',
    `no column '${name}' in ${table.source}${didYouMean(name, names)}; columns: ${names.join(', ')}`,
  );
}

export function columnLength(c: Column): number {
  return c.kind === 'complex' ? c.re.length : c.values.length;
}

/** Throws `table.duplicateColumn` naming both positions. */
export function checkUniqueNames(names: readonly string[], source: string, where = 'header'): void {
  const seen = new Map<string, number>();
  names.forEach((n, i) => {
    const j = seen.get(n);
    if (j !== undefined)
      throw new SurmiseError(
        'table.duplicateColumn',
        `${source}: ${where}: column name '${n}' appears twice (columns ${j + 1} and ${i + 1})`,
      );
    seen.set(n, i);
  });
}

/** Table from finished columns (all the same length, unique names). */
export function tableFromColumns(columns: Column[], source = '(in memory)', lines?: Int32Array): Table {
  checkUniqueNames(
    columns.map((c) => c.name),
    source,
    'columns',
  );
  const n = columns.length ? columnLength(columns[0]!) : 0;
  for (const c of columns) {
    const m = columnLength(c);
    if (m !== n || c.missing.length !== n || (c.kind === 'complex' && c.im.length !== n))
      throw new SurmiseError('table.raggedColumns', `${source}: column '${c.name}' has ${m} rows, the first column has ${n}`);
  }
  return { source, nRows: n, columns, ...(lines ? { lines } : {}) };
}

/** The two spellings of the parts of a complex pair called `name`: `name_re`/`name_im`, `name.re`/`name.im`. */
function pairPartNames(name: string): Array<[string, string]> {
  return [
    [`${name}_re`, `${name}_im`],
    [`${name}.re`, `${name}.im`],
  ];
}

/**
 * The kind declared for the file column `name`: its own, or else, for a part `X_re`/`X_im`
 * (`X.re`/`X.im`), the kind declared for `X` when that is not 'complex' and no column `X` exists
 * (`hasColumn`). A kind other than complex declared for a pair's name keeps its parts apart and
 * applies to each of them (see `joinComplexPairs`).
 */
export function declaredKind(
  kinds: Record<string, ColumnKind> | undefined,
  name: string,
  hasColumn: (name: string) => boolean = () => false,
): ColumnKind | undefined {
  if (!kinds) return undefined;
  const own = kinds[name];
  if (own !== undefined) return own;
  const m = /^(.+)[_.](?:re|im)$/.exec(name);
  if (!m) return undefined;
  const k = kinds[m[1]!];
  return k === undefined || k === 'complex' || hasColumn(m[1]!) ? undefined : k;
}

/** `table.kindConflict` when an explicit pair's name has a declared kind other than complex. */
function checkPairKind(kinds: Record<string, ColumnKind> | undefined, p: { name: string; re: string; im: string }): void {
  const k = kinds?.[p.name];
  if (k !== undefined && k !== 'complex' && p.name !== p.re && p.name !== p.im)
    throw new SurmiseError(
      'table.kindConflict',
      `complex pair ${p.name}=${p.re},${p.im} makes '${p.name}' complex, but its kind is declared '${k}' (\`kinds\` ${p.name}=${k}); drop one of the two`,
      { option: 'kinds' },
    );
}

/**
 * Check a `kinds` option against the file's column names, under the complex-pair rule: a name
 * that is not a column must be a pair's name, either joined (kind 'complex', by 'auto' or an
 * explicit pair) or kept apart (another kind, which then applies to both parts).
 */
export function checkKinds(
  kinds: Record<string, ColumnKind> | undefined,
  names: readonly string[],
  source: string,
  rule: ComplexPairs = 'auto',
): void {
  if (!kinds) return;
  for (const [name, kind] of Object.entries(kinds)) {
    if (!COLUMN_KINDS.includes(kind))
      throw new SurmiseError('table.badKind', `kind '${kind}' for column '${name}' is not one of ${COLUMN_KINDS.join(', ')}`);
    if (names.includes(name)) continue;
    const explicit = Array.isArray(rule) ? rule.find((p) => p.name === name) : undefined;
    if (explicit) {
      checkPairKind(kinds, explicit);
      continue;
    }
    const parts = pairPartNames(name).find(([re, im]) => names.includes(re) && names.includes(im));
    if (!parts)
      throw new SurmiseError(
        'table.unknownColumn',
        `\`kinds\` ${name}=${kind}: no column '${name}' in ${source}${didYouMean(name, names)}`,
        { option: 'kinds' },
      );
    if (kind === 'complex' && rule !== 'auto')
      throw new SurmiseError(
        'table.unknownColumn',
        `\`kinds\` ${name}=complex: no column '${name}' in ${source}: the complex-pair rule (${rule === 'none' ? 'none' : 'explicit pairs'}) does not join '${parts[0]}' and '${parts[1]}'; ` +
          `give \`complexPairs\` ${name}=${parts[0]},${parts[1]} to join them`,
        { option: 'kinds', also: ['complexPairs'] },
      );
  }
}

function isNumeric(c: Column): c is Extract<Column, { kind: 'real' | 'integer' }> {
  return c.kind === 'real' || c.kind === 'integer';
}

/**
 * Join real/imaginary pairs into complex columns. 'auto' joins `X_re`/`X_im` and `X.re`/`X.im`
 * when both are numeric and no column `X` exists, unless `kinds` declares a kind for either part
 * or a kind other than complex for `X` (declared kinds win: the parts are kept apart, noted);
 * `kinds` declaring `X` complex joins them whatever the parts' kinds. An explicit list must name
 * existing numeric columns; a kind other than complex declared for its name is
 * `table.kindConflict`. The complex column takes the place of its real part.
 */
export function joinComplexPairs(table: Table, rule: ComplexPairs = 'auto', kinds?: Record<string, ColumnKind>): Table {
  if (rule === 'none') return table;
  const byName = new Map(table.columns.map((c) => [c.name, c] as const));
  const pairs: Array<{ name: string; re: string; im: string }> = [];
  const notes: string[] = [];
  if (rule === 'auto') {
    for (const c of table.columns) {
      const m = /^(.+)([_.])re$/.exec(c.name);
      if (!m) continue;
      const imName = `${m[1]}${m[2]}im`;
      const im = byName.get(imName);
      if (!im || !isNumeric(c) || !isNumeric(im)) continue;
      if (byName.has(m[1]!)) {
        notes.push(`columns '${c.name}' and '${imName}' were not joined: a column '${m[1]}' already exists`);
        continue;
      }
      if (kinds?.[m[1]!] !== 'complex') {
        const who = [m[1]!, c.name, imName].filter((n) => kinds?.[n] !== undefined);
        if (who.length > 0) {
          notes.push(
            `columns '${c.name}' and '${imName}' were kept apart: a kind is declared for ${who.map((n) => `'${n}' (${kinds![n]})`).join(' and ')} ` +
              `(declaring ${m[1]} complex, or the complex pair ${m[1]}=${c.name},${imName}, joins them)`,
          );
          continue;
        }
      }
      pairs.push({ name: m[1]!, re: c.name, im: imName });
    }
  } else {
    const names = table.columns.map((c) => c.name);
    for (const p of rule) {
      for (const part of [p.re, p.im]) {
        const c = byName.get(part);
        if (!c)
          throw new SurmiseError(
            'table.unknownColumn',
            `complex pair '${p.name}': no column '${part}' in ${table.source}${didYouMean(part, names)}`,
          );
        if (!isNumeric(c))
          throw new SurmiseError('table.badComplexPair', `complex pair '${p.name}': column '${part}' is ${c.kind}, not numeric`);
      }
      if (byName.has(p.name) && p.name !== p.re && p.name !== p.im)
        throw new SurmiseError('table.duplicateColumn', `complex pair '${p.name}': a column '${p.name}' already exists in ${table.source}`);
      checkPairKind(kinds, p);
      pairs.push(p);
    }
  }
  if (pairs.length === 0) return notes.length ? { ...table, notes: [...(table.notes ?? []), ...notes] } : table;
  const imParts = new Set(pairs.map((p) => p.im));
  const reToPair = new Map(pairs.map((p) => [p.re, p] as const));
  const out: Column[] = [];
  for (const c of table.columns) {
    if (imParts.has(c.name) && !reToPair.has(c.name)) continue;
    const p = reToPair.get(c.name);
    if (!p) {
      out.push(c);
      continue;
    }
    const re = byName.get(p.re) as Extract<Column, { kind: 'real' | 'integer' }>;
    const im = byName.get(p.im) as Extract<Column, { kind: 'real' | 'integer' }>;
    const n = table.nRows;
    const missing = new Uint8Array(n);
    const reV = new Float64Array(n);
    const imV = new Float64Array(n);
    for (let i = 0; i < n; i++) {
      if (re.missing[i] || im.missing[i]) {
        missing[i] = 1;
        reV[i] = NaN;
        imV[i] = NaN;
      } else {
        reV[i] = re.values[i]!;
        imV[i] = im.values[i]!;
      }
    }
    out.push({ name: p.name, kind: 'complex', re: reV, im: imV, missing });
    notes.push(`columns '${p.re}' and '${p.im}' joined into complex column '${p.name}'`);
  }
  return { ...table, columns: out, notes: [...(table.notes ?? []), ...notes] };
}

/** Raw text of a JSON cell, as a label would show it. */
function jsonCellText(v: unknown): string {
  if (typeof v === 'number') return formatNumber(v);
  if (typeof v === 'string') return v;
  if (Array.isArray(v)) return formatComplex(Number(v[0]), Number(v[1]));
  if (v && typeof v === 'object') {
    const o = v as { re: unknown; im: unknown };
    return formatComplex(Number(o.re), Number(o.im));
  }
  return String(v);
}

function partNumber(v: unknown): number | undefined {
  if (typeof v === 'number') return v;
  if (typeof v === 'string') {
    const t = v.trim().toLowerCase();
    if (t === 'nan') return NaN;
    if (t === 'inf' || t === '+inf' || t === 'infinity') return Infinity;
    if (t === '-inf' || t === '-infinity') return -Infinity;
    const x = Number(v);
    return v.trim() !== '' && Number.isFinite(x) ? x : undefined;
  }
  return undefined;
}

/**
 * Collects records (objects) into columns. Keys are columns in order of first appearance; a record
 * without a key has a missing cell there.
 */
export class RecordCollector {
  readonly builders = new Map<string, ColumnBuilder>();
  readonly order: ColumnBuilder[] = [];
  rows = 0;
  private lineList: number[] = [];
  constructor(
    readonly source: string,
    readonly kinds: Record<string, ColumnKind> | undefined,
    readonly capacity = 64,
  ) {}

  private where(row: number, line: number | undefined, key: string): string {
    return line === undefined ? `${this.source}: record ${row + 1}: column '${key}'` : `${this.source}:${line}: column '${key}'`;
  }

  add(rec: unknown, line?: number): void {
    const row = this.rows;
    if (rec === null || typeof rec !== 'object' || Array.isArray(rec))
      throw new SurmiseError(
        'table.badRecord',
        `${line === undefined ? `${this.source}: record ${row + 1}` : `${this.source}:${line}`}: expected an object like {"name": value, ...}, got ${Array.isArray(rec) ? 'a list' : rec === null ? 'null' : typeof rec}`,
      );
    for (const [key, v] of Object.entries(rec as Record<string, unknown>)) {
      let b = this.builders.get(key);
      if (!b) {
        b = new ColumnBuilder(key, this.order.length, declaredKind(this.kinds, key, (x) => this.builders.has(x)), this.capacity);
        for (let r = 0; r < row; r++) b.addMissing();
        this.builders.set(key, b);
        this.order.push(b);
      }
      if (b.n > row)
        throw new SurmiseError('table.duplicateColumn', `${this.where(row, line, key)}: the key '${key}' appears twice in one record`);
      this.addCell(b, v, row, line, key);
    }
    this.rows++;
    for (const b of this.order) if (b.n < this.rows) b.addMissing();
    if (line !== undefined) this.lineList.push(line);
  }

  private addCell(b: ColumnBuilder, v: unknown, row: number, line: number | undefined, key: string): void {
    if (v === null || v === undefined) b.addMissing();
    else if (typeof v === 'number') b.addNumber(v);
    else if (typeof v === 'string') b.addText(v, false);
    else if (typeof v === 'boolean') b.addText(String(v), true);
    else if (Array.isArray(v) && v.length === 2) {
      const re = partNumber(v[0]);
      const im = partNumber(v[1]);
      if (re === undefined || im === undefined)
        throw new SurmiseError('table.badComplex', `${this.where(row, line, key)}: [${v.map((x) => JSON.stringify(x)).join(', ')}] is not a complex number [re, im]`);
      b.addComplex(re, im, jsonCellText(v));
    } else if (typeof v === 'object' && !Array.isArray(v) && 're' in (v as object) && 'im' in (v as object) && Object.keys(v as object).length === 2) {
      const o = v as { re: unknown; im: unknown };
      const re = partNumber(o.re);
      const im = partNumber(o.im);
      if (re === undefined || im === undefined)
        throw new SurmiseError('table.badComplex', `${this.where(row, line, key)}: ${JSON.stringify(v)} is not a complex number {"re": number, "im": number}`);
      b.addComplex(re, im, jsonCellText(v));
    } else
      throw new SurmiseError(
        'table.badCell',
        `${this.where(row, line, key)}: ${Array.isArray(v) ? 'a list' : 'a nested object'} is not a table cell (cells are numbers, strings, null, {"re", "im"} or [re, im])`,
      );
  }

  lines(): Int32Array | undefined {
    return this.lineList.length === this.rows && this.rows > 0 ? Int32Array.from(this.lineList) : undefined;
  }

  place(): Place {
    const lines = this.lineList;
    return { source: this.source, lineOf: (row) => (lines.length > row ? lines[row] : undefined) };
  }
}

/** Finish builders into a Table: decide kinds, let `recover` supply raw text of label columns, record notes. */
export function finishBuilders(
  builders: ColumnBuilder[],
  place: Place,
  nRows: number,
  lines: Int32Array | undefined,
  recover: (needs: ColumnBuilder[]) => void,
): Table {
  const kinds = builders.map((b) => b.decideKind(place));
  const needs = builders.filter((b, j) => kinds[j] === 'label' && b.rowsNeedingText() > 0);
  if (needs.length) recover(needs);
  const notes: string[] = [];
  const columns = builders.map((b, j) => {
    if (kinds[j] === 'label' && b.declared === undefined && b.nNumeric > 0)
      notes.push(
        `column '${printable(b.name, 80)}' read as labels: ${b.nText} of ${b.nNumeric + b.nText} cells are not numbers (first: line ${place.lineOf(b.firstTextRow) ?? `record ${b.firstTextRow + 1}`}, '${printable(b.firstText)}')`,
      );
    return b.finish(kinds[j]!);
  });
  const t = tableFromColumns(columns, place.source, lines);
  if (notes.length) t.notes = notes;
  if (nRows !== t.nRows) throw new Error(`internal: ${nRows} rows counted, ${t.nRows} built`);
  return t;
}

/** Table from in-memory records (objects), with the same cell rules as the JSON reader. */
export function tableFromRecords(
  records: Record<string, unknown>[],
  source = '(in memory)',
  opts: { kinds?: Record<string, ColumnKind>; complexPairs?: ComplexPairs } = {},
): Table {
  const col = new RecordCollector(source, opts.kinds, records.length);
  for (const r of records) col.add(r);
  const t = finishBuilders(col.order, col.place(), col.rows, undefined, (needs) => {
    for (const b of needs)
      for (let r = 0; r < b.rowsNeedingText(); r++) {
        const v = records[r]![b.name];
        if (v !== null && v !== undefined) b.recoverText(r, jsonCellText(v));
      }
  });
  checkKinds(
    opts.kinds,
    col.order.map((b) => b.name),
    source,
    opts.complexPairs ?? 'auto',
  );
  const joined = joinComplexPairs(t, opts.complexPairs ?? 'auto', opts.kinds);
  return joined;
}

export { jsonCellText };
