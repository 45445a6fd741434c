/**
 * Column builders: cells arrive one at a time (from CSV, TSV, JSON or JSON Lines) and are stored
 * straight into typed arrays; the kind is decided at the end from what was seen. A column that
 * turns out to hold labels after numeric cells asks the reader for the raw text of those cells
 * (`needsText`), so the reader never keeps every cell's text of a numeric table.
 */
import { SurmiseError, printable } from '../errors.ts';
import { formatComplex, formatNumber, isMissingText, parseComplexText, parseNumberText, scanDecimal, scanDecimalBytes, scannedValue } from './cell.ts';
import type { Column, ColumnKind } from './types.ts';

/** Share of numeric cells from which a column with a few text cells is an error rather than labels (common practice). */
export const NUMERIC_SHARE_FOR_ERROR = 0.95;

export interface Place {
  /** the file (as the user wrote it) or a name for in-memory data */
  source: string;
  /** physical line (1-based) per row, when known */
  lineOf(row: number): number | undefined;
}

function grow(a: Float64Array, cap: number): Float64Array {
  const b = new Float64Array(cap);
  b.set(a);
  return b;
}

/** where a cell is, for messages: "file.csv:17: column 'x' (3)" or "data.json: record 5: column 'x'" */
export function describePlace(place: Place, row: number, name: string, index: number): string {
  const line = place.lineOf(row);
  const where = line === undefined ? `${place.source}: record ${row + 1}` : `${place.source}:${line}`;
  return `${where}: column '${name}' (${index + 1})`;
}

export class ColumnBuilder {
  readonly name: string;
  readonly index: number;
  readonly declared: ColumnKind | undefined;
  n = 0;
  private cap: number;
  re: Float64Array;
  im: Float64Array | null = null;
  missing: Uint8Array;
  /** text per row once the column has seen text (undefined where the cell was numeric before that) */
  texts: Array<string | undefined> | null = null;
  /** rows below this index were numeric before the first text cell and may need their raw text */
  firstTextRow = -1;
  firstText = '';
  nNumeric = 0;
  nNonReal = 0;
  nText = 0;
  allIntegral = true;
  firstNonIntegralRow = -1;

  constructor(name: string, index: number, declared: ColumnKind | undefined, capacity: number) {
    this.name = name;
    this.index = index;
    this.declared = declared;
    this.cap = Math.max(16, capacity);
    this.re = declared === 'label' ? new Float64Array(0) : new Float64Array(this.cap);
    this.missing = new Uint8Array(this.cap);
    if (declared === 'label') {
      this.texts = [];
      this.firstTextRow = 0;
    }
  }

  private ensure(): void {
    if (this.n < this.cap) return;
    this.cap = Math.ceil(this.cap * 1.5) + 16;
    if (this.declared !== 'label') this.re = grow(this.re, this.cap);
    if (this.im) this.im = grow(this.im, this.cap);
    const m = new Uint8Array(this.cap);
    m.set(this.missing);
    this.missing = m;
  }

  /** A cell as text. `quoted`: the field was in quotes in the file (a quoted NA is text, not missing). */
  addText(s: string, quoted = false): void {
    this.ensure();
    const i = this.n++;
    if (this.declared === 'label') {
      if (quoted ? s.length === 0 : isMissingText(s)) {
        this.missing[i] = 1;
        this.texts!.push(undefined);
      } else this.texts!.push(s);
      return;
    }
    if (s.length === 0 || (!quoted && s.length <= 6 && isMissingText(s))) {
      this.missing[i] = 1;
      this.re[i] = NaN;
      if (this.texts) this.texts.push(undefined);
      return;
    }
    const x = parseNumberText(s);
    if (x !== undefined) {
      this.re[i] = x;
      this.nNumeric++;
      if (this.allIntegral && x - x === 0 && !Number.isInteger(x)) {
        this.allIntegral = false;
        this.firstNonIntegralRow = i;
      }
      if (this.texts) this.texts.push(s);
      return;
    }
    if (this.declared !== 'real' && this.declared !== 'integer') {
      const z = parseComplexText(s);
      if (z !== undefined) {
        this.setComplex(i, z.re, z.im);
        if (this.texts) this.texts.push(s);
        return;
      }
    }
    this.re[i] = NaN;
    this.nText++;
    if (!this.texts) {
      this.texts = new Array<string | undefined>(i);
      this.firstTextRow = i;
      this.firstText = s;
    }
    this.texts.push(s);
  }

  /**
   * A numeric cell read straight from `text[start..)` (or the same characters in `bytes`, ASCII
   * text) up to `lineEnd` or the separator `sep` (see `scanDecimal`). Returns the index where the cell ends, or -1 (nothing stored) when the
   * cell is not a plain decimal or the column keeps texts: the caller then uses `addText`.
   */
  addScanned(text: string, bytes: Uint8Array | null, start: number, lineEnd: number, sep: number): number {
    if (this.texts !== null) return -1;
    const end = bytes !== null ? scanDecimalBytes(bytes, start, lineEnd, sep) : scanDecimal(text, start, lineEnd, sep);
    if (end < 0) return -1;
    this.ensure();
    const i = this.n++;
    const x = scannedValue[0]!;
    this.re[i] = x;
    this.nNumeric++;
    if (this.allIntegral && x - x === 0 && !Number.isInteger(x)) {
      this.allIntegral = false;
      this.firstNonIntegralRow = i;
    }
    return end;
  }

  /** A JSON number. */
  addNumber(x: number): void {
    this.ensure();
    const i = this.n++;
    if (this.declared === 'label') {
      this.texts!.push(String(x));
      return;
    }
    this.re[i] = x;
    this.nNumeric++;
    if (this.allIntegral && !Number.isInteger(x)) {
      this.allIntegral = false;
      this.firstNonIntegralRow = i;
    }
    if (this.texts) this.texts.push(String(x));
  }

