/**
 * All eigenvalues (no vectors) of a real general square matrix, on flat row-major arrays.
 *
 * Method: Householder reduction to upper Hessenberg form (Golub & Van Loan, Matrix Computations, 4th ed. 2013,
 * §7.4.3), then the Francis double-shift QR iteration on the Hessenberg matrix with deflation on negligible
 * subdiagonal entries and the ad-hoc exceptional shifts after 10 and 20 stalled steps (§7.5.5; the procedure hqr of
 * Martin, Peters & Wilkinson, Handbook for Automatic Computation vol. II, Linear Algebra, 1971, as published in
 * EISPACK). Without eigenvectors the iteration only updates the active block, which makes it several times
 * cheaper than a full decomposition; the spectral engine needs every eigenvalue at every level of its ladder (to
 * follow each eigenvalue from level to level) but eigenvectors only at the finest level, and only the leading
 * few: those come from inverse iteration on the kept Hessenberg form (hessenbergEigenvector), O(n²) each.
 *
 * Output: eigenvalues in the order they deflate (callers sort); conjugate pairs have equal real parts and
 * imaginary parts of opposite sign. `converged` is false when some eigenvalue needed more than MAX_STEPS QR steps;
 * the values are then approximations and the call still returns.
 */

import { phaseUnitVector } from './eigenvectorPhase';

const MAX_STEPS = 60;

export interface RealEigenvalues {
  readonly re: Float64Array;
  readonly im: Float64Array;
  readonly converged: boolean;
}

/** The Hessenberg form H = Qᵀ A Q and Q as its Householder reflectors (Q = P₀ P₁ ⋯ P_{n−3}, P_k = I − f_k v_k v_kᵀ). */
export interface HessenbergForm {
  readonly n: number;
  /** H, n×n row-major (zero below the subdiagonal). */
  readonly h: Float64Array;
  /** Row k holds v_k in entries k+1..n−1. */
  readonly reflectors: Float64Array;
  readonly factors: Float64Array;
}

/** Reduces a (n×n row-major; not modified) to upper Hessenberg form by Householder similarity transformations. */
export function hessenbergReduce(a: Float64Array, n: number): HessenbergForm {
  const h = Float64Array.from(a.subarray(0, n * n));
  const reflectors = new Float64Array(n * n);
  const factors = new Float64Array(n);
  const v = new Float64Array(n);
  const s = new Float64Array(n);
  for (let k = 0; k + 2 < n; k++) {
    // Householder vector for column k below the subdiagonal: (I − 2vvᵀ/vᵀv) x = α e₁.
    let scale = 0;
    for (let i = k + 1; i < n; i++) scale += Math.abs(h[i * n + k]);
    if (scale === 0) continue;
    let norm2 = 0;
    for (let i = k + 1; i < n; i++) {
      v[i] = h[i * n + k] / scale;
      norm2 += v[i] * v[i];
    }
    const alpha = v[k + 1] > 0 ? -Math.sqrt(norm2) : Math.sqrt(norm2);
    v[k + 1] -= alpha;
    let vv = 0;
    for (let i = k + 1; i < n; i++) vv += v[i] * v[i];
    if (vv === 0) continue;
    const f = 2 / vv;
    factors[k] = f;
    for (let i = k + 1; i < n; i++) reflectors[k * n + i] = v[i];
    // Left: rows k+1..n-1 of columns k..n-1 (sums accumulated row by row along contiguous memory).
    s.fill(0, k, n);
    for (let i = k + 1; i < n; i++) {
      const vi = v[i];
      const row = i * n;
      for (let j = k; j < n; j++) s[j] += vi * h[row + j];
    }
    for (let i = k + 1; i < n; i++) {
      const c = f * v[i];
      const row = i * n;
      for (let j = k; j < n; j++) h[row + j] -= c * s[j];
    }
    // Right: columns k+1..n-1 of every row.
    for (let i = 0; i < n; i++) {
      const row = i * n;
      let dot = 0;
      for (let j = k + 1; j < n; j++) dot += h[row + j] * v[j];
      const c = f * dot;
      for (let j = k + 1; j < n; j++) h[row + j] -= c * v[j];
    }
    h[(k + 1) * n + k] = alpha * scale;
    for (let i = k + 2; i < n; i++) h[i * n + k] = 0;
  }
  return { n, h, reflectors, factors };
}

