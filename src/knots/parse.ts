/**
 * Reading knot and link diagrams from text.
 *
 * Accepted forms (kind detected where unambiguous):
 * • PD code: JSON `[[1,5,2,4],[3,1,4,6],[5,3,6,2]]`, `X[1,5,2,4] X[3,1,4,6] …` or
 *   `PD[X[1,5,2,4], X[3,1,4,6], …]`.
 * • Braid word: signed Artin generators `1 1 1`, `1 -2 1 -2` (spaces or commas, optional
 *   brackets); with a strand count `4: 1 2 3` or JSON `{"strands": 4, "word": [1, 2, 3]}`.
 *   Default strand count: max |generator| + 1.
 * • DT code of a knot: `DT[4,6,2]` or, with --kind dt, `4 6 2`.
 * An integer list whose entries are all even could be a DT code or a braid word: that is an
 * error (`knots.ambiguousKind`) unless the kind is given.
 */
import { SurmiseError } from '../errors.ts';
import type { Braid } from './braid.ts';
import { validateBraid } from './braid.ts';
import { validateDT } from './dt.ts';
import type { Crossing } from './pd.ts';

export type DiagramKind = 'pd' | 'braid' | 'dt';
export const DIAGRAM_KINDS: readonly DiagramKind[] = ['pd', 'braid', 'dt'];

export type ParsedCode =
  | { kind: 'pd'; pd: Crossing[] }
  | { kind: 'braid'; braid: Braid }
  | { kind: 'dt'; dt: number[] };

function parseErr(msg: string): never {
  throw new SurmiseError('knots.parse', msg);
}

function intList(text: string, what: string): number[] {
  const t = text.trim().replace(/^\[/, '').replace(/\]$/, '').trim();
  if (t === '') return [];
  const parts = t.split(/[\s,]+/).filter((s) => s.length > 0);
  return parts.map((p, k) => {
    const v = Number(p);
    if (!Number.isInteger(v)) {
      const col = text.indexOf(p) + 1;
      parseErr(`${what}: entry ${k + 1} '${p}' (column ${col}) is not an integer`);
    }
    return v;
  });
}

/** Largest strand count of a braid read from input (the reduced Burau matrices are (n − 1) × (n − 1)). */
export const MAX_STRANDS = 64;
/** Largest diagram read from input, in crossings (braid letters or PD crossings): Seifert and Goeritz matrices are held densely. */
export const MAX_CROSSINGS = 2000;

/** Refuse a diagram with more than MAX_CROSSINGS crossings (`knots.tooLarge`). */
export function checkDiagramSize(n: number, what: string, unit: string): void {
  if (n > MAX_CROSSINGS) throw new SurmiseError('knots.tooLarge', `the ${what} has ${n} ${unit}; at most ${MAX_CROSSINGS} crossings are accepted`);
}

function parsePDText(text: string): Crossing[] {
  const t = text.trim();
  if (t.startsWith('[')) {
    let v: unknown;
    try {
      v = JSON.parse(t);
    } catch (e) {
      parseErr(`PD code is not valid JSON: ${(e as Error).message}`);
    }
    if (!Array.isArray(v)) parseErr('PD code must be a list of crossings');
    return (v as unknown[]).map((x, k) => {
      if (!Array.isArray(x) || x.length !== 4 || !x.every((y) => Number.isInteger(y)))
        parseErr(`PD crossing ${k + 1} must be a list of four integers, got ${JSON.stringify(x)}`);
      return x as Crossing;
    });
  }
  let body = t;
  const m = /^PD\s*\[(.*)\]\s*$/s.exec(t);
  if (m) body = m[1]!;
  const re = /X\s*\[([^\]]*)\]/g;
  const out: Crossing[] = [];
  let last = 0;
  let k = 0;
  for (let mm = re.exec(body); mm; mm = re.exec(body)) {
    const between = body.slice(last, mm.index).replace(/[\s,]/g, '');
    if (between !== '') parseErr(`unexpected '${between}' before crossing ${k + 1} (column ${last + 1} of the PD code)`);
    k++;
    const xs = intList(mm[1]!, `PD crossing ${k}`);
    if (xs.length !== 4) parseErr(`PD crossing ${k} X[${mm[1]}] must have four labels`);
    out.push(xs as Crossing);
    last = mm.index + mm[0].length;
  }
  const rest = body.slice(last).replace(/[\s,]/g, '');
  if (rest !== '') parseErr(`unexpected '${rest}' after crossing ${k} of the PD code`);
  if (out.length === 0) parseErr('PD code has no crossings X[a,b,c,d]');
  return out;
}

