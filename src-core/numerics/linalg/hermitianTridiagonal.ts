/**
 * Reduction of a complex Hermitian matrix to real symmetric tridiagonal form by a unitary similarity,
 * A = U T Uᴴ, with U formed explicitly.
 *
 * Method: Householder tridiagonalization (Golub & Van Loan, Matrix Computations, 4th ed. 2013, §8.3.1, Algorithm
 * 8.3.1) carried over to complex arithmetic as in LAPACK ZHETRD and ZUNGTR (Anderson et al., LAPACK Users' Guide,
 * 3rd ed. 1999, §2.4.4 and §5.4.3), followed by a diagonal unitary scaling that makes the off-diagonal real.
 *
 *  1. For k = 0, 1, …, n − 3 the column x = A(k+1:n, k) is mapped to α e₁ by the Hermitian reflector
 *     H = I − τ v vᴴ with α = −e^{i arg x₀}‖x‖, v = x − α e₁ and τ = 2/(vᴴv) = 1/(‖x‖(‖x‖ + |x₀|)); the sign makes
 *     v₀ = e^{i arg x₀}(|x₀| + ‖x‖) free of cancellation. The trailing block is updated as H A₂₂ H = A₂₂ − v wᴴ − w vᴴ
 *     with p = τ A₂₂ v, K = τ vᴴp/2 (real, since A₂₂ is Hermitian) and w = p − K v. Only the lower triangle is
 *     stored and updated; A₂₂ v is formed from it row by row, each stored entry contributing to two components.
 *     A column whose part below the subdiagonal is already zero needs no reflector.
 *  2. With Q = H₀ H₁ ⋯ H_{n−3}, T_c = Qᴴ A Q is Hermitian tridiagonal with complex subdiagonal c_k = T_c(k+1, k).
 *     The diagonal unitary D = diag(δ₀, …, δ_{n−1}), δ₀ = 1, δ_{k+1} = δ_k c_k/|c_k| (δ_{k+1} = δ_k when c_k = 0),
 *     gives Dᴴ T_c D = T, real symmetric tridiagonal with diagonal Re T_c(k, k) and subdiagonal |c_k| ≥ 0.
 *  3. U = Q D is accumulated backwards, Q ← H_k Q for k = n − 3, …, 0 (each reflector touches only the trailing
 *     columns), and column c is then multiplied by δ_c.
 *
 * Cost: about (8/3)n³ real multiplications for the reduction and as many for U, against (16/3)n³ each for the
 * real symmetric embedding of order 2n. All inner loops run along contiguous memory: the matrix by rows, U by its
 * columns, which are stored as rows.
 *
 * Input: re, im row-major n×n; the Hermitian part (A + Aᴴ)/2 is what is reduced (an imaginary diagonal is
 * dropped), so slightly non-Hermitian input is treated as its nearest Hermitian matrix in the Frobenius norm. Sizes
 * and finiteness are the caller's responsibility (hermitianEigen checks them).
 */

import { hypot2 } from './dense';

export interface HermitianTridiagonal {
  /** Diagonal of T, length n. */
  d: Float64Array;
  /** Subdiagonal of T: e[i] = T(i, i−1) ≥ 0 for i = 1..n−1; e[0] = 0. */
  e: Float64Array;
  /**
   * The unitary U with A = U T Uᴴ, by columns: n rows of length 2n, row c holding Re U(0:n, c) in its first n
   * entries and Im U(0:n, c) in its last n (the layout tridiagonalQl accumulates into).
   */
  columns: Float64Array;
}