/** Eigenvalues of the real n×n matrix a (row-major; not modified). */
export function realEigenvalues(a: Float64Array, n: number): RealEigenvalues {
  return hessenbergEigenvalues(hessenbergReduce(a, n).h, n);
}

/**
 * A unit eigenvector x + iy of A for the eigenvalue μ = re + i·im (known to rounding), by inverse iteration on the
 * Hessenberg form: two solves of (H − μI) z = b by Gaussian elimination with partial pivoting (O(n²) each, the
 * Hessenberg structure leaves one entry per column to eliminate), then x + iy = Q z (Golub & Van Loan §7.6.1;
 * LAPACK hsein). A zero pivot is replaced by ε‖H‖, as usual. The phase is fixed so that the entry of largest
 * modulus is real and positive.
 */
export function hessenbergEigenvector(form: HessenbergForm, re: number, im: number): { re: Float64Array; im: Float64Array } {
  const { n, h } = form;
  let hnorm = 0;
  for (let p = 0; p < n * n; p++) hnorm = Math.max(hnorm, Math.abs(h[p]));
  const tiny = Math.max(hnorm, Number.MIN_VALUE) * 2 ** -52;
  // LU of H − μI with row swaps between neighbours: multipliers l_i, swap flags, upper factor U (complex).
  const ur = new Float64Array(n * n);
  const ui = new Float64Array(n * n);
  for (let i = 0; i < n; i++) {
    for (let j = Math.max(0, i - 1); j < n; j++) ur[i * n + j] = h[i * n + j];
    ur[i * n + i] -= re;
    ui[i * n + i] -= im;
  }
  const lr = new Float64Array(n);
  const li = new Float64Array(n);
  const swapped = new Uint8Array(n);
  for (let i = 0; i + 1 < n; i++) {
    const d = i * n + i;
    const below = (i + 1) * n + i;
    if (Math.hypot(ur[below], ui[below]) > Math.hypot(ur[d], ui[d])) {
      swapped[i] = 1;
      for (let j = i; j < n; j++) {
        const a = i * n + j;
        const b = (i + 1) * n + j;
        let t = ur[a]; ur[a] = ur[b]; ur[b] = t;
        t = ui[a]; ui[a] = ui[b]; ui[b] = t;
      }
    }
    if (ur[d] === 0 && ui[d] === 0) ur[d] = tiny;
    // l = M[i+1][i] / M[i][i]
    const den = ur[d] * ur[d] + ui[d] * ui[d];
    const mr = (ur[below] * ur[d] + ui[below] * ui[d]) / den;
    const mi = (ui[below] * ur[d] - ur[below] * ui[d]) / den;
    lr[i] = mr;
    li[i] = mi;
    ur[below] = 0;
    ui[below] = 0;
    for (let j = i + 1; j < n; j++) {
      const a = i * n + j;
      const b = (i + 1) * n + j;
      ur[b] -= mr * ur[a] - mi * ui[a];
      ui[b] -= mr * ui[a] + mi * ur[a];
    }
  }
  const last = (n - 1) * n + n - 1;
  if (ur[last] === 0 && ui[last] === 0) ur[last] = tiny;

  // Start from a fixed vector with no special structure, then two solves.
  const zr = new Float64Array(n);
  const zi = new Float64Array(n);
  for (let i = 0; i < n; i++) zr[i] = 1 + ((i * 0.618033988749895) % 1) * 0.5;
  for (let iteration = 0; iteration < 2; iteration++) {
    // Forward: apply the swaps and multipliers.
    for (let i = 0; i + 1 < n; i++) {
      if (swapped[i]) {
        let t = zr[i]; zr[i] = zr[i + 1]; zr[i + 1] = t;
        t = zi[i]; zi[i] = zi[i + 1]; zi[i + 1] = t;
      }
      zr[i + 1] -= lr[i] * zr[i] - li[i] * zi[i];
      zi[i + 1] -= lr[i] * zi[i] + li[i] * zr[i];
    }
    // Back substitution with U.
    for (let i = n - 1; i >= 0; i--) {
      let sr = zr[i];
      let si = zi[i];
      const row = i * n;
      for (let j = i + 1; j < n; j++) {
        sr -= ur[row + j] * zr[j] - ui[row + j] * zi[j];
        si -= ur[row + j] * zi[j] + ui[row + j] * zr[j];
      }
      const dr = ur[row + i];
      const di = ui[row + i];
      const den = dr * dr + di * di;
      zr[i] = (sr * dr + si * di) / den;
      zi[i] = (si * dr - sr * di) / den;
    }
    let big = 0;
    for (let i = 0; i < n; i++) big = Math.max(big, Math.abs(zr[i]), Math.abs(zi[i]));
    if (!(big > 0) || !Number.isFinite(big)) break;
    for (let i = 0; i < n; i++) { zr[i] /= big; zi[i] /= big; }
  }
  // x + iy = Q z = P₀ (P₁ (⋯ (P_{n−3} z))).
  const { reflectors, factors } = form;
  for (let k = n - 3; k >= 0; k--) {
    const f = factors[k];
    if (f === 0) continue;
    let dr = 0;
    let di = 0;
    for (let i = k + 1; i < n; i++) {
      dr += reflectors[k * n + i] * zr[i];
      di += reflectors[k * n + i] * zi[i];
    }
    for (let i = k + 1; i < n; i++) {
      zr[i] -= f * dr * reflectors[k * n + i];
      zi[i] -= f * di * reflectors[k * n + i];
    }
  }
  phaseUnitVector(zr, zi);
  return { re: zr, im: zi };
}

