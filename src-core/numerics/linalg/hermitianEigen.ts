/**
 * All eigenvalues and eigenvectors of a complex Hermitian matrix, directly in complex arithmetic.
 *
 * Method: the scheme of LAPACK ZHEEV (Anderson et al., LAPACK Users' Guide, 3rd ed. 1999, §2.4.4: ZHETRD, ZUNGTR,
 * ZSTEQR), with the tridiagonal stage of Golub & Van Loan, Matrix Computations, 4th ed. 2013, §8.3:
 *
 *  1. A = U T Uᴴ with U unitary and T real symmetric tridiagonal: complex Householder reduction, then a diagonal
 *     unitary scaling that makes the off-diagonal real (hermitianTridiagonal);
 *  2. T = Z Λ Zᵀ by the implicit QL algorithm (tridiagonalQl in symmetricTridiagonalQl); its real plane rotations are
 *     applied straight to the columns of U, real and imaginary parts alike, so the result is V = U Z;
 *  3. the columns of V are the eigenvectors, sorted by descending eigenvalue and phase-normalized.
 *
 * Every step is a unitary similarity, so the eigenvalues are accurate to O(ε‖A‖₂) and V is unitary to O(nε)
 * whatever the spacing of the eigenvalues: repeated and clustered eigenvalues need no special handling, and each
 * eigenvalue of A is found once. (The older route through the real symmetric embedding [[Re A, −Im A], [Im A, Re A]]
 * of order 2n, kept as a test reference in hermitianEigenEmbedding.ts, did about four times the work and had to
 * pair up the doubled eigenvalues.)
 *
 * Output: values descending; vectorsRe/vectorsIm n×n row-major with column k the unit eigenvector of values[k]. Each
 * eigenvector's phase is fixed so that its entry of largest modulus is real and positive. The input is first
 * replaced by its Hermitian part (A + Aᴴ)/2. A real input (im null or all zero) takes the real symmetric route
 * (symmetricTridiagonalQl) and returns an all-zero vectorsIm.
 */

import { checkSquareComplex, isRealPart } from './dense';
import { writePhasedColumn } from './eigenvectorPhase';
import { hermitianTridiagonalize } from './hermitianTridiagonal';
import { symmetricTridiagonalQl, tridiagonalQl } from './symmetricTridiagonalQl';

export interface HermitianEigen {
  /** Eigenvalues, descending by value; each eigenvalue of A listed as often as its multiplicity. */
  values: Float64Array;
  /** Real parts of the eigenvectors: n×n row-major, column k belongs to values[k]. */
  vectorsRe: Float64Array;
  /** Imaginary parts, same layout; the columns vectorsRe + i·vectorsIm are orthonormal in Cⁿ. */
  vectorsIm: Float64Array;
}

export function hermitianEigen(re: Float64Array, im: Float64Array | null, n: number): HermitianEigen {
  checkSquareComplex('hermitianEigen', re, im, n);
  if (isRealPart(im)) return realSymmetricCase(re, n);

  const tri = hermitianTridiagonalize(re, im as Float64Array, n);
  const eig = tridiagonalQl(tri.d, tri.e, tri.columns, n, 2 * n);
  const vectorsRe = new Float64Array(n * n);
  const vectorsIm = new Float64Array(n * n);
  const rows = eig.vectorRows; // row k: [Re v_k, Im v_k]
  for (let k = 0; k < n; k++) {
    const base = 2 * n * k;
    writePhasedColumn(rows.subarray(base, base + n), rows.subarray(base + n, base + 2 * n), n, k, vectorsRe, vectorsIm);
  }
  return { values: eig.values, vectorsRe, vectorsIm };
}

function realSymmetricCase(re: Float64Array, n: number): HermitianEigen {
  const sym = new Float64Array(n * n);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) sym[i * n + j] = 0.5 * (re[i * n + j] + re[j * n + i]);
  }
  const eig = symmetricTridiagonalQl(sym, n);
  const vectorsRe = new Float64Array(n * n);
  const vectorsIm = new Float64Array(n * n);
  const zero = new Float64Array(n);
  for (let k = 0; k < n; k++) {
    writePhasedColumn(eig.vectorRows.subarray(k * n, k * n + n), zero, n, k, vectorsRe, vectorsIm);
  }
  return { values: eig.values, vectorsRe, vectorsIm };
}
