/**
 * A component that is a meridian of another, seen in the diagram: a component C with exactly two
 * crossings, both with one other component K, over at one and under at the other, the two joined
 * along K by one edge k. C's two edges and k form a theta graph whose two regions away from K's
 * other edges hold nothing (the diagram is connected), so C and k form a local Hopf clasp and C
 * bounds a disk meeting the link once, in k. Then the link is a connected sum L' # (Hopf link):
 * the Hopf link itself (Seifert fibred) or a link whose complement has an essential annulus; in
 * neither case hyperbolic (a hyperbolic 3-manifold has no essential annulus; Thurston 1982).
 */
import type { PDInfo } from '../pd.ts';

export interface MeridianClasp {
  /** The component that clasps (0-based), and the component it clasps. */
  clasp: number;
  around: number;
}

/** The first component clasping one edge of another (see the module comment), or null. */
export function meridianClasp(info: PDInfo): MeridianClasp | null {
  if (info.nComponents < 2 || info.nPieces > 1) return null;
  // per component: the crossings it passes, with its role there (0 under, 1 over; 2 both: a self-crossing)
  const seen: Array<Array<{ c: number; role: number }>> = Array.from({ length: info.nComponents }, () => []);
  for (let c = 0; c < info.nCrossings; c++) {
    const under = info.component[info.edge[4 * c]!]!;
    const over = info.component[info.edge[4 * c + 1]!]!;
    if (under === over) seen[under]!.push({ c, role: 2 });
    else {
      seen[under]!.push({ c, role: 0 });
      seen[over]!.push({ c, role: 1 });
    }
  }
  for (let C = 0; C < info.nComponents; C++) {
    const s = seen[C]!;
    if (s.length !== 2 || s[0]!.role === 2 || s[1]!.role === 2 || s[0]!.role === s[1]!.role) continue;
    const [x, y] = [s[0]!.c, s[1]!.c];
    // the other component at each crossing: its slots are the ones C does not use
    const otherSlots = (c: number, role: number) => (role === 0 ? [1, 3] : [0, 2]).map((t) => 4 * c + t);
    const atX = otherSlots(x, s[0]!.role);
    const atY = otherSlots(y, s[1]!.role);
    const K = info.component[info.edge[atX[0]!]!]!;
    if (K !== info.component[info.edge[atY[0]!]!]!) continue;
    const edgesY = new Set(atY.map((d) => info.edge[d]!));
    if (atX.some((d) => edgesY.has(info.edge[d]!))) return { clasp: C, around: K };
  }
  return null;
}
