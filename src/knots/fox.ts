/**
 * Alexander polynomial of a PD code from the Wirtinger presentation and Fox free calculus
 * (R. H. Fox, "Free differential calculus II", Ann. of Math. 59 (1954); Rolfsen, "Knots and
 * Links", §7.F). Arcs run from one under-crossing to the next. At a crossing with over-arc k,
 * incoming under-arc a and outgoing under-arc b, the abelianised Fox row is
 *     positive crossing: (1 − t)·x_k + t·x_a − x_b,   negative crossing: (1 − t)·x_k − x_a + t·x_b.
 * Deleting one row and one column leaves a matrix whose determinant is Δ(t) up to a unit ±t^k.
 */
import type { PDInfo } from './pd.ts';
import { pencilDeterminant } from './poly.ts';

/**
 * Unnormalised Alexander polynomial (t^0 first) of a validated PD code; [0n] for a split
 * diagram. Exact (BigInt determinants at t = 0..n−1 and interpolation).
 */
export function foxAlexander(info: PDInfo, freeLoops = 0): bigint[] {
  const n = info.nCrossings;
  if (n === 0) return freeLoops <= 1 ? [1n] : [0n];
  if (info.nPieces > 1 || freeLoops > 0) return [0n];
  // arcs: union the two over-slot edges of each crossing
  const parent = Array.from({ length: info.nEdges }, (_, k) => k);
  const find = (x: number): number => {
    while (parent[x] !== x) x = parent[x] = parent[parent[x]!]!;
    return x;
  };
  for (let c = 0; c < n; c++) parent[find(info.edge[4 * c + 1]!)] = find(info.edge[4 * c + 3]!);
  const arcId = new Map<number, number>();
  for (let e = 0; e < info.nEdges; e++) if (!arcId.has(find(e))) arcId.set(find(e), arcId.size);
  const nArcs = arcId.size;
  if (nArcs !== n) return [0n]; // a component passing only over the others: the link is split
  const A0 = Array.from({ length: n }, () => new Array<number>(n).fill(0));
  const A1 = Array.from({ length: n }, () => new Array<number>(n).fill(0));
  for (let c = 0; c < n; c++) {
    const k = arcId.get(find(info.edge[4 * c + 1]!))!;
    const a = arcId.get(find(info.edge[4 * c]!))!;
    const b = arcId.get(find(info.edge[4 * c + 2]!))!;
    A0[c]![k]! += 1;
    A1[c]![k]! -= 1;
    if (info.sign[c]! > 0) {
      A1[c]![a]! += 1;
      A0[c]![b]! -= 1;
    } else {
      A0[c]![a]! -= 1;
      A1[c]![b]! += 1;
    }
  }
  const minor0 = A0.slice(1).map((r) => r.slice(1));
  const minor1 = A1.slice(1).map((r) => r.slice(1));
  return pencilDeterminant(minor0, minor1);
}