function parseBraidText(text: string, strandsOverride?: number): Braid {
  const t = text.trim();
  let strands: number | undefined;
  let word: number[];
  if (t.startsWith('{')) {
    let v: unknown;
    try {
      v = JSON.parse(t);
    } catch (e) {
      parseErr(`braid is not valid JSON: ${(e as Error).message}`);
    }
    const o = v as { strands?: unknown; word?: unknown };
    if (!Array.isArray(o.word) || !o.word.every((g) => Number.isInteger(g))) parseErr('braid JSON needs "word": a list of integers');
    if (o.strands !== undefined && !(Number.isInteger(o.strands) && (o.strands as number) >= 1))
      parseErr(`braid JSON "strands" must be a positive integer, got ${JSON.stringify(o.strands)}`);
    word = o.word as number[];
    strands = o.strands as number | undefined;
  } else {
    const m = /^(?:BR\s*\[)?\s*(\d+)\s*:(.*?)\]?$/s.exec(t);
    if (m) {
      strands = Number(m[1]);
      word = intList(m[2]!, 'braid word');
    } else word = intList(t, 'braid word');
  }
  if (strandsOverride !== undefined) strands = strandsOverride;
  if (word.length === 0) throw new SurmiseError('knots.emptyBraid', 'the braid word is empty');
  let top = 0;
  for (const g of word) top = Math.max(top, Math.abs(g));
  const b: Braid = { strands: strands ?? top + 1, word };
  checkDiagramSize(word.length, 'braid word', 'letters');
  if (b.strands > MAX_STRANDS || top + 1 > MAX_STRANDS)
    throw new SurmiseError(
      'knots.tooLarge',
      `the braid needs ${Math.max(b.strands, top + 1)} strands${top + 1 > MAX_STRANDS ? ` (generator ${top})` : ''}; at most ${MAX_STRANDS} strands are accepted`,
    );
  validateBraid(b);
  return b;
}

/** Detect the kind of a code, or throw `knots.ambiguousKind` / `knots.parse`. */
export function detectKind(text: string): DiagramKind {
  const t = text.trim();
  if (t === '') parseErr('empty code');
  if (/^(PD\s*\[|X\s*\[|\[\s*\[)/.test(t)) return 'pd';
  if (/^DT\s*\[/.test(t)) return 'dt';
  if (t.startsWith('{') || /^\d+\s*:/.test(t)) return 'braid';
  if (/^\[?[\s,+-]*\d[\d\s,+-]*\]?$/.test(t)) {
    const xs = intList(t, 'code');
    if (xs.length === 0) throw new SurmiseError('knots.emptyBraid', 'the braid word is empty');
    if (xs.some((x) => x % 2 !== 0)) return 'braid';
    throw new SurmiseError(
      'knots.ambiguousKind',
      `'${t}' has only even entries: it could be a DT code or a braid word; give \`kind\` dt or \`kind\` braid`,
      { option: 'kind' },
    );
  }
  parseErr(`cannot read '${t.length > 40 ? t.slice(0, 40) + '…' : t}' as a PD code, braid word or DT code`);
}

/** Parse one code of the given (or detected) kind. */
export function parseCode(text: string, kind?: DiagramKind): ParsedCode {
  const k = kind ?? detectKind(text);
  const t = text.trim();
  if (k === 'pd') {
    const pd = parsePDText(t);
    checkDiagramSize(pd.length, 'PD code', 'crossings');
    return { kind: 'pd', pd };
  }
  if (k === 'braid') {
    if (/^(PD|X|DT)\s*\[/.test(t) || t.startsWith('[[')) parseErr(`'${t.slice(0, 20)}' is not a braid word`);
    return { kind: 'braid', braid: parseBraidText(t) };
  }
  const m = /^DT\s*\[(.*)\]$/s.exec(t);
  const dt = intList(m ? m[1]! : t, 'DT code');
  validateDT(dt);
  return { kind: 'dt', dt };
}

/** One diagram read from a file. */
export interface DiagramSource {
  name: string;
  code: string;
  /** 1-based line in the file. */
  line: number;
  /** 1-based column where the code starts. */
  column: number;
  /** Place for messages when not a line and column (e.g. `record 3` of a JSON file). */
  where?: string;
}

/**
 * Lines `name<TAB>code` (or just `code`, named `row<line>`); blank lines and lines starting
 * with `#` are skipped; a first line `name<TAB>code` is a header.
 */
export function splitDiagramLines(text: string, file: string): DiagramSource[] {
  const out: DiagramSource[] = [];
  const lines = text.split(/\r?\n/);
  const names = new Map<string, number>();
  lines.forEach((raw, i) => {
    const line = raw.trimEnd();
    if (line.trim() === '' || line.trimStart().startsWith('#')) return;
    const tab = raw.indexOf('\t'); // in the untrimmed line: `name<TAB>` with nothing after is a name without code
    let name: string;
    let code: string;
    let column: number;
    if (tab >= 0) {
      name = line.slice(0, tab).trim();
      code = line.slice(tab + 1);
      column = tab + 2;
      if (out.length === 0 && name.toLowerCase() === 'name' && code.trim().toLowerCase() === 'code') return;
      if (name === '') throw new SurmiseError('knots.parse', `${file}:${i + 1}:1: empty name before the tab`);
      if (code.trim() === '') throw new SurmiseError('knots.parse', `${file}:${i + 1}: ${name}: no code after the name`);
    } else {
      name = `row${i + 1}`;
      code = line;
      column = 1;
    }
    const prev = names.get(name);
    if (prev !== undefined) throw new SurmiseError('knots.duplicateName', `${file}:${i + 1}:1: the name '${name}' was already used on line ${prev}`);
    names.set(name, i + 1);
    out.push({ name, code, line: i + 1, column });
  });
  return out;
}
