/**
 * Singular values of a real or complex rows×cols matrix.
 *
 * Method: Golub–Kahan bidiagonalization and implicit-shift QR on the bidiagonal (Golub & Van Loan, Matrix
 * Computations, 4th ed. 2013, §8.6; LINPACK dsvdc), through ml-matrix's SingularValueDecomposition without singular
 * vectors. A complex matrix A = R + iS is handled through its real embedding [[R, −S], [S, R]] (2rows×2cols), whose
 * singular values are those of A, each twice (if A = U Σ Vᴴ, the embedding of U and of V are orthogonal and the
 * embedding of Σ is Σ ⊕ Σ); each value is taken once, as the mean of the two copies.
 *
 * Output: min(rows, cols) singular values in descending order.
 */

import { Matrix, SingularValueDecomposition } from 'ml-matrix';
import { checkDimension, checkMatrix, isRealPart } from './dense';
import { leadingSymmetricEigen } from './leadingSymmetricEigen';

export function singularValues(re: Float64Array, im: Float64Array | null, rows: number, cols: number): Float64Array {
  checkDimension('singularValues', 'rows', rows);
  checkDimension('singularValues', 'cols', cols);
  checkMatrix('singularValues', 're', re, rows, cols);
  if (im !== null) checkMatrix('singularValues', 'im', im, rows, cols);
  const count = Math.min(rows, cols);

  if (isRealPart(im)) return descending(svdValues(re, rows, cols), count);

  const r2 = 2 * rows;
  const c2 = 2 * cols;
  const emb = new Float64Array(r2 * c2);
  const s = im as Float64Array;
  for (let i = 0; i < rows; i++) {
    for (let j = 0; j < cols; j++) {
      const a = re[i * cols + j];
      const b = s[i * cols + j];
      emb[i * c2 + j] = a;
      emb[(i + rows) * c2 + j + cols] = a;
      emb[(i + rows) * c2 + j] = b;
      emb[i * c2 + j + cols] = -b;
    }
  }
  const doubled = descending(svdValues(emb, r2, c2), 2 * count);
  const out = new Float64Array(count);
  for (let k = 0; k < count; k++) out[k] = 0.5 * (doubled[2 * k] + doubled[2 * k + 1]);
  return out;
}

function svdValues(a: Float64Array, rows: number, cols: number): number[] {
  // The library's QR sweeps have no iteration cap and loop forever on subnormal numbers (a 1e-300 matrix): scale
  // by a power of two (exact) so the largest entry is about 1, and scale the values back.
  let big = 0;
  for (let k = 0; k < a.length; k++) big = Math.max(big, Math.abs(a[k]));
  if (big === 0) return new Array<number>(Math.min(rows, cols)).fill(0);
  const e = Math.round(Math.log2(big));
  const h = Math.trunc(e / 2);
  if (Math.abs(e) > 8) {
    const scaled = a.map((x) => x * 2 ** -h * 2 ** -(e - h));
    return svdValuesUnscaled(scaled, rows, cols).map((v) => v * 2 ** h * 2 ** (e - h));
  }
  return svdValuesUnscaled(a, rows, cols);
}

function svdValuesUnscaled(a: Float64Array, rows: number, cols: number): number[] {
  // ml-matrix's SVD expects at least as many rows as columns; the transpose has the same singular values.
  const tall = rows >= cols;
  const m = tall ? new Matrix(rows, cols) : new Matrix(cols, rows);
  for (let i = 0; i < rows; i++) {
    for (let j = 0; j < cols; j++) {
      if (tall) m.set(i, j, a[i * cols + j]);
      else m.set(j, i, a[i * cols + j]);
    }
  }
  const svd = new SingularValueDecomposition(m, {
    computeLeftSingularVectors: false,
    computeRightSingularVectors: false,
  });
  return svd.diagonal;
}

function descending(values: number[], count: number): Float64Array {
  const sorted = Float64Array.from(values).sort().reverse();
  const out = new Float64Array(count);
  for (let k = 0; k < count; k++) out[k] = Math.max(0, sorted[k] ?? 0);
  return out;
}

/**
 * The largest singular value of a real or complex n×n matrix alone: the square root of the largest eigenvalue of
 * AᵀA (of the real embedding's, for a complex A), found by Lanczos on the product x ↦ Aᵀ(A x) (leadingSymmetricEigen).
 * With the residual at most 1e-13·‖AᵀA‖ the eigenvalue is within that much of the largest one (Golub & Van Loan
 * §8.1.2: a Ritz value lies within the residual norm of an eigenvalue), so σ_max is accurate to about 1e-13
 * relative, several times cheaper than all singular values. Small matrices, and the rare case where Lanczos does
 * not meet the tolerance, go to the full singular value decomposition.
 */
export function largestSingularValue(re: Float64Array, im: Float64Array | null, n: number): number {
  if (n <= 64) return singularValues(re, im, n, n)[0] ?? 0;
  // AᵀA squares the entries: scale A by a power of two so that the product neither underflows nor overflows.
  let big = 0;
  for (let k = 0; k < re.length; k++) big = Math.max(big, Math.abs(re[k]), im ? Math.abs(im[k]) : 0);
  if (big === 0) return 0;
  const e = Math.round(Math.log2(big));
  if (Math.abs(e) > 8) {
    const h = Math.trunc(e / 2);
    const sRe = re.map((x) => x * 2 ** -h * 2 ** -(e - h));
    const sIm = im ? im.map((x) => x * 2 ** -h * 2 ** -(e - h)) : null;
    return largestSingularValue(sRe, sIm, n) * 2 ** h * 2 ** (e - h);
  }
  const complex = !isRealPart(im);
  const s = im as Float64Array;
  const m = complex ? 2 * n : n;
  const y = new Float64Array(m);
  // Real embedding [[R, −S], [S, R]] of a complex A: x = (xr, xi) ↦ (R xr − S xi, S xr + R xi), transpose likewise.
  const matvec = (x: Float64Array, out: Float64Array): void => {
    y.fill(0);
    for (let i = 0; i < n; i++) {
      let ar = 0;
      let ai = 0;
      const row = i * n;
      for (let j = 0; j < n; j++) {
        ar += re[row + j] * x[j];
        if (complex) {
          ar -= s[row + j] * x[n + j];
          ai += s[row + j] * x[j] + re[row + j] * x[n + j];
        }
      }
      y[i] = ar;
      if (complex) y[n + i] = ai;
    }
    out.fill(0);
    for (let i = 0; i < n; i++) {
      const row = i * n;
      const yr = y[i];
      const yi = complex ? y[n + i] : 0;
      for (let j = 0; j < n; j++) {
        out[j] += re[row + j] * yr;
        if (complex) {
          out[j] += s[row + j] * yi;
          out[n + j] += -s[row + j] * yr + re[row + j] * yi;
        }
      }
    }
  };
  const r = leadingSymmetricEigen(matvec, m, 1, { tol: 1e-13 });
  if (!r.converged) return singularValues(re, im, n, n)[0] ?? 0;
  return Math.sqrt(Math.max(0, r.values[0]));
}
