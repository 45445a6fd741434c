/**
 * Grow the space of terms level by level in complexity and screen it, as in SISSO (R. Ouyang,
 * S. Curtarolo, E. Ahmetcik, M. Scheffler, L. M. Ghiringhelli, "SISSO: a compressed-sensing method
 * for identifying the best low-dimensional descriptor in an immensity of offered candidates",
 * Phys. Rev. Materials 2, 083802, 2018): every term of complexity c is built from terms of lower
 * complexity by one operation of grammar.ts, and each is scored by sure independence screening
 * (J. Fan & J. Lv, JRSS B 70, 2008): |correlation| with the target and with the residuals of the
 * best smaller models. Terms that compute the same values as an earlier (simpler) one are merged
 * (observational equivalence, as in enumerative program synthesis: A. Udupa et al., PLDI 2013);
 * for the regression pool, terms equal up to an affine map a + b·t are merged too (the linear
 * coefficients absorb it). Every level is complete while it fits the per-level parent budget;
 * beyond it only the best-screened terms of a level are used to build the next (a beam).
 */
import { applyNode, complexity, type Tree } from './tree.ts';
import { BINARY_COST, type BinaryKind, type UnaryOp } from './grammar.ts';
import type { SkippedTerm } from './bases.ts';

export interface ScreenedTerm {
  tree: Tree;
  complexity: number;
  /** Values on the screening rows. */
  values: Float64Array;
  /** |correlation| with each screening target. */
  scores: Float64Array;
  /** The largest multiple correlation of a target on [term, term²]: the rank among parents. */
  best: number;
  /** Order of generation (simpler first): a stable tie-break. */
  id: number;
}

export interface EnumerateOptions {
  /** Base quantities' values on the screening rows, with their trees. */
  bases: Array<{ tree: Tree; values: Float64Array }>;
  /** Centred targets on the screening rows (the target, then residuals). */
  targets: Float64Array[];
  unary: UnaryOp[];
  maxComplexity: number;
  /** Terms of one level kept to build the next (the beam width). */
  parentsPerLevel: number;
  /** Terms kept per target for the subset search. */
  poolPerTarget: number;
  /** Terms kept per level (best by the first target) whatever their rank overall. */
  perLevel: number;
  /** Called every few hundred terms; returns true to stop (time budget). */
  stop: () => boolean;
  progress?: (level: number) => void;
  /** How a skipped term names screening row i (default `screening row i+1`). */
  rowName?: (i: number) => string;
}

export interface EnumerateResult {
  /** The screened terms: best per target, and best per level; each once. */
  pool: ScreenedTerm[];
  /** For each target, the pool indices best first. */
  byTarget: number[][];
  /** Terms computed, distinct ones after merging, and those set aside after the first stage. */
  nGenerated: number;
  nQuick: number;
  nDistinct: number;
  /** Levels finished; the level the budget stopped in, if any. */
  levelsDone: number;
  stoppedInLevel: number | null;
  /** Levels whose terms did not all serve as parents (the beam cut them). */
  beamLevels: number[];
  /** Float64 cells held at the peak (parents and pool). */
  cellsHeld: number;
  /** Unary operations undefined on a base quantity, with the reason. */
  skipped: SkippedTerm[];
}

const f32 = new Float32Array(1);
const u32 = new Uint32Array(f32.buffer);

/** Two 32-bit FNV-style hashes of the first `m` values (shifted, scaled, rounded to float32), folded into one safe integer. */
function hashValues(v: Float64Array, m: number, shift: number, scale: number, sign: number): number {
  let h1 = 0x811c9dc5 | 0;
  let h2 = 0x01000193 | 0;
  for (let i = 0; i < m; i++) {
    f32[0] = sign * (v[i]! - shift) * scale;
    const b = u32[0]!;
    h1 = Math.imul(h1 ^ b, 0x01000193);
    h2 = Math.imul(h2 + b, 0x5bd1e995) ^ (h2 >>> 15);
  }
  return (h1 >>> 0) * 2097152 + ((h2 >>> 0) & 0x1fffff);
}

