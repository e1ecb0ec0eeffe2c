/**
 * All eigenvalues and eigenvectors of a real symmetric matrix by Householder tridiagonalization followed by the
 * implicit QL algorithm with Wilkinson-type shifts.
 *
 * Method: Golub & Van Loan, Matrix Computations, 4th ed. 2013, §8.3 (tridiagonalization, symmetric QR); the
 * procedures tred2 (Martin, Reinsch & Wilkinson) and tql2 (Bowdler, Martin, Reinsch & Wilkinson) of the Handbook for
 * Automatic Computation vol. II, Linear Algebra (1971), as published in EISPACK and JAMA.
 *
 * This is a flat Float64Array version for the hot paths (the Lanczos solver, the reference embedding of a Hermitian
 * matrix). The eigenvector matrix is stored transposed while it is built, so that every inner loop runs along
 * contiguous memory; on return row k of `vectorRows` is eigenvector k. Unlike the published tql2 the QL sweeps are
 * bounded: an eigenvalue that needs more than MAX_SWEEPS sweeps is accepted as it stands and `converged` is set to
 * false. The QL stage is also exported alone (`tridiagonalQl`) for a caller that reduces its matrix to tridiagonal
 * form itself and brings its own starting transform, with rows of any length (the complex Hermitian solver keeps
 * the real and imaginary parts of a complex vector side by side in one row; the rotations are real).
 */

import { hypot2 } from './dense';

const MAX_SWEEPS = 60;
const EPS = 2 ** -52;

export interface SymmetricEigenRows {
  /** Eigenvalues in descending order. */
  values: Float64Array;
  /** n×n row-major; row k is the unit eigenvector of values[k] (n rows of rowLength from tridiagonalQl). */
  vectorRows: Float64Array;
  /** False when some QL sweep hit the iteration bound (the values are then less accurate). */
  converged: boolean;
}

/**
 * Eigen-decomposes the real symmetric n×n matrix `a` (row-major; only symmetric input gives meaningful results,
 * the caller symmetrizes). `a` is not modified. Sizes are the caller's responsibility.
 */
export function symmetricTridiagonalQl(a: Float64Array, n: number): SymmetricEigenRows {
  // w[c·n + r] holds the working matrix entry V(r, c); a is symmetric so the initial copy needs no transposition.
  const w = Float64Array.from(a);
  const d = new Float64Array(n);
  const e = new Float64Array(n);
  tridiagonalize(w, d, e, n);
  const converged = implicitQl(w, d, e, n);
  return sortDescending(w, d, n, converged, n);
}

/**
 * The implicit QL stage alone, on the real symmetric tridiagonal matrix T with diagonal `d` (length n) and
 * subdiagonal e[i] = T(i, i−1) for i = 1..n−1 (e[0] is ignored); `d` and `e` are overwritten. `rows` holds n rows of
 * length `rowLength` (≥ 1), row c being column c of a starting transform U (in whatever real coordinates the caller
 * chooses); every plane rotation of the QL sweeps is applied to it, so that on return row k of `vectorRows` is U
 * times the eigenvector of T for values[k]. With U = I and rowLength = n these are the eigenvectors of T. `rows` is
 * used as workspace.
 */
export function tridiagonalQl(
  d: Float64Array,
  e: Float64Array,
  rows: Float64Array,
  n: number,
  rowLength: number,
): SymmetricEigenRows {
  const converged = implicitQl(rows, d, e, n, rowLength);
  return sortDescending(rows, d, n, converged, rowLength);
}

