/**
 * The linear-algebra layer of the spectral engine: dense eigen- and singular-value solvers on row-major
 * Float64Array matrices, and a matrix-free Lanczos solver for a few leading eigenpairs. Complex matrices are pairs of
 * arrays (real part, imaginary part); an imaginary part of null means a real matrix. One algorithm per file; each
 * file names its published method.
 */

export { symmetricEigen, type SymmetricEigen } from './symmetricEigen';
export { hermitianEigen, type HermitianEigen } from './hermitianEigen';
export { generalEigen, type GeneralEigen } from './generalEigen';
export { singularValues, largestSingularValue } from './singularValues';
export { leadingSymmetricEigen, type LeadingEigen, type LeadingEigenOptions } from './leadingSymmetricEigen';
export { matmul, transpose, hermitianDefect, frobeniusNorm, identity, entriesFinite } from './dense';
