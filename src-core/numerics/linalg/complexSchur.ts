/**
 * Complex Schur form of an upper Hessenberg matrix by the shifted QR algorithm: H = Z T Zᴴ with T upper triangular,
 * the eigenvalues on its diagonal.
 *
 * Method: Golub & Van Loan, Matrix Computations, 4th ed. 2013, §7.5 (single-shift implicit QR step on a Hessenberg
 * matrix, by a chain of Givens rotations chasing the bulge; deflation when a subdiagonal entry is negligible against
 * its two diagonal neighbours), with the Wilkinson shift (the eigenvalue of the trailing 2×2 block nearer to its
 * last diagonal entry, §8.3) and the exceptional shifts after 10 and 20 stalled steps used by LAPACK zlahqr.
 *
 * Complex Givens rotation: G = [[c, s], [−s̄, c]] with c real, c² + |s|² = 1, chosen so that G [a; b] = [r; 0].
 *
 * Works in place on (hRe, hIm) and accumulates the rotations into (zRe, zIm) (Z ← Z Gᴴ), all n×n row-major. The whole
 * rows and columns are updated (not only the active block), so that T is the full triangular factor needed for
 * eigenvectors. Each eigenvalue gets at most maxSteps (default 60) QR steps; if one does not deflate in time the
 * iteration stops and `converged` is false — the diagonal then holds approximations, never an infinite loop.
 */

const EPS = 2 ** -52;
const MAX_STEPS = 60;

export interface ComplexSchurResult {
  /** False when some eigenvalue failed to deflate within the step bound. */
  converged: boolean;
  /** Total number of QR steps taken. */
  steps: number;
}

export function complexSchur(
  hRe: Float64Array,
  hIm: Float64Array,
  zRe: Float64Array,
  zIm: Float64Array,
  n: number,
  maxSteps: number = MAX_STEPS,
): ComplexSchurResult {
  let hnorm = 0;
  for (let p = 0; p < n * n; p++) hnorm = Math.max(hnorm, Math.abs(hRe[p]) + Math.abs(hIm[p]));
  let steps = 0;
  let hi = n - 1;
  let stalled = 0;
  const shift = new Float64Array(2);
  while (hi > 0) {
    // Find the start of the active block: the largest l ≤ hi with a negligible H[l, l−1].
    let l = hi;
    for (; l > 0; l--) {
      const sub = l * n + l - 1;
      const a = (l - 1) * n + l - 1;
      const b = l * n + l;
      let tst = Math.abs(hRe[a]) + Math.abs(hIm[a]) + Math.abs(hRe[b]) + Math.abs(hIm[b]);
      if (tst === 0) tst = hnorm;
      if (Math.abs(hRe[sub]) + Math.abs(hIm[sub]) <= EPS * tst) {
        hRe[sub] = 0;
        hIm[sub] = 0;
        break;
      }
    }
    if (l === hi) {
      hi--;
      stalled = 0;
      continue;
    }
    if (stalled >= maxSteps) return { converged: false, steps };
    stalled++;
    steps++;
    chooseShift(hRe, hIm, n, l, hi, stalled, shift);
    qrStep(hRe, hIm, zRe, zIm, n, l, hi, shift[0], shift[1]);
  }
  return { converged: true, steps };
}

/** Writes the shift for the active block [l, hi] into out = [re, im]. */
function chooseShift(
  hRe: Float64Array,
  hIm: Float64Array,
  n: number,
  l: number,
  hi: number,
  stalled: number,
  out: Float64Array,
): void {
  if (stalled === 10) {
    // Exceptional shift (zlahqr): 3/4·|Re H[l+1, l]| + H[l, l].
    out[0] = 0.75 * Math.abs(hRe[(l + 1) * n + l]) + hRe[l * n + l];
    out[1] = hIm[l * n + l];
    return;
  }
  if (stalled === 20) {
    out[0] = 0.75 * Math.abs(hRe[hi * n + hi - 1]) + hRe[hi * n + hi];
    out[1] = hIm[hi * n + hi];
    return;
  }
  // Wilkinson shift of [[a, b], [c, d]]: μ = d − bc / (p + √(p² + bc)), p = (a − d)/2, the root's sign chosen so
  // that |p + √·| is largest (the eigenvalue nearer to d, without cancellation).
  const ia = (hi - 1) * n + hi - 1;
  const ib = (hi - 1) * n + hi;
  const ic = hi * n + hi - 1;
  const id = hi * n + hi;
  const pr = 0.5 * (hRe[ia] - hRe[id]);
  const pi = 0.5 * (hIm[ia] - hIm[id]);
  const bcr = hRe[ib] * hRe[ic] - hIm[ib] * hIm[ic];
  const bci = hRe[ib] * hIm[ic] + hIm[ib] * hRe[ic];
  // disc = sqrt(p² + bc)
  const qr = pr * pr - pi * pi + bcr;
  const qi = 2 * pr * pi + bci;
  const mod = Math.sqrt(Math.sqrt(qr * qr + qi * qi));
  const arg = 0.5 * Math.atan2(qi, qr);
  let dr = mod * Math.cos(arg);
  let di = mod * Math.sin(arg);
  if (pr * dr + pi * di < 0) {
    dr = -dr;
    di = -di;
  }
  const denr = pr + dr;
  const deni = pi + di;
  const den2 = denr * denr + deni * deni;
  if (den2 === 0) {
    out[0] = hRe[id];
    out[1] = hIm[id];
    return;
  }
  // bc / den
  const fr = (bcr * denr + bci * deni) / den2;
  const fi = (bci * denr - bcr * deni) / den2;
  out[0] = hRe[id] - fr;
  out[1] = hIm[id] - fi;
}