/** tred2: on return d is the diagonal, e[1..n-1] the subdiagonal, and w (transposed) the accumulated transform. */
function tridiagonalize(w: Float64Array, d: Float64Array, e: Float64Array, n: number): void {
  for (let j = 0; j < n; j++) d[j] = w[j * n + n - 1];
  for (let i = n - 1; i > 0; i--) {
    let scale = 0;
    let h = 0;
    for (let k = 0; k < i; k++) scale += Math.abs(d[k]);
    if (scale === 0) {
      e[i] = d[i - 1];
      for (let j = 0; j < i; j++) {
        d[j] = w[j * n + i - 1];
        w[j * n + i] = 0;
        w[i * n + j] = 0;
      }
    } else {
      for (let k = 0; k < i; k++) {
        d[k] /= scale;
        h += d[k] * d[k];
      }
      let f = d[i - 1];
      let g = Math.sqrt(h);
      if (f > 0) g = -g;
      e[i] = scale * g;
      h -= f * g;
      d[i - 1] = f - g;
      for (let j = 0; j < i; j++) e[j] = 0;
      for (let j = 0; j < i; j++) {
        const col = j * n;
        f = d[j];
        w[i * n + j] = f;
        g = e[j] + w[col + j] * f;
        for (let k = j + 1; k < i; k++) {
          const v = w[col + k];
          g += v * d[k];
          e[k] += v * f;
        }
        e[j] = g;
      }
      f = 0;
      for (let j = 0; j < i; j++) {
        e[j] /= h;
        f += e[j] * d[j];
      }
      const hh = f / (h + h);
      for (let j = 0; j < i; j++) e[j] -= hh * d[j];
      for (let j = 0; j < i; j++) {
        const col = j * n;
        f = d[j];
        g = e[j];
        for (let k = j; k < i; k++) w[col + k] -= f * e[k] + g * d[k];
        d[j] = w[col + i - 1];
        w[col + i] = 0;
      }
    }
    d[i] = h;
  }
  // Accumulate the Householder transformations.
  for (let i = 0; i < n - 1; i++) {
    const coli = i * n;
    const next = (i + 1) * n;
    w[coli + n - 1] = w[coli + i];
    w[coli + i] = 1;
    const h = d[i + 1];
    if (h !== 0) {
      for (let k = 0; k <= i; k++) d[k] = w[next + k] / h;
      for (let j = 0; j <= i; j++) {
        const col = j * n;
        let g = 0;
        for (let k = 0; k <= i; k++) g += w[next + k] * w[col + k];
        for (let k = 0; k <= i; k++) w[col + k] -= g * d[k];
      }
    }
    for (let k = 0; k <= i; k++) w[next + k] = 0;
  }
  for (let j = 0; j < n; j++) {
    d[j] = w[j * n + n - 1];
    w[j * n + n - 1] = 0;
  }
  w[n * n - 1] = 1;
  e[0] = 0;
}

/**
 * tql2 with a sweep bound; returns false if some eigenvalue did not converge within MAX_SWEEPS sweeps. The rotations
 * act on the rows of w, each `len` long (n for the eigenvectors themselves).
 */
function implicitQl(w: Float64Array, d: Float64Array, e: Float64Array, n: number, len: number = n): boolean {
  let converged = true;
  for (let i = 1; i < n; i++) e[i - 1] = e[i];
  e[n - 1] = 0;
  let f = 0;
  let tst1 = 0;
  for (let l = 0; l < n; l++) {
    tst1 = Math.max(tst1, Math.abs(d[l]) + Math.abs(e[l]));
    let m = l;
    while (m < n - 1 && Math.abs(e[m]) > EPS * tst1) m++;
    if (m > l) {
      let sweeps = 0;
      do {
        if (++sweeps > MAX_SWEEPS) {
          converged = false;
          break;
        }
        let g = d[l];
        let p = (d[l + 1] - g) / (2 * e[l]);
        let r = hypot2(p, 1);
        if (p < 0) r = -r;
        d[l] = e[l] / (p + r);
        d[l + 1] = e[l] * (p + r);
        const dl1 = d[l + 1];
        let h = g - d[l];
        for (let i = l + 2; i < n; i++) d[i] -= h;
        f += h;
        p = d[m];
        let c = 1;
        let c2 = c;
        let c3 = c;
        const el1 = e[l + 1];
        let s = 0;
        let s2 = 0;
        for (let i = m - 1; i >= l; i--) {
          c3 = c2;
          c2 = c;
          s2 = s;
          g = c * e[i];
          h = c * p;
          r = hypot2(p, e[i]);
          e[i + 1] = s * r;
          s = e[i] / r;
          c = p / r;
          p = c * d[i] - s * g;
          d[i + 1] = h + s * (c * g + s * d[i]);
          const ci = i * len;
          const ci1 = ci + len;
          for (let k = 0; k < len; k++) {
            const hk = w[ci1 + k];
            const vk = w[ci + k];
            w[ci1 + k] = s * vk + c * hk;
            w[ci + k] = c * vk - s * hk;
          }
        }
        p = (-s * s2 * c3 * el1 * e[l]) / dl1;
        e[l] = s * p;
        d[l] = c * p;
      } while (Math.abs(e[l]) > EPS * tst1);
    }
    d[l] += f;
    e[l] = 0;
  }
  return converged;
}

function sortDescending(
  w: Float64Array,
  d: Float64Array,
  n: number,
  converged: boolean,
  len: number,
): SymmetricEigenRows {
  const order = Array.from({ length: n }, (_, i) => i).sort((x, y) => d[y] - d[x]);
  const values = new Float64Array(n);
  const vectorRows = new Float64Array(n * len);
  for (let k = 0; k < n; k++) {
    const src = order[k];
    values[k] = d[src];
    vectorRows.set(w.subarray(src * len, src * len + len), k * len);
  }
  return { values, vectorRows, converged };
}