/** Eigenvalues of the upper Hessenberg matrix h (overwritten) by the Francis double-shift QR iteration. */
export function hessenbergEigenvalues(h: Float64Array, n: number): RealEigenvalues {
  const wr = new Float64Array(n);
  const wi = new Float64Array(n);
  const H = (i: number, j: number) => h[i * n + j];
  let anorm = 0;
  for (let i = 0; i < n; i++) for (let j = Math.max(i - 1, 0); j < n; j++) anorm += Math.abs(H(i, j));
  let converged = true;
  let hi = n - 1; // last row of the active block
  let shift = 0; // accumulated exceptional shifts
  let steps = 0;
  while (hi >= 0) {
    // Find the start lo of the unreduced block ending at hi.
    let lo = hi;
    for (; lo >= 1; lo--) {
      let s = Math.abs(H(lo - 1, lo - 1)) + Math.abs(H(lo, lo));
      if (s === 0) s = anorm;
      if (Math.abs(H(lo, lo - 1)) + s === s) {
        h[lo * n + lo - 1] = 0;
        break;
      }
    }
    let x = H(hi, hi);
    if (lo === hi) {
      // One eigenvalue deflated.
      wr[hi] = x + shift;
      wi[hi] = 0;
      hi -= 1;
      steps = 0;
      continue;
    }
    let y = H(hi - 1, hi - 1);
    let w = H(hi, hi - 1) * H(hi - 1, hi);
    if (lo === hi - 1) {
      // A 2×2 block deflated: its two eigenvalues, real or a conjugate pair.
      const p = 0.5 * (y - x);
      const q = p * p + w;
      const z = Math.sqrt(Math.abs(q));
      x += shift;
      if (q >= 0) {
        const zz = p + (p >= 0 ? z : -z);
        wr[hi - 1] = x + zz;
        wr[hi] = zz !== 0 ? x - w / zz : x + zz;
        wi[hi - 1] = 0;
        wi[hi] = 0;
      } else {
        wr[hi - 1] = x + p;
        wr[hi] = x + p;
        wi[hi - 1] = z;
        wi[hi] = -z;
      }
      hi -= 2;
      steps = 0;
      continue;
    }
    if (steps >= MAX_STEPS) {
      // Give up on this block: report its diagonal as approximations.
      converged = false;
      for (let i = lo; i <= hi; i++) { wr[i] = H(i, i) + shift; wi[i] = 0; }
      hi = lo - 1;
      steps = 0;
      continue;
    }
    if (steps === 10 || steps === 20) {
      // Exceptional shift.
      shift += x;
      for (let i = 0; i <= hi; i++) h[i * n + i] -= x;
      const s = Math.abs(H(hi, hi - 1)) + Math.abs(H(hi - 1, hi - 2));
      x = 0.75 * s;
      y = x;
      w = -0.4375 * s * s;
    }
    steps++;
    // Look for two consecutive small subdiagonal entries; m is where the double-shift bulge starts.
    let m = hi - 2;
    let p = 0;
    let q = 0;
    let r = 0;
    for (; m >= lo; m--) {
      const z = H(m, m);
      const rr = x - z;
      const ss = y - z;
      p = (rr * ss - w) / H(m + 1, m) + H(m, m + 1);
      q = H(m + 1, m + 1) - z - rr - ss;
      r = H(m + 2, m + 1);
      const s = Math.abs(p) + Math.abs(q) + Math.abs(r);
      p /= s; q /= s; r /= s;
      if (m === lo) break;
      const u = Math.abs(H(m, m - 1)) * (Math.abs(q) + Math.abs(r));
      const v = Math.abs(p) * (Math.abs(H(m - 1, m - 1)) + Math.abs(z) + Math.abs(H(m + 1, m + 1)));
      if (u + v === v) break;
    }
    for (let i = m + 2; i <= hi; i++) {
      h[i * n + i - 2] = 0;
      if (i !== m + 2) h[i * n + i - 3] = 0;
    }
    // Chase the bulge with 3×3 Householder reflections (2×2 at the last step), on the active block only.
    for (let k = m; k <= hi - 1; k++) {
      let scale = 0;
      if (k !== m) {
        p = H(k, k - 1);
        q = H(k + 1, k - 1);
        r = k !== hi - 1 ? H(k + 2, k - 1) : 0;
        scale = Math.abs(p) + Math.abs(q) + Math.abs(r);
        if (scale !== 0) { p /= scale; q /= scale; r /= scale; }
      }
      const norm = Math.sqrt(p * p + q * q + r * r);
      const s = p >= 0 ? norm : -norm;
      if (s === 0) continue;
      if (k === m) {
        if (lo !== m) h[k * n + k - 1] = -H(k, k - 1);
      } else {
        h[k * n + k - 1] = -s * scale;
      }
      p += s;
      const vx = p / s;
      const vy = q / s;
      const vz = r / s;
      q /= p;
      r /= p;
      const three = k !== hi - 1;
      for (let j = k; j <= hi; j++) {
        let t = H(k, j) + q * H(k + 1, j);
        if (three) {
          t += r * H(k + 2, j);
          h[(k + 2) * n + j] -= t * vz;
        }
        h[(k + 1) * n + j] -= t * vy;
        h[k * n + j] -= t * vx;
      }
      const last = Math.min(hi, k + 3);
      for (let i = lo; i <= last; i++) {
        let t = vx * H(i, k) + vy * H(i, k + 1);
        if (three) {
          t += vz * H(i, k + 2);
          h[i * n + k + 2] -= t * r;
        }
        h[i * n + k + 1] -= t * q;
        h[i * n + k] -= t;
      }
    }
  }
  return { re: wr, im: wi, converged };
}
