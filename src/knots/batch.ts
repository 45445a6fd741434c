/**
 * Many diagrams at once: read a diagram file (lines `name<TAB>code`, or a CSV/TSV/JSON table with a
 * column of codes), compute invariants row by row with errors that name file, line and column,
 * and lay the results out as table records.
 */
import { readFileSync } from 'node:fs';
import { extname } from 'node:path';
import { SurmiseError } from '../errors.ts';
import { readTable } from '../table/read.ts';
import type { Table } from '../table/types.ts';
import { parseDiagram } from './diagram.ts';
import { computeInvariants, type ComputeOptions, type InvariantName, type KnotInvariants } from './invariants.ts';
import { splitDiagramLines, type DiagramKind, type DiagramSource } from './parse.ts';

export interface ReadDiagramsOptions {
  /** Column holding the codes (tables only). */
  column?: string;
  /** Column holding the names (tables only; default `name` when present, else row<line>). */
  nameColumn?: string;
  /** How to show the file in messages (default: the path as given). */
  displayName?: string;
}

/** The reason a file cannot be read, in the table layer's words (`table.unreadable`). */
function whyUnreadable(e: unknown): string {
  const code = (e as NodeJS.ErrnoException)?.code;
  if (code === 'ENOENT') return 'no such file';
  if (code === 'EACCES' || code === 'EPERM') return 'permission denied';
  if (code === 'EISDIR') return 'it is a folder, not a file';
  return (e as Error)?.message ?? String(e);
}

const TABLE_EXT = new Set(['.csv', '.json', '.jsonl', '.ndjson']);

function cellText(t: Table, col: string, row: number): string | undefined {
  const c = t.columns.find((x) => x.name === col)!;
  if (c.missing[row]) return undefined;
  if (c.kind === 'label') return c.values[row]!;
  if (c.kind === 'complex') return undefined;
  return String(c.values[row]!);
}

/**
 * The diagrams of a file with their places. Lines format unless the extension is .csv/.json/.jsonl
 * or a `column` is given (then the table layer reads it; default column `code`).
 */
export async function readDiagramFile(path: string, opts: ReadDiagramsOptions = {}): Promise<DiagramSource[]> {
  const display = opts.displayName ?? path;
  const isTable = opts.column !== undefined || TABLE_EXT.has(extname(path).toLowerCase());
  if (!isTable) {
    let text: string;
    try {
      text = readFileSync(path, 'utf8');
    } catch (e) {
      throw new SurmiseError('knots.unreadable', `cannot read ${display}: ${whyUnreadable(e)}`);
    }
    return splitDiagramLines(text, display);
  }
  const column = opts.column ?? 'code';
  if (extname(path).toLowerCase() === '.json') return readJsonDiagrams(path, display, column, opts.nameColumn);
  const kinds: Record<string, 'label'> = { [column]: 'label' };
  if (opts.nameColumn) kinds[opts.nameColumn] = 'label';
  let t: Table;
  try {
    t = await readTable(path, { displayName: display, complexPairs: 'none' });
  } catch (e) {
    throw e;
  }
  const names = t.columns.map((c) => c.name);
  if (!names.includes(column))
    throw new SurmiseError('knots.noColumn', `${display}: no column '${column}' of codes (columns: ${names.join(', ')}); give \`column\``, { option: 'column' });
  const nameCol = opts.nameColumn ?? (names.includes('name') ? 'name' : undefined);
  if (nameCol !== undefined && !names.includes(nameCol))
    throw new SurmiseError('knots.noColumn', `${display}: no column '${nameCol}' of names (columns: ${names.join(', ')})`);
  const out: DiagramSource[] = [];
  const seen = new Map<string, number>();
  for (let r = 0; r < t.nRows; r++) {
    const line = t.lines ? t.lines[r]! : r + 2;
    const code = cellText(t, column, r);
    if (code === undefined) throw new SurmiseError('knots.parse', `${display}:${line}: the '${column}' cell is empty`);
    const name = (nameCol ? cellText(t, nameCol, r) : undefined) ?? `row${line}`;
    const prev = seen.get(name);
    if (prev !== undefined) throw new SurmiseError('knots.duplicateName', `${display}:${line}: the name '${name}' was already used on line ${prev}`);
    seen.set(name, line);
    out.push({ name, code, line, column: 1 });
  }
  return out;
}

/**
 * A JSON array of records; a code cell may be a string or JSON itself (a PD code as nested lists,
 * a braid as {"strands", "word"}), which the table layer would refuse as a cell.
 */
