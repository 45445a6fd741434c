/** The relate stage: least squares by Householder QR, formula fitting and formula search. */
export { lstsq, type LstsqOptions, type LstsqResult, type Collinearity } from './lstsq.ts';
export { pivotedHouseholderQR, singularValues, type PivotedQR } from './qr.ts';
export { studentTQuantile, studentTUpperTail, studentTCdf, logGamma, regularizedBeta, erfc } from '../util/special.ts';
export { simplestRational, simpleFraction, SIMPLE_DENOMINATOR, convergents, type Rational, type SimpleFraction } from './rational.ts';
export { crossValidatedRmse, type CrossValidation } from './crossval.ts';
export { fitRelation, type FitSpec, type FitResult, type FitTerm, type FitNote, type RowRef } from './fit.ts';
export { searchRelations, type SearchSpec, type SearchResult, type SearchCandidate, type SearchNote } from './search.ts';
export { baseQuantities, type BaseQuantity, type SkippedTerm } from './bases.ts';
export { completeRows, type DroppedRows } from './rows.ts';
export { splitRows } from './split-option.ts';
