/**
 * Reference solver, not part of the public surface: all eigenvalues and eigenvectors of a complex Hermitian matrix
 * through its real symmetric embedding. It was the production path before the direct complex reduction
 * (hermitianEigen.ts) and is kept so that tests can compare the two on the same inputs.
 *
 * Method: A = R + iS is Hermitian exactly when M = [[R, −S], [S, R]] (2n×2n) is real symmetric. If A z = λ z with
 * z = x + iy then M [x; y] = λ [x; y] and M [−y; x] = λ [−y; x], so every eigenvalue of A appears twice in M, and an
 * eigenspace of A of dimension m corresponds to an eigenspace of M of dimension 2m that is closed under
 * J = [[0, −I], [I, 0]] (multiplication by i). M is the standard real form of the complex matrix A; the symmetric
 * solver underneath is Golub & Van Loan, Matrix Computations, 4th ed. 2013, §8.3.
 *
 * M is solved by Householder tridiagonalization and implicit QL (symmetricTridiagonalQl). Its eigenvalues, sorted,
 * are grouped into clusters whose consecutive gaps are below a tolerance (max(1e-12, 64nε)·‖A‖₂, far above the
 * ~1e-14·‖A‖₂ by which the two copies of an eigenvalue differ in practice), always of even size; a cluster of 2m
 * values yields m eigenvalues of A, the means of consecutive pairs. An orthonormal complex basis of each cluster's
 * eigenspace, orthogonal to the earlier clusters, is extracted by complexClusterBasis (complex Gram–Schmidt with
 * pivoting). Within a cluster of distinct but closer-than-tolerance eigenvalues the vectors are a basis of the
 * cluster's invariant subspace, so their residuals are bounded by the cluster's width.
 *
 * Output: as hermitianEigen (values descending, column k of vectorsRe/vectorsIm the unit eigenvector of values[k],
 * phase fixed by writePhasedColumn). The input is first replaced by its Hermitian part (A + Aᴴ)/2. A real input is
 * embedded too (no shortcut), so that the reference always exercises the same path.
 */

import { checkSquareComplex } from './dense';
import { appendClusterBasis } from './complexClusterBasis';
import { writePhasedColumn } from './eigenvectorPhase';
import type { HermitianEigen } from './hermitianEigen';
import { symmetricTridiagonalQl } from './symmetricTridiagonalQl';

const EPS = 2 ** -52;

export function hermitianEigenByEmbedding(re: Float64Array, im: Float64Array | null, n: number): HermitianEigen {
  checkSquareComplex('hermitianEigenByEmbedding', re, im, n);
  const big = 2 * n;
  const m = new Float64Array(big * big);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) {
      const r = 0.5 * (re[i * n + j] + re[j * n + i]);
      const s = im === null ? 0 : 0.5 * (im[i * n + j] - im[j * n + i]);
      m[i * big + j] = r;
      m[(i + n) * big + j + n] = r;
      m[(i + n) * big + j] = s;
      m[i * big + j + n] = -s;
    }
  }
  const eig = symmetricTridiagonalQl(m, big);
  const w = eig.values;
  const scale = Math.max(Math.abs(w[0]), Math.abs(w[big - 1]));
  const tol = Math.max(1e-12, 32 * big * EPS) * scale;

  const values = new Float64Array(n);
  // Row k of (rowsRe, rowsIm) is eigenvector k while the basis is being built.
  const rowsRe = new Float64Array(n * n);
  const rowsIm = new Float64Array(n * n);
  let out = 0;
  let start = 0;
  while (start < big) {
    let end = start + 1;
    // Extend while the gap is small, and always to an even size: the two copies of an eigenvalue belong together.
    while (end < big && (w[end - 1] - w[end] <= tol || (end - start) % 2 === 1)) end++;
    const next = appendClusterBasis(eig.vectorRows, start, end, n, rowsRe, rowsIm, out);
    for (let j = 0; j < next - out; j++) values[out + j] = 0.5 * (w[start + 2 * j] + w[start + 2 * j + 1]);
    out = next;
    start = end;
  }
  const vectorsRe = new Float64Array(n * n);
  const vectorsIm = new Float64Array(n * n);
  for (let k = 0; k < n; k++) {
    writePhasedColumn(rowsRe.subarray(k * n, k * n + n), rowsIm.subarray(k * n, k * n + n), n, k, vectorsRe, vectorsIm);
  }
  return { values, vectorsRe, vectorsIm };
}