/**
 * For the values f on rows 0..len−1 (mean `mean`) and centred targets t: |corr(f, t)| into `lin`,
 * and into `quad` the multiple correlation √R² of t on [f, f²] (centred), which also sees a target
 * that depends on f evenly (cos(a − b) on a − b). Returns the largest `quad`.
 */
function scoreTerm(f: Float64Array, len: number, mean: number, targets: Float64Array[], norms: number[], lin: Float64Array, quad: Float64Array): number {
  let s2 = 0, s3 = 0, s4 = 0;
  for (let i = 0; i < len; i++) {
    const d = f[i]! - mean;
    const d2 = d * d;
    s2 += d2; s3 += d2 * d; s4 += d2 * d2;
  }
  const g22 = s4 - (s2 * s2) / len;
  const det = s2 * g22 - s3 * s3;
  let best = 0;
  for (let t = 0; t < targets.length; t++) {
    const y = targets[t]!;
    let a = 0, b = 0;
    for (let i = 0; i < len; i++) {
      const d = f[i]! - mean;
      const w = d * y[i]!;
      a += w; b += w * d;
    }
    const nt = norms[t]!;
    lin[t] = nt > 0 && s2 > 0 ? Math.abs(a) / (Math.sqrt(s2) * nt) : 0;
    const r2 = det > 1e-12 * s2 * g22 && nt > 0 ? (a * a * g22 - 2 * a * b * s3 + b * b * s2) / (det * nt * nt) : lin[t]! * lin[t]!;
    quad[t] = Math.sqrt(Math.min(Math.max(r2, lin[t]! * lin[t]!), 1));
    if (quad[t]! > best) best = quad[t]!;
  }
  return best;
}

