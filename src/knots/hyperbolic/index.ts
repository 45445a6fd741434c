/** Hyperbolic invariants from diagrams: ideal triangulation, gluing equations, volume, cusp shape. */
export { hyperbolicInvariants, GEOMETRY_STATUSES, type Geometry, type HyperbolicInvariants } from './invariants.ts';
export { blochWigner } from './dilog.ts';
export { octahedralDecomposition, linkTriangulations, collapseEdges, isCuspedTriangulation } from './octahedral.ts';
export { combinatorics, isOriented, checkGluings, type Triangulation, type Combinatorics } from './triangulation.ts';
export { gluingEquations, type EquationSystem } from './equations.ts';
export { solveShapes, type NewtonResult } from './newton.ts';
export { twoThree, twoZero } from './moves.ts';
export { findGeometricSolution, SEARCH_DEFAULTS, type SearchOptions } from './search.ts';
export { cuspGeometry, type CuspGeometry } from './peripheral.ts';
export { removeKinks } from './kinks.ts';
export { recogniseTorusBraid } from './torus.ts';
export { recogniseClosure, type Recognition } from './recognise.ts';
export { recognisePeriodicBraid } from './periodic.ts';
export { simplifyClosedBraid, CLOSED_BRAID_DEFAULTS, type ClosedBraidOptions, type ClosedBraidOutcome } from './closedbraid.ts';
export { maximalCusp, MAXIMAL_CUSP_DEFAULTS, type MaximalCusp, type MaximalCuspOptions } from './maxcusp.ts';
