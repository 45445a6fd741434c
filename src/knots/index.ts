/** Knot and link invariants from PD codes, braid words and DT codes (exact arithmetic). */
export { analysePD, writhe, linkingMatrix, canonicalLabels, type Crossing, type PDInfo } from './pd.ts';
export { validateBraid, braidClosurePD, braidSeifertMatrix, burauAlexander, polyMatrixDet, type Braid } from './braid.ts';
export { pdToBraid } from './vogel.ts';
export { dtToPD, validateDT, MAX_DT_CROSSINGS } from './dt.ts';
export { bareissDet, symmetricInertia, symmetricSignature, type Inertia } from './exact.ts';
export {
  pencilDeterminant,
  interpolateIntegerNodes,
  polyDivExact,
  centre,
  laurent,
  exactOut,
  formatLaurent,
  multiplyLaurent,
  valueAtOne,
  valueAtMinusOne,
  isSymmetric,
  type LaurentPolynomial,
} from './poly.ts';
export { gordonLitherland, checkerboard, type GordonLitherland } from './goeritz.ts';
export { foxAlexander } from './fox.ts';
export { levineTristram, hermitianInertia, symmetricEigenvalues } from './levine.ts';
export { alexanderUnitRoots, unitCircleRoots, type UnitRoot, type CircleRoot } from './unitroots.ts';
export { signatureJumps, arcSignatures, levineTristramAt, ROOT_MATCH, type Jump } from './jumps.ts';
export { squareFree, gcdPoly, type SquareFreeFactor } from './intpoly.ts';
export { naturalSlope } from './slope.ts';
export { parseCode, detectKind, splitDiagramLines, checkDiagramSize, MAX_STRANDS, MAX_CROSSINGS, DIAGRAM_KINDS, type DiagramKind, type ParsedCode, type DiagramSource } from './parse.ts';
export { parseDiagram, diagramFrom, type Diagram } from './diagram.ts';
export {
  computeInvariants,
  seifertCircles,
  INVARIANT_NAMES,
  DEFAULT_INVARIANTS,
  type InvariantName,
  type KnotInvariants,
  type ComputeOptions,
} from './invariants.ts';
export {
  randomBraid,
  randomKnotBraid,
  torusBraid,
  fullTwists,
  twistedBraid,
  mirrorBraid,
  braidConnectedSum,
  mirrorPD,
  pdConnectedSum,
  addKink,
  relabelPD,
} from './generate.ts';