function readJsonDiagrams(path: string, display: string, column: string, nameColumn: string | undefined): DiagramSource[] {
  let data: unknown;
  try {
    data = JSON.parse(readFileSync(path, 'utf8'));
  } catch (e) {
    const err = e as NodeJS.ErrnoException;
    if (err.code) throw new SurmiseError('knots.unreadable', `cannot read ${display}: ${whyUnreadable(err)}`);
    throw new SurmiseError('knots.parse', `${display}: not valid JSON: ${err.message}`);
  }
  if (!Array.isArray(data)) throw new SurmiseError('knots.parse', `${display}: expected a JSON array of records with a '${column}' field`);
  const seen = new Map<string, number>();
  return data.map((rec, k) => {
    const where = `record ${k + 1}`;
    if (rec === null || typeof rec !== 'object' || Array.isArray(rec)) throw new SurmiseError('knots.parse', `${display}: ${where} is not an object`);
    const r = rec as Record<string, unknown>;
    const c = r[column];
    if (c === undefined || c === null) throw new SurmiseError('knots.noColumn', `${display}: ${where} has no '${column}' field (give \`column\`)`, { option: 'column' });
    const code = typeof c === 'string' ? c : typeof c === 'number' ? String(c) : JSON.stringify(c);
    const nc = nameColumn ?? 'name';
    const nv = r[nc];
    if (nameColumn !== undefined && (nv === undefined || nv === null)) throw new SurmiseError('knots.noColumn', `${display}: ${where} has no '${nameColumn}' field`);
    const name = nv === undefined || nv === null ? `record${k + 1}` : String(nv);
    const prev = seen.get(name);
    if (prev !== undefined) throw new SurmiseError('knots.duplicateName', `${display}: ${where}: the name '${name}' was already used in record ${prev}`);
    seen.set(name, k + 1);
    return { name, code, line: k + 1, column: 1, where };
  });
}

/** Invariants of one source, with errors re-thrown as `file:line:column: name: message`. */
export function invariantsOf(src: DiagramSource, file: string, kind: DiagramKind | undefined, opts: ComputeOptions): KnotInvariants {
  try {
    return computeInvariants(parseDiagram(src.code, kind), opts);
  } catch (e) {
    if (e instanceof SurmiseError) {
      const place = src.where !== undefined ? `${file}: ${src.where}` : `${file}:${src.line}:${src.column}`;
      throw new SurmiseError(e.code, `${place}: ${src.name}: ${e.message}`, e.details);
    }
    throw e;
  }
}

/** The columns the `hyperbolic` invariant adds (cusp_shape is complex; the last three: the maximal cusp of a knot). */
export const HYPERBOLIC_COLUMNS = ['geometry', 'geometry_reason', 'volume', 'cusp_shape', 'natural_slope', 'cusp_volume', 'meridian_length', 'longitude_length'] as const;

/** Column order and record layout of the output table. */
export function invariantColumns(inv: readonly InvariantName[]): string[] {
  const cols: string[] = [];
  for (const k of inv) {
    if (k === 'hyperbolic') cols.push(...HYPERBOLIC_COLUMNS);
    else cols.push(k);
  }
  return cols;
}

/** Text of the linking numbers, e.g. `(1,2):1 (1,3):-1`; empty for knots. */
export function linkingText(l: KnotInvariants['linking']): string {
  return (l ?? []).map((x) => `(${x.i},${x.j}):${x.lk}`).join(' ');
}

/** One flat record for a table (alexander as text, lists as space-separated text). */
export function tableRecord(name: string, r: KnotInvariants, inv: readonly InvariantName[]): Record<string, string | number | null | { re: number; im: number }> {
  const rec: Record<string, string | number | null | { re: number; im: number }> = { name };
  for (const k of inv) {
    switch (k) {
      case 'crossings': rec[k] = r.crossings; break;
      case 'writhe': rec[k] = r.writhe; break;
      case 'components': rec[k] = r.components; break;
      case 'signature': rec[k] = r.signature ?? null; break;
      // a string beyond 2^53 − 1 stays a decimal string (exact); Number() would round it
      case 'determinant': rec[k] = r.determinant ?? null; break;
      case 'alexander': rec[k] = r.alexanderText ?? null; break;
      case 'seifert_circles': rec[k] = r.seifertCircles ?? null; break;
      case 'genus_bound': rec[k] = r.genusBound ?? null; break;
      case 'linking': rec[k] = linkingText(r.linking); break;
      case 'levine_tristram': rec[k] = r.levineTristram ?? null; break;
      // x:multiplicity and x:jump, space-separated; empty when there are none, null when undefined (Δ = 0, or no Seifert matrix)
      case 'unit_roots': rec[k] = r.unitRoots ? r.unitRoots.map((u) => `${u.x}:${u.multiplicity}`).join(' ') : null; break;
      case 'jumps': rec[k] = r.jumps ? r.jumps.map((j) => `${j.x}:${j.jump}`).join(' ') : null; break;
      case 'hyperbolic': {
        const h = r.hyperbolic;
        rec.geometry = h?.geometry ?? null;
        rec.geometry_reason = h?.reason ?? null;
        rec.volume = h?.volume ?? null;
        rec.cusp_shape = h?.cuspShape ? { re: h.cuspShape[0], im: h.cuspShape[1] } : null;
        rec.natural_slope = h?.naturalSlope ?? null;
        rec.cusp_volume = h?.maximalCusp?.volume ?? null;
        rec.meridian_length = h?.maximalCusp?.meridianLength ?? null;
        rec.longitude_length = h?.maximalCusp?.longitudeLength ?? null;
        break;
      }
    }
  }
  return rec;
}
