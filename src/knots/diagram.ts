/**
 * A diagram ready for computation: its PD code (validated), the braid it came from if any, and
 * the number of crossing-free unknotted components (from braid strands no generator touches).
 */
import { SurmiseError } from '../errors.ts';
import { braidClosurePD, type Braid } from './braid.ts';
import { dtToPD } from './dt.ts';
import { analysePD, type Crossing, type PDInfo } from './pd.ts';
import { parseCode, type DiagramKind, type ParsedCode } from './parse.ts';

export interface Diagram {
  kind: DiagramKind;
  pd: Crossing[];
  info: PDInfo;
  freeLoops: number;
  braid?: Braid;
  dt?: number[];
}

/** Build a diagram from a parsed code. */
export function diagramFrom(code: ParsedCode): Diagram {
  if (code.kind === 'braid') {
    const { pd, freeLoops } = braidClosurePD(code.braid);
    return { kind: 'braid', pd, info: analysePD(pd), freeLoops, braid: code.braid };
  }
  if (code.kind === 'dt') {
    const pd = dtToPD(code.dt);
    return { kind: 'dt', pd, info: analysePD(pd), freeLoops: 0, dt: code.dt };
  }
  if (code.pd.length === 0) throw new SurmiseError('knots.parse', 'the PD code has no crossings');
  return { kind: 'pd', pd: code.pd, info: analysePD(code.pd), freeLoops: 0 };
}

/** Parse text and build the diagram. */
export function parseDiagram(text: string, kind?: DiagramKind): Diagram {
  return diagramFrom(parseCode(text, kind));
}