/** One implicit single-shift QR step on the active block [l, hi] of H, accumulated into Z. */
function qrStep(
  hRe: Float64Array,
  hIm: Float64Array,
  zRe: Float64Array,
  zIm: Float64Array,
  n: number,
  l: number,
  hi: number,
  sr: number,
  si: number,
): void {
  for (let k = l; k < hi; k++) {
    let ar: number;
    let ai: number;
    let br: number;
    let bi: number;
    if (k === l) {
      ar = hRe[l * n + l] - sr;
      ai = hIm[l * n + l] - si;
      br = hRe[(l + 1) * n + l];
      bi = hIm[(l + 1) * n + l];
    } else {
      ar = hRe[k * n + k - 1];
      ai = hIm[k * n + k - 1];
      br = hRe[(k + 1) * n + k - 1];
      bi = hIm[(k + 1) * n + k - 1];
    }
    // Givens rotation G [a; b] = [r; 0].
    const aabs = Math.sqrt(ar * ar + ai * ai);
    const babs = Math.sqrt(br * br + bi * bi);
    if (babs === 0) continue; // nothing to annihilate: G = I
    let c: number;
    let ssr: number;
    let ssi: number;
    if (aabs === 0) {
      c = 0;
      ssr = 1;
      ssi = 0;
      // G [0; b] = [b; 0]
    } else {
      const nu = aabs * Math.sqrt(1 + (babs / aabs) * (babs / aabs));
      c = aabs / nu;
      // s = (a/|a|) · conj(b) / ν
      const ur = ar / aabs;
      const ui = ai / aabs;
      ssr = (ur * br + ui * bi) / nu;
      ssi = (ui * br - ur * bi) / nu;
    }
    // Rows k, k+1 from column (k === l ? l : k − 1) to n − 1: [x; y] ← [c x + s y; −s̄ x + c y].
    const r0 = k * n;
    const r1 = (k + 1) * n;
    for (let j = k === l ? l : k - 1; j < n; j++) {
      const xr = hRe[r0 + j];
      const xi = hIm[r0 + j];
      const yr = hRe[r1 + j];
      const yi = hIm[r1 + j];
      hRe[r0 + j] = c * xr + ssr * yr - ssi * yi;
      hIm[r0 + j] = c * xi + ssr * yi + ssi * yr;
      hRe[r1 + j] = c * yr - ssr * xr - ssi * xi;
      hIm[r1 + j] = c * yi - ssr * xi + ssi * xr;
    }
    if (k > l) {
      hRe[r1 + k - 1] = 0;
      hIm[r1 + k - 1] = 0;
    }
    // Columns k, k+1 of rows 0..min(k+2, hi) of H and all rows of Z: [u, v] ← [c u + s̄ v, −s u + c v].
    const last = Math.min(k + 2, hi);
    rotateColumns(hRe, hIm, n, k, last, c, ssr, ssi);
    rotateColumns(zRe, zIm, n, k, n - 1, c, ssr, ssi);
  }
}

function rotateColumns(
  mRe: Float64Array,
  mIm: Float64Array,
  n: number,
  k: number,
  lastRow: number,
  c: number,
  sr: number,
  si: number,
): void {
  for (let i = 0; i <= lastRow; i++) {
    const p = i * n + k;
    const ur = mRe[p];
    const ui = mIm[p];
    const vr = mRe[p + 1];
    const vi = mIm[p + 1];
    mRe[p] = c * ur + sr * vr + si * vi;
    mIm[p] = c * ui + sr * vi - si * vr;
    mRe[p + 1] = c * vr - sr * ur + si * ui;
    mIm[p + 1] = c * vi - sr * ui - si * ur;
  }
}
