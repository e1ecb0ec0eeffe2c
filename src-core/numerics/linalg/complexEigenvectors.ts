/**
 * Eigenvectors of a complex matrix from its Schur form A = Z T Zᴴ (T upper triangular, Z unitary).
 *
 * Method: Golub & Van Loan, Matrix Computations, 4th ed. 2013, §7.6 (eigenvectors by back-substitution): for
 * λ = T[k, k], solve (T[0:k, 0:k] − λ I) x = −T[0:k, k] with x_k = 1, then v = Z x. As in EISPACK comqr2, a
 * vanishing divisor (a repeated or defective eigenvalue) is replaced by ε‖T‖ so the result stays finite, and the
 * partial solution is rescaled whenever an entry grows past 1e100 to avoid overflow. Each v is normalized to unit
 * 2-norm with the phase making its largest entry real and positive.
 *
 * Inputs are n×n row-major pairs; T's strictly lower part is ignored. Returns the vectors as columns of a new pair of
 * n×n row-major arrays. Sizes are the caller's responsibility.
 */

import type { ComplexMatrixPair } from './complexHessenberg';

const EPS = 2 ** -52;
const BIG = 1e100;

export function schurEigenvectors(
  tRe: Float64Array,
  tIm: Float64Array,
  zRe: Float64Array,
  zIm: Float64Array,
  n: number,
): ComplexMatrixPair {
  let tnorm = 0;
  for (let i = 0; i < n; i++) {
    for (let j = i; j < n; j++) tnorm = Math.max(tnorm, Math.abs(tRe[i * n + j]) + Math.abs(tIm[i * n + j]));
  }
  const small = tnorm > 0 ? EPS * tnorm : Number.MIN_VALUE;
  // Row k of (xRe, xIm) is the triangular eigenvector for T[k, k] (entries 0..k), so every inner loop is contiguous.
  const xRe = new Float64Array(n * n);
  const xIm = new Float64Array(n * n);
  for (let k = 0; k < n; k++) {
    const lr = tRe[k * n + k];
    const li = tIm[k * n + k];
    const xk = k * n;
    xRe[xk + k] = 1;
    for (let i = k - 1; i >= 0; i--) {
      const row = i * n;
      let sr = tRe[row + k];
      let si = tIm[row + k];
      for (let j = i + 1; j < k; j++) {
        const ar = tRe[row + j];
        const ai = tIm[row + j];
        const br = xRe[xk + j];
        const bi = xIm[xk + j];
        sr += ar * br - ai * bi;
        si += ar * bi + ai * br;
      }
      let dr = tRe[row + i] - lr;
      let di = tIm[row + i] - li;
      if (Math.abs(dr) + Math.abs(di) < small) {
        dr = small;
        di = 0;
      }
      // x_i = −s / d
      const d2 = dr * dr + di * di;
      const xr = -(sr * dr + si * di) / d2;
      const xi = -(si * dr - sr * di) / d2;
      xRe[xk + i] = xr;
      xIm[xk + i] = xi;
      const mag = Math.abs(xr) + Math.abs(xi);
      if (mag > BIG) {
        const f = 1 / mag;
        for (let j = i; j <= k; j++) {
          xRe[xk + j] *= f;
          xIm[xk + j] *= f;
        }
      }
    }
  }
  // V = Z X: v_k = Σ_{j ≤ k} Z[:, j] x_k[j].
  const vRe = new Float64Array(n * n);
  const vIm = new Float64Array(n * n);
  for (let r = 0; r < n; r++) {
    const row = r * n;
    for (let k = 0; k < n; k++) {
      const xk = k * n;
      let sr = 0;
      let si = 0;
      for (let j = 0; j <= k; j++) {
        const zr = zRe[row + j];
        const zi = zIm[row + j];
        const ar = xRe[xk + j];
        const ai = xIm[xk + j];
        sr += zr * ar - zi * ai;
        si += zr * ai + zi * ar;
      }
      vRe[row + k] = sr;
      vIm[row + k] = si;
    }
  }
  normalizeColumns(vRe, vIm, n);
  return { re: vRe, im: vIm };
}

/** Scales every column to unit 2-norm with its entry of largest modulus real and positive. */
export function normalizeColumns(vRe: Float64Array, vIm: Float64Array, n: number): void {
  for (let k = 0; k < n; k++) {
    let big2 = -1;
    let bigI = 0;
    let scale = 0;
    for (let i = 0; i < n; i++) {
      const m2 = vRe[i * n + k] * vRe[i * n + k] + vIm[i * n + k] * vIm[i * n + k];
      if (m2 > big2) {
        big2 = m2;
        bigI = i;
      }
      scale = Math.max(scale, Math.abs(vRe[i * n + k]), Math.abs(vIm[i * n + k]));
    }
    if (scale === 0) continue;
    let s = 0;
    for (let i = 0; i < n; i++) {
      const a = vRe[i * n + k] / scale;
      const b = vIm[i * n + k] / scale;
      s += a * a + b * b;
    }
    const norm = scale * Math.sqrt(s);
    const mod = Math.sqrt(big2);
    // multiply by conj(v_big) / (|v_big| · ‖v‖)
    const cr = vRe[bigI * n + k] / mod / norm;
    const ci = -vIm[bigI * n + k] / mod / norm;
    for (let i = 0; i < n; i++) {
      const a = vRe[i * n + k];
      const b = vIm[i * n + k];
      vRe[i * n + k] = a * cr - b * ci;
      vIm[i * n + k] = a * ci + b * cr;
    }
    vIm[bigI * n + k] = 0;
  }
}
