/**
 * Reduction of a complex square matrix to upper Hessenberg form by Householder reflections: A = Q H Qᴴ with Q
 * unitary and H zero below the first subdiagonal.
 *
 * Method: Golub & Van Loan, Matrix Computations, 4th ed. 2013, §7.4 (Householder reduction to Hessenberg form),
 * with complex Householder reflections (§5.1): for the column x below the diagonal, α = −e^{i·arg x₀}‖x‖, v = x − α e₁ and
 * P = I − 2 v vᴴ / (vᴴ v), so P x = α e₁ without cancellation in v₀.
 *
 * Works in place on (hRe, hIm), n×n row-major; returns Q as a new pair of row-major arrays. The row updates run along
 * contiguous rows; no per-element allocation. Sizes are the caller's responsibility.
 */

export interface ComplexMatrixPair {
  re: Float64Array;
  im: Float64Array;
}

export function complexHessenberg(hRe: Float64Array, hIm: Float64Array, n: number): ComplexMatrixPair {
  const qRe = new Float64Array(n * n);
  const qIm = new Float64Array(n * n);
  for (let i = 0; i < n; i++) qRe[i * n + i] = 1;
  const vRe = new Float64Array(n);
  const vIm = new Float64Array(n);
  const sRe = new Float64Array(n);
  const sIm = new Float64Array(n);

  for (let k = 0; k < n - 2; k++) {
    const first = k + 1;
    const len = n - first;
    // Column k below the diagonal, scaled against overflow.
    let scale = 0;
    for (let i = 0; i < len; i++) {
      const p = (first + i) * n + k;
      scale = Math.max(scale, Math.abs(hRe[p]), Math.abs(hIm[p]));
    }
    if (scale === 0) continue;
    let tail = 0;
    for (let i = 1; i < len; i++) {
      const p = (first + i) * n + k;
      const xr = hRe[p] / scale;
      const xi = hIm[p] / scale;
      tail += xr * xr + xi * xi;
    }
    if (tail === 0) continue; // already zero below the subdiagonal
    const x0r = hRe[first * n + k] / scale;
    const x0i = hIm[first * n + k] / scale;
    const x0abs = Math.sqrt(x0r * x0r + x0i * x0i);
    const xnorm = Math.sqrt(x0abs * x0abs + tail);
    const phr = x0abs > 0 ? x0r / x0abs : 1;
    const phi = x0abs > 0 ? x0i / x0abs : 0;
    // v = x − α e₁ with α = −phase·‖x‖, so v₀ = phase·(|x₀| + ‖x‖).
    vRe[0] = phr * (x0abs + xnorm);
    vIm[0] = phi * (x0abs + xnorm);
    for (let i = 1; i < len; i++) {
      const p = (first + i) * n + k;
      vRe[i] = hRe[p] / scale;
      vIm[i] = hIm[p] / scale;
    }
    const vv = (x0abs + xnorm) * (x0abs + xnorm) + tail;
    const beta = 2 / vv;

    // Left: rows first..n−1, columns k+1..n−1: H ← H − β v (vᴴ H).
    sRe.fill(0, k + 1, n);
    sIm.fill(0, k + 1, n);
    for (let i = 0; i < len; i++) {
      const ar = vRe[i];
      const ai = -vIm[i];
      const row = (first + i) * n;
      for (let j = k + 1; j < n; j++) {
        const br = hRe[row + j];
        const bi = hIm[row + j];
        sRe[j] += ar * br - ai * bi;
        sIm[j] += ar * bi + ai * br;
      }
    }
    for (let i = 0; i < len; i++) {
      const ar = beta * vRe[i];
      const ai = beta * vIm[i];
      const row = (first + i) * n;
      for (let j = k + 1; j < n; j++) {
        hRe[row + j] -= ar * sRe[j] - ai * sIm[j];
        hIm[row + j] -= ar * sIm[j] + ai * sRe[j];
      }
    }
    // Column k becomes α e₁.
    hRe[first * n + k] = -phr * xnorm * scale;
    hIm[first * n + k] = -phi * xnorm * scale;
    for (let i = 1; i < len; i++) {
      hRe[(first + i) * n + k] = 0;
      hIm[(first + i) * n + k] = 0;
    }
    // Right: all rows, columns first..n−1: H ← H − β (H v) vᴴ; the same for Q.
    applyRight(hRe, hIm, n, first, len, vRe, vIm, beta);
    applyRight(qRe, qIm, n, first, len, vRe, vIm, beta);
  }
  return { re: qRe, im: qIm };
}

/** M ← M (I − β v vᴴ) on columns first..first+len−1 of every row. */
function applyRight(
  mRe: Float64Array,
  mIm: Float64Array,
  n: number,
  first: number,
  len: number,
  vRe: Float64Array,
  vIm: Float64Array,
  beta: number,
): void {
  for (let r = 0; r < n; r++) {
    const row = r * n + first;
    let tr = 0;
    let ti = 0;
    for (let i = 0; i < len; i++) {
      const ar = mRe[row + i];
      const ai = mIm[row + i];
      tr += ar * vRe[i] - ai * vIm[i];
      ti += ar * vIm[i] + ai * vRe[i];
    }
    tr *= beta;
    ti *= beta;
    // subtract t · conj(v_i)
    for (let i = 0; i < len; i++) {
      mRe[row + i] -= tr * vRe[i] + ti * vIm[i];
      mIm[row + i] -= ti * vRe[i] - tr * vIm[i];
    }
  }
}
