/**
 * All eigenvalues and eigenvectors of a real symmetric matrix.
 *
 * Method: Householder tridiagonalization and implicit symmetric QL (Golub & Van Loan, Matrix Computations, 4th ed.
 * 2013, §8.3; EISPACK tred2/tql2), through ml-matrix's EigenvalueDecomposition with assumeSymmetric. The input is
 * first replaced by its symmetric part (A + Aᵀ)/2, so a slightly asymmetric matrix (rounding in an assembled
 * operator) is handled as the nearest symmetric one in the Frobenius norm.
 *
 * Output: values in descending order; vectors n×n row-major with column k the unit eigenvector of values[k], the
 * columns orthonormal. Each eigenvector's sign is fixed so that its entry of largest modulus is positive.
 */

import { EigenvalueDecomposition, Matrix } from 'ml-matrix';
import { checkDimension, checkMatrix } from './dense';

export interface SymmetricEigen {
  /** Eigenvalues, descending by value. */
  values: Float64Array;
  /** n×n row-major; column k is the unit eigenvector of values[k]; the columns are orthonormal. */
  vectors: Float64Array;
}

export function symmetricEigen(a: Float64Array, n: number): SymmetricEigen {
  checkDimension('symmetricEigen', 'n', n);
  checkMatrix('symmetricEigen', 'a', a, n, n);
  const sym = new Matrix(n, n);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) sym.set(i, j, 0.5 * (a[i * n + j] + a[j * n + i]));
  }
  const evd = new EigenvalueDecomposition(sym, { assumeSymmetric: true });
  const d = evd.realEigenvalues;
  const v = evd.eigenvectorMatrix;
  const order = Array.from({ length: n }, (_, i) => i).sort((x, y) => d[y] - d[x]);
  const values = new Float64Array(n);
  const vectors = new Float64Array(n * n);
  for (let k = 0; k < n; k++) {
    const src = order[k];
    values[k] = d[src];
    let big = 0;
    let sign = 1;
    for (let i = 0; i < n; i++) {
      const x = v.get(i, src);
      if (Math.abs(x) > big) {
        big = Math.abs(x);
        sign = x < 0 ? -1 : 1;
      }
    }
    for (let i = 0; i < n; i++) vectors[i * n + k] = sign * v.get(i, src);
  }
  return { values, vectors };
}