  /** A complex value given as a pair (JSON `{re, im}` or `[re, im]`). */
  addComplex(re: number, im: number, text: string): void {
    this.ensure();
    const i = this.n++;
    if (this.declared === 'label') {
      this.texts!.push(text);
      return;
    }
    if (im === 0 && 1 / im > 0) {
      this.n--;
      this.addNumber(re);
      if (this.texts) this.texts[this.texts.length - 1] = text;
      return;
    }
    this.setComplex(i, re, im);
    if (this.texts) this.texts.push(text);
  }

  addMissing(): void {
    this.ensure();
    const i = this.n++;
    this.missing[i] = 1;
    if (this.declared !== 'label') this.re[i] = NaN;
    if (this.texts) this.texts.push(undefined);
  }

  private setComplex(i: number, re: number, im: number): void {
    this.re[i] = re;
    if (im !== 0 || 1 / im < 0) {
      // a -0 imaginary part is kept (so it round-trips) but does not make the column complex
      if (!this.im) this.im = new Float64Array(this.cap);
      if (im !== 0) this.nNonReal++;
    }
    if (this.im) this.im[i] = im;
    this.nNumeric++;
  }

  /** The kind this column will get (throws for text cells in a numeric column). */
  decideKind(place: Place): ColumnKind {
    const where = (row: number) => describePlace(place, row, this.name, this.index);
    if (this.declared === 'label') return 'label';
    if (this.declared === 'real' || this.declared === 'integer') {
      if (this.nText > 0)
        throw new SurmiseError(
          'table.badNumber',
          `${where(this.firstTextRow)}: '${clip(this.firstText)}' is not a number, and the column is declared ${this.declared}`,
        );
      if (this.nNonReal > 0) {
        const row = firstNonzero(this.im!);
        throw new SurmiseError('table.badNumber', `${where(row)}: complex value in a column declared ${this.declared}`);
      }
      if (this.declared === 'integer' && !this.allIntegral)
        throw new SurmiseError(
          'table.notInteger',
          `${where(this.firstNonIntegralRow)}: ${this.re[this.firstNonIntegralRow]} is not an integer, and the column is declared integer`,
        );
      return this.declared;
    }
    if (this.declared === 'complex') {
      if (this.nText > 0)
        throw new SurmiseError(
          'table.badComplex',
          `${where(this.firstTextRow)}: '${clip(this.firstText)}' is not a complex number (write 1.5+2.25j, 1.5-2.25i, (1.5,2.25) or 2.25j)`,
        );
      return 'complex';
    }
    if (this.nText > 0) {
      const share = this.nNumeric / (this.nNumeric + this.nText);
      if (share >= NUMERIC_SHARE_FOR_ERROR) {
        const pct = (100 * share).toFixed(1);
        if (this.nNonReal > 0)
          throw new SurmiseError(
            'table.badComplex',
            `${where(this.firstTextRow)}: '${clip(this.firstText)}' is not a complex number (write 1.5+2.25j, 1.5-2.25i, (1.5,2.25) or 2.25j); ${pct}% of the column's cells are numbers`,
          );
        throw new SurmiseError(
          'table.badNumber',
          `${where(this.firstTextRow)}: '${clip(this.firstText)}' is not a number, but ${pct}% of the column's cells are (declare \`kinds\` ${this.name}=label to read it as text)`,
          { option: 'kinds' },
        );
      }
      return 'label';
    }
    if (this.nNonReal > 0) return 'complex';
    if (this.nNumeric > 0 && this.allIntegral) return 'integer';
    return 'real';
  }

  /** Rows before the first text cell whose raw text is needed because the column is labels. */
  rowsNeedingText(): number {
    if (!this.texts || this.declared === 'label') return 0;
    return this.firstTextRow;
  }

  /** Give the raw text of row `row` (a numeric cell before the first text cell). */
  recoverText(row: number, text: string): void {
    if (this.texts && row < this.firstTextRow) this.texts[row] = text;
  }

  /** The finished column (after decideKind and, for labels, text recovery). */
  finish(kind: ColumnKind): Column {
    const n = this.n;
    // keep the buffer when little is wasted (the size estimate is usually within a few percent)
    const fit = <T extends Float64Array | Uint8Array>(a: T): T => (a.length === n ? a : a.length <= n * 1.25 + 64 ? (a.subarray(0, n) as T) : (a.slice(0, n) as T));
    const missing = fit(this.missing);
    if (kind === 'label') {
      const texts = this.texts ?? [];
      const values = new Array<string>(n);
      for (let i = 0; i < n; i++) {
        const t = texts[i];
        if (missing[i]) values[i] = '';
        else if (t === undefined) values[i] = this.im && this.im[i] !== 0 ? formatComplex(this.re[i]!, this.im[i]!) : formatNumber(this.re[i]!);
        else values[i] = t;
      }
      return { name: this.name, kind: 'label', values, missing };
    }
    const re = fit(this.re);
    if (kind === 'complex') {
      const im = this.im ? fit(this.im) : new Float64Array(n);
      for (let i = 0; i < n; i++) if (missing[i]) im[i] = NaN;
      return { name: this.name, kind: 'complex', re, im, missing };
    }
    return { name: this.name, kind, values: re, missing };
  }
}

function firstNonzero(a: Float64Array): number {
  for (let i = 0; i < a.length; i++) if (a[i] !== 0) return i;
  return 0;
}

function clip(s: string): string {
  return printable(s, 40);
}
