export { findBound, type BoundSpec, type BoundResult, type BoundCandidate, type BoundWitness, type BoundStratum, type DropCounts } from './find.ts';
export { boundArrays, type ArrayBound, type ArrayBoundOptions, type Trend, UPPER_PROBABILITIES, LOWER_PROBABILITIES } from './core.ts';
export { quantilesType7, QUANTILE_DEFINITION } from './quantile.ts';
export { equalCountStrata, type Stratum } from './strata.ts';
export { topK } from './topk.ts';
export { slopeInterval, type SlopeFit } from './trend.ts';
export { studentTQuantile, studentTCdf } from '../util/special.ts';
export { selectByKey, selectValues } from './select.ts';
export { formatBound } from './format.ts';
