import { SurmiseError } from '../errors.ts';
import type { ReportInput, ReportOptions } from './types.ts';

export interface ResolvedOptions {
  seed: number;
  maxPoints: number;
  scatterMode: 'bin' | 'sample';
  png: boolean;
  pngScale: number;
}

/** Check the options once, at the entry point (code `report.badOption`, naming the option). */
export function resolveOptions(o: ReportOptions = {}): ResolvedOptions {
  const bad = (name: string, want: string, got: unknown) =>
    new SurmiseError('report.badOption', `report option ${name}: expected ${want}, got ${JSON.stringify(got)}`);
  const seed = o.seed ?? 0;
  if (!Number.isInteger(seed) || seed < 0 || seed > 0xffffffff) throw bad('seed', 'an integer from 0 to 4294967295', o.seed);
  const maxPoints = o.maxPoints ?? 3000;
  if (!Number.isInteger(maxPoints) || maxPoints < 10 || maxPoints > 200_000) throw bad('maxPoints', 'an integer from 10 to 200000', o.maxPoints);
  const scatterMode = o.scatterMode ?? 'bin';
  if (scatterMode !== 'bin' && scatterMode !== 'sample') throw bad('scatterMode', "'bin' or 'sample'", o.scatterMode);
  const png = o.png ?? true;
  if (typeof png !== 'boolean') throw bad('png', 'true or false', o.png);
  const pngScale = o.pngScale ?? 2;
  if (typeof pngScale !== 'number' || !(pngScale > 0 && pngScale <= 8)) throw bad('pngScale', 'a number in (0, 8]', o.pngScale);
  return { seed, maxPoints, scatterMode, png, pngScale };
}

/**
 * Check the shape of the input where a mistake would otherwise give a wrong plot silently:
 * required header fields and paired arrays of equal length (code `report.badInput`, naming the
 * field path).
 */
export function validateInput(input: ReportInput): void {
  const fail = (path: string, msg: string) => new SurmiseError('report.badInput', `report input ${path}: ${msg}`);
  if (typeof input !== 'object' || input === null) throw fail('(root)', 'expected an object');
  if (typeof input.title !== 'string') throw fail('title', 'expected a string');
  if (typeof input.createdAt !== 'string') throw fail('createdAt', 'expected a string');
  if (!input.tool || typeof input.tool.version !== 'string') throw fail('tool.version', 'expected a string');
  if (!input.input || typeof input.input.path !== 'string' || typeof input.input.sha256 !== 'string') {
    throw fail('input', 'expected { path, sha256, rows }');
  }
  const same = (path: string, a: { length: number }, pathB: string, b: { length: number }) => {
    if (a.length !== b.length) throw fail(path, `has ${a.length} values but ${pathB} has ${b.length}`);
  };
  const s = input.scatter;
  if (s) {
    same('scatter.x', s.x, 'scatter.y', s.y);
    if (s.color) same('scatter.color', s.color, 'scatter.x', s.x);
  }
  const p = input.rank?.predictions;
  if (p) same('rank.predictions.actual', p.actual, 'rank.predictions.predicted', p.predicted);
  input.fits?.forEach((f, i) => {
    f.residuals?.byTerm.forEach((t, k) =>
      same(`fits[${i}].residuals.byTerm[${k}].x`, t.x, `fits[${i}].residuals.residual`, f.residuals!.residual),
    );
  });
  if (input.search !== undefined && input.searches !== undefined) throw fail('search', 'give one search as `search` or a list as `searches`, not both');
  if (input.searches !== undefined && !Array.isArray(input.searches)) throw fail('searches', 'expected a list');
  input.search?.front.forEach((c, k) => same(`search.front[${k}].coefs`, c.coefs, `search.front[${k}].terms`, c.terms));
  const names = new Set<string>();
  input.searches?.forEach((s, i) => {
    if (s.name !== undefined) {
      if (names.has(s.name)) throw fail(`searches[${i}].name`, `'${s.name}' names an earlier search too`);
      names.add(s.name);
    }
    s.front.forEach((c, k) => same(`searches[${i}].front[${k}].coefs`, c.coefs, `searches[${i}].front[${k}].terms`, c.terms));
  });
  input.bounds?.forEach((b, i) =>
    b.results.forEach((r, j) => {
      if (r.points) same(`bounds[${i}].results[${j}].points.by`, r.points.by, `bounds[${i}].results[${j}].points.ratio`, r.points.ratio);
    }),
  );
}