export function hermitianTridiagonalize(re: Float64Array, im: Float64Array, n: number): HermitianTridiagonal {
  // Lower triangle (j ≤ i) of the Hermitian part; below the subdiagonal, column k later holds reflector k.
  const ar = new Float64Array(n * n);
  const ai = new Float64Array(n * n);
  for (let i = 0; i < n; i++) {
    const row = i * n;
    for (let j = 0; j < i; j++) {
      ar[row + j] = 0.5 * (re[row + j] + re[j * n + i]);
      ai[row + j] = 0.5 * (im[row + j] - im[j * n + i]);
    }
    ar[row + i] = re[row + i];
  }

  const d = new Float64Array(n);
  const subRe = new Float64Array(n); // c_k = T_c(k+1, k), k = 0..n−2
  const subIm = new Float64Array(n);
  const tau = new Float64Array(n);
  const vr = new Float64Array(n);
  const vi = new Float64Array(n);
  const pr = new Float64Array(n);
  const pi = new Float64Array(n);

  for (let k = 0; k + 1 < n; k++) {
    d[k] = ar[k * n + k];
    const m0 = k + 1;
    const x0r = ar[m0 * n + k];
    const x0i = ai[m0 * n + k];
    // Scale by the largest entry so that the squared norm can neither overflow nor underflow.
    let scale = 0;
    for (let i = m0 + 1; i < n; i++) scale = Math.max(scale, Math.abs(ar[i * n + k]), Math.abs(ai[i * n + k]));
    if (scale === 0) {
      // Already tridiagonal in this column (always so for k = n − 2): no reflector.
      subRe[k] = x0r;
      subIm[k] = x0i;
      continue;
    }
    scale = Math.max(scale, Math.abs(x0r), Math.abs(x0i));
    let tail2 = 0;
    for (let i = m0 + 1; i < n; i++) {
      const xr = ar[i * n + k] / scale;
      const xi = ai[i * n + k] / scale;
      vr[i] = xr;
      vi[i] = xi;
      tail2 += xr * xr + xi * xi;
    }
    const y0r = x0r / scale;
    const y0i = x0i / scale;
    const r0 = hypot2(y0r, y0i);
    const sigma = Math.sqrt(r0 * r0 + tail2);
    const phr = r0 > 0 ? y0r / r0 : 1; // e^{i arg x₀}
    const phi = r0 > 0 ? y0i / r0 : 0;
    vr[m0] = phr * (r0 + sigma);
    vi[m0] = phi * (r0 + sigma);
    const t = 1 / (sigma * (sigma + r0));
    tau[k] = t;
    subRe[k] = -phr * sigma * scale;
    subIm[k] = -phi * sigma * scale;
    for (let i = m0; i < n; i++) {
      ar[i * n + k] = vr[i];
      ai[i * n + k] = vi[i];
    }

    // p = τ A₂₂ v from the lower triangle: entry (i, j), j < i, adds A_ij v_j to p_i and conj(A_ij) v_i to p_j.
    for (let i = m0; i < n; i++) {
      pr[i] = 0;
      pi[i] = 0;
    }
    for (let i = m0; i < n; i++) {
      const row = i * n;
      const vir = vr[i];
      const vii = vi[i];
      let sr = 0;
      let si = 0;
      for (let j = m0; j < i; j++) {
        const a = ar[row + j];
        const b = ai[row + j];
        const vjr = vr[j];
        const vji = vi[j];
        sr += a * vjr - b * vji;
        si += a * vji + b * vjr;
        pr[j] += a * vir + b * vii;
        pi[j] += a * vii - b * vir;
      }
      const a = ar[row + i];
      pr[i] += sr + a * vir;
      pi[i] += si + a * vii;
    }
    let vhp = 0;
    for (let i = m0; i < n; i++) {
      pr[i] *= t;
      pi[i] *= t;
      vhp += vr[i] * pr[i] + vi[i] * pi[i];
    }
    const kk = 0.5 * t * vhp;
    for (let i = m0; i < n; i++) {
      pr[i] -= kk * vr[i]; // p becomes w
      pi[i] -= kk * vi[i];
    }
    // A₂₂ ← A₂₂ − v wᴴ − w vᴴ on the lower triangle.
    for (let i = m0; i < n; i++) {
      const row = i * n;
      const vir = vr[i];
      const vii = vi[i];
      const wir = pr[i];
      const wii = pi[i];
      for (let j = m0; j <= i; j++) {
        const wjr = pr[j];
        const wji = pi[j];
        const vjr = vr[j];
        const vji = vi[j];
        ar[row + j] -= vir * wjr + vii * wji + wir * vjr + wii * vji;
        ai[row + j] -= vii * wjr - vir * wji + wii * vjr - wir * vji;
      }
    }
  }
  d[n - 1] = ar[n * n - 1];

  // T = Dᴴ T_c D: real subdiagonal |c_k|, and the phases δ.
  const e = new Float64Array(n);
  const dr = new Float64Array(n);
  const di = new Float64Array(n);
  dr[0] = 1;
  for (let k = 0; k + 1 < n; k++) {
    const mod = hypot2(subRe[k], subIm[k]);
    e[k + 1] = mod;
    if (mod > 0) {
      const cr = subRe[k] / mod;
      const ci = subIm[k] / mod;
      dr[k + 1] = dr[k] * cr - di[k] * ci;
      di[k + 1] = dr[k] * ci + di[k] * cr;
    } else {
      dr[k + 1] = dr[k];
      di[k + 1] = di[k];
    }
  }

  // U = Q D by columns (row c of `columns` = [Re U(:, c), Im U(:, c)]), Q accumulated backwards from I.
  const len = 2 * n;
  const columns = new Float64Array(n * len);
  for (let c = 0; c < n; c++) columns[c * len + c] = 1;
  for (let k = n - 2; k >= 0; k--) {
    const t = tau[k];
    if (t === 0) continue;
    const m0 = k + 1;
    for (let i = m0; i < n; i++) {
      vr[i] = ar[i * n + k];
      vi[i] = ai[i * n + k];
    }
    // Columns c ≤ k of H_{k+1}⋯H_{n−3} are e_c, orthogonal to v; column c > k is zero above row m0.
    for (let c = m0; c < n; c++) {
      const re0 = c * len;
      const im0 = re0 + n;
      let sr = 0;
      let si = 0;
      for (let i = m0; i < n; i++) {
        const qr = columns[re0 + i];
        const qi = columns[im0 + i];
        sr += vr[i] * qr + vi[i] * qi;
        si += vr[i] * qi - vi[i] * qr;
      }
      sr *= t;
      si *= t;
      for (let i = m0; i < n; i++) {
        columns[re0 + i] -= vr[i] * sr - vi[i] * si;
        columns[im0 + i] -= vr[i] * si + vi[i] * sr;
      }
    }
  }
  for (let c = 1; c < n; c++) {
    const cr = dr[c];
    const ci = di[c];
    if (cr === 1 && ci === 0) continue;
    const re0 = c * len;
    const im0 = re0 + n;
    for (let i = 0; i < n; i++) {
      const qr = columns[re0 + i];
      const qi = columns[im0 + i];
      columns[re0 + i] = qr * cr - qi * ci;
      columns[im0 + i] = qr * ci + qi * cr;
    }
  }
  return { d, e, columns };
}