/** Grow and screen; see the module comment. */
export function enumerateTerms(o: EnumerateOptions): EnumerateResult {
  const n = o.bases[0]?.values.length ?? 0;
  const T = o.targets.length;
  const tNorm = o.targets.map((t) => Math.sqrt(t.reduce((s2, x) => s2 + x * x, 0)));
  const exact = new Set<number>();
  const affine = new Set<number>();
  const pool: ScreenedTerm[] = [];
  const perTarget: ScreenedTerm[][] = o.targets.map(() => []);
  const threshold = new Float64Array(T);
  const levelBest: ScreenedTerm[][] = [];
  const parents: ScreenedTerm[][] = [[]];
  const skipped: SkippedTerm[] = [];
  const beamLevels: number[] = [];
  let nGenerated = 0;
  let nextId = 0;
  let stopped = false;
  let cellsHeld = 0;
  const scratch = new Float64Array(n);
  // terms are compared on the first 256 screening rows (a seeded random sample of the selection rows)
  const hashRows = Math.min(n, 256);
  const scores = new Float64Array(T);
  const quad = new Float64Array(T);

  const prune = (list: ScreenedTerm[], t: number, keep: number): ScreenedTerm[] => {
    list.sort((a, b) => b.scores[t]! - a.scores[t]! || a.id - b.id);
    return list.slice(0, keep);
  };
  const pruneBest = (list: ScreenedTerm[], keep: number): ScreenedTerm[] => {
    list.sort((a, b) => b.best - a.best || a.id - b.id);
    return list.slice(0, keep);
  };
  interface Level { terms: ScreenedTerm[]; cap: number; low: number }

  // first m rows of each target, centred, for the quick first stage
  const tHead = o.targets.map((t) => {
    const h = t.slice(0, hashRows);
    const mu = h.reduce((s2, x) => s2 + x, 0) / hashRows;
    return h.map((x) => x - mu);
  });
  const tHeadNorm = tHead.map((t) => Math.sqrt(t.reduce((s2, x) => s2 + x * x, 0)));
  const stageMargin = 4 / Math.sqrt(hashRows);
  const headScores = new Float64Array(T);
  const headQuad = new Float64Array(T);
  let nQuick = 0;

  /**
   * Score the term `tree`, whose values `fill(lo, hi)` writes into `scratch`, and keep a copy where
   * it ranks. Two stages: on the first m = 256 rows the term is hashed (merging it with an earlier
   * equal or affinely equal one) and its correlations estimated; only a term whose estimate comes
   * within 4 standard errors ((1 − r²)/√m) of a place in some list is computed on every row.
   */
  const emit = (tree: Tree, cx: number, level: Level, bestOfLevel: ScreenedTerm[], fill: (lo: number, hi: number) => void): void => {
    nGenerated++;
    if ((nGenerated & 255) === 0 && o.stop()) stopped = true;
    const m = hashRows;
    fill(0, m);
    // first stage: finiteness, mean and sum of squares about the first value (no cancellation)
    const x0 = scratch[0]!;
    let sum = 0;
    let ss = 0;
    for (let i = 0; i < m; i++) {
      const d = scratch[i]! - x0;
      sum += d;
      ss += d * d;
    }
    if (!Number.isFinite(ss)) return;
    const meanM = x0 + sum / m;
    ss -= (sum * sum) / m;
    if (!(ss > 1e-24 * (meanM * meanM * m + 1e-300))) return; // constant on these rows
    const he = hashValues(scratch, m, 0, 1, 1);
    if (exact.has(he)) return;
    exact.add(he);
    const sdM = Math.sqrt(ss);
    let sign = 1;
    for (let i = 0; i < m; i++) {
      const z = (scratch[i]! - meanM) / sdM;
      if (Math.abs(z) > 1e-4) { sign = z > 0 ? 1 : -1; break; }
    }
    const ha = hashValues(scratch, m, meanM, 1 / sdM, sign);
    const fresh = !affine.has(ha);
    affine.add(ha);
    if (m < n) {
      let need = level.low;
      if (fresh) {
        for (let t = 0; t < T; t++) need = Math.min(need, perTarget[t]!.length < o.poolPerTarget ? -1 : threshold[t]!);
        need = Math.min(need, bestOfLevel.length < o.perLevel ? -1 : bestOfLevel[bestOfLevel.length - 1]!.scores[0]!);
      }
      if (need > 0) {
        const est = scoreTerm(scratch, m, meanM, tHead, tHeadNorm, headScores, headQuad);
        if (est + stageMargin * (1 - est * est) + 0.01 < need) { nQuick++; return; }
      }
      fill(m, n);
    }
    sum = 0;
    ss = 0;
    for (let i = 0; i < n; i++) {
      const d = scratch[i]! - x0;
      sum += d;
      ss += d * d;
    }
    if (!Number.isFinite(ss)) return;
    const mean = x0 + sum / n;
    ss -= (sum * sum) / n;
    if (!(ss > 1e-24 * (mean * mean * n + 1e-300))) return;
    const sd = Math.sqrt(ss);
    const best = scoreTerm(scratch, n, mean, o.targets, tNorm, scores, quad);
    const wantParent = best > level.low;
    let wantPool = false;
    if (fresh) for (let t = 0; t < T; t++) if (perTarget[t]!.length < o.poolPerTarget || scores[t]! > threshold[t]!) wantPool = true;
    const wantLevel = fresh && (bestOfLevel.length < o.perLevel || scores[0]! > bestOfLevel[bestOfLevel.length - 1]!.scores[0]!);
    if (!wantParent && !wantPool && !wantLevel) return;
    const term: ScreenedTerm = { tree, complexity: cx, values: scratch.slice(), scores: scores.slice(), best, id: nextId++ };
    if (wantParent) {
      level.terms.push(term);
      if (level.terms.length >= 2 * level.cap) {
        level.terms = pruneBest(level.terms, level.cap);
        level.low = level.terms[level.terms.length - 1]!.best;
      }
    }
    if (wantPool) {
      for (let t = 0; t < T; t++) {
        const list = perTarget[t]!;
        if (list.length < o.poolPerTarget || scores[t]! > threshold[t]!) {
          list.push(term);
          if (list.length >= 2 * o.poolPerTarget) {
            perTarget[t] = prune(list, t, o.poolPerTarget);
            threshold[t] = perTarget[t]![o.poolPerTarget - 1]!.scores[t]!;
          }
        }
      }
    }
    if (wantLevel) {
      bestOfLevel.push(term);
      bestOfLevel.sort((a, b) => b.scores[0]! - a.scores[0]! || a.id - b.id);
      if (bestOfLevel.length > o.perLevel) bestOfLevel.length = o.perLevel;
    }
  };

  let levelsDone = 0;
  let stoppedInLevel: number | null = null;
  for (let c = 1; c <= o.maxComplexity && !stopped; c++) {
    const cap = o.parentsPerLevel;
    const level: Level = { terms: [], cap: Number.MAX_SAFE_INTEGER / 4, low: -1 };
    const bestOfLevel: ScreenedTerm[] = [];
    const baseTerms: ScreenedTerm[] = [];
    for (const b of o.bases) {
      if (complexity(b.tree) !== c) continue;
      const before = level.terms.length;
      emit(b.tree, c, level, bestOfLevel, (lo, hi) => scratch.set(b.values.subarray(lo, hi), lo));
      if (level.terms.length > before) baseTerms.push(level.terms[level.terms.length - 1]!);
    }
    level.cap = cap;
    for (const op of o.unary) {
      const from = parents[c - op.cost];
      if (!from || stopped) continue;
      for (const p of from) {
        if (!op.accepts(p.tree)) continue;
        const tree = op.make(p.tree);
        let bad = -1;
        let why: string | null = null;
        for (let i = 0; i < n && why === null; i++) { why = op.undefinedAt(p.values[i]!); bad = i; }
        if (why !== null) {
          if (p.tree.op === 'base') skipped.push({ name: op.label(p.tree.text), reason: `'${p.tree.text}' ${why} at ${o.rowName ? o.rowName(bad) : `screening row ${bad + 1}`}` });
          continue;
        }
        emit(tree, c, level, bestOfLevel, (lo, hi) => op.apply(p.values, scratch, lo, hi));
        if (stopped) break;
      }
    }
    for (const kind of ['mul', 'div', 'add', 'sub'] as BinaryKind[]) {
      const rest = c - BINARY_COST[kind];
      const ordered = kind === 'div' || kind === 'sub';
      for (let c1 = 1; c1 < rest && !stopped; c1++) {
        const c2 = rest - c1;
        if (!ordered && c1 > c2) break;
        const A = parents[c1];
        const B = parents[c2];
        if (!A || !B) continue;
        for (let i = 0; i < A.length && !stopped; i++) {
          for (let j = !ordered && c1 === c2 ? i + 1 : 0; j < B.length; j++) {
            const a = A[i]!;
            const b = B[j]!;
            if (a === b) continue;
            const tree: Tree = { op: kind, a: a.tree, b: b.tree };
            emit(tree, c, level, bestOfLevel, (lo, hi) => applyNode(tree, a.values, b.values, scratch, lo, hi));
            if (stopped) break;
          }
        }
      }
    }
    if (stopped) { stoppedInLevel = c; break; }
    let kept = level.terms;
    if (kept.length > level.cap) kept = pruneBest(kept, level.cap);
    for (const b of baseTerms) if (!kept.includes(b)) kept.push(b); // base quantities always build on
    if (level.low >= 0 || kept.length < level.terms.length) beamLevels.push(c);
    parents[c] = kept;
    levelBest[c] = bestOfLevel;
    levelsDone = c;
    o.progress?.(c);
  }
  // the pool: the best per target, then the best per level, each term once
  const seen = new Set<number>();
  const byTarget: number[][] = [];
  const place = (t: ScreenedTerm): number => {
    if (!seen.has(t.id)) { seen.add(t.id); pool.push(t); }
    return pool.findIndex((p) => p.id === t.id);
  };
  perTarget.forEach((list, t) => {
    const best = prune(list, t, o.poolPerTarget);
    byTarget.push(best.map(place));
  });
  for (const lb of levelBest) if (lb) for (const t of lb) place(t);
  const held = new Set<number>(pool.map((t) => t.id));
  for (const level of parents) for (const t of level) held.add(t.id);
  cellsHeld = held.size * n;
  return { pool, byTarget, nGenerated, nQuick, nDistinct: exact.size, levelsDone, stoppedInLevel, beamLevels, cellsHeld, skipped };
}
