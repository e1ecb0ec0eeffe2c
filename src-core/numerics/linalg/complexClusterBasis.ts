/**
 * Orthonormal complex eigenvectors of a Hermitian A = R + iS out of the real eigenvectors of its embedding
 * M = [[R, −S], [S, R]], one cluster of (numerically) equal eigenvalues at a time.
 *
 * A real eigenvector [x; y] of M gives the complex eigenvector x + iy of A. A cluster of 2m eigenvalues of M spans a
 * real subspace W closed under J = [[0, −I], [I, 0]] (J[x; y] ↔ i(x + iy)), so its 2m candidates x + iy span an
 * m-dimensional complex space. Two steps give an orthonormal basis of it, orthogonal to the vectors already found:
 *
 *  1. every candidate is projected off the earlier vectors (one classical Gram–Schmidt pass; the overlaps are only
 *     of the order ε‖A‖/gap, because real orthogonality of the eigenvectors of M does not imply complex
 *     orthogonality: that also needs [x; y] ⊥ J[u; v], which holds only as accurately as the invariant subspaces);
 *  2. m candidates are picked by modified Gram–Schmidt with column pivoting on the largest remaining norm
 *     (Businger & Golub, "Linear least squares solutions by Householder transformations", Numer. Math. 7 (1965);
 *     Golub & Van Loan, Matrix Computations, 4th ed. 2013, §5.4), each pick re-orthogonalized once more against the
 *     picks before it ("twice is enough").
 *
 * Moving a vector by an overlap δ with a vector of eigenvalue μ changes its residual by δ·|λ − μ| = O(ε‖A‖), so step 1
 * costs no accuracy. A simple eigenvalue (cluster of 2) needs only its first candidate.
 */

/**
 * Appends the cluster's basis to rows out, out + 1, … of (outRe, outIm) (n×n, row k = eigenvector k) and returns
 * the next free row. `embedded` holds the unit eigenvectors of M as rows of length 2n; the cluster is rows
 * start..end−1, with end − start even.
 */
export function appendClusterBasis(
  embedded: Float64Array,
  start: number,
  end: number,
  n: number,
  outRe: Float64Array,
  outIm: Float64Array,
  out: number,
): number {
  const big = 2 * n;
  const size = end - start;
  const want = size / 2;
  const cRe = new Float64Array(size * n);
  const cIm = new Float64Array(size * n);
  const norm2 = new Float64Array(size);
  const load = (p: number): void => {
    const base = (start + p) * big;
    cRe.set(embedded.subarray(base, base + n), p * n);
    cIm.set(embedded.subarray(base + n, base + big), p * n);
    if (out > 0) projectOffRows(outRe, outIm, out, cRe, cIm, p * n, n);
    norm2[p] = squaredNorm(cRe, cIm, p * n, n);
  };
  // A simple eigenvalue needs one candidate; the second is loaded only if the first turned out to lie (nearly) in
  // the span of earlier vectors, which happens when two eigenvalues are closer than the copies of one of them.
  let count = want === 1 ? 1 : size;
  for (let p = 0; p < count; p++) load(p);
  if (want === 1 && norm2[0] < 0.5) {
    count = 2;
    load(1);
  }
  const used = new Uint8Array(count);
  for (let j = 0; j < want; j++) {
    let best = -1;
    for (let p = 0; p < count; p++) if (!used[p] && (best < 0 || norm2[p] > norm2[best])) best = p;
    used[best] = 1;
    const row = (out + j) * n;
    outRe.set(cRe.subarray(best * n, best * n + n), row);
    outIm.set(cIm.subarray(best * n, best * n + n), row);
    // Second pass against this cluster's earlier picks, then normalize.
    for (let t = out; t < out + j; t++) subtractProjection(outRe, outIm, t * n, outRe, outIm, row, n);
    const len = Math.sqrt(squaredNorm(outRe, outIm, row, n));
    for (let i = row; i < row + n; i++) {
      outRe[i] /= len;
      outIm[i] /= len;
    }
    if (j + 1 === want) break;
    // Remove the new direction from the remaining candidates; downdate their norms (Pythagoras).
    for (let p = 0; p < count; p++) {
      if (used[p]) continue;
      const h2 = subtractProjection(outRe, outIm, row, cRe, cIm, p * n, n);
      norm2[p] -= h2;
      if (norm2[p] < 1e-4) norm2[p] = squaredNorm(cRe, cIm, p * n, n); // recompute when cancellation looms
    }
  }
  return out + want;
}

/** v ← v − q (qᴴ v) for the unit vector q at offset qOff and v at offset vOff; returns |qᴴ v|². */
function subtractProjection(
  qRe: Float64Array,
  qIm: Float64Array,
  qOff: number,
  vRe: Float64Array,
  vIm: Float64Array,
  vOff: number,
  n: number,
): number {
  let hr = 0;
  let hi = 0;
  for (let i = 0; i < n; i++) {
    const ar = qRe[qOff + i];
    const ai = qIm[qOff + i];
    const br = vRe[vOff + i];
    const bi = vIm[vOff + i];
    hr += ar * br + ai * bi;
    hi += ar * bi - ai * br;
  }
  for (let i = 0; i < n; i++) {
    const ar = qRe[qOff + i];
    const ai = qIm[qOff + i];
    vRe[vOff + i] -= ar * hr - ai * hi;
    vIm[vOff + i] -= ar * hi + ai * hr;
  }
  return hr * hr + hi * hi;
}

/**
 * One classical Gram–Schmidt pass of v (offset vOff) against the orthonormal rows 0..count−1 of (qRe, qIm), two rows
 * at a time: all coefficients come from the same v, so each pair of rows costs one sweep over v.
 */
function projectOffRows(
  qRe: Float64Array,
  qIm: Float64Array,
  count: number,
  vRe: Float64Array,
  vIm: Float64Array,
  vOff: number,
  n: number,
): void {
  let j = 0;
  for (; j + 2 <= count; j += 2) {
    const a = j * n;
    const b = a + n;
    let h0r = 0;
    let h0i = 0;
    let h1r = 0;
    let h1i = 0;
    for (let i = 0; i < n; i++) {
      const vr = vRe[vOff + i];
      const vi = vIm[vOff + i];
      const ar = qRe[a + i];
      const ai = qIm[a + i];
      const br = qRe[b + i];
      const bi = qIm[b + i];
      h0r += ar * vr + ai * vi;
      h0i += ar * vi - ai * vr;
      h1r += br * vr + bi * vi;
      h1i += br * vi - bi * vr;
    }
    for (let i = 0; i < n; i++) {
      const ar = qRe[a + i];
      const ai = qIm[a + i];
      const br = qRe[b + i];
      const bi = qIm[b + i];
      vRe[vOff + i] -= ar * h0r - ai * h0i + br * h1r - bi * h1i;
      vIm[vOff + i] -= ar * h0i + ai * h0r + br * h1i + bi * h1r;
    }
  }
  if (j < count) subtractProjection(qRe, qIm, j * n, vRe, vIm, vOff, n);
}

function squaredNorm(re: Float64Array, im: Float64Array, off: number, n: number): number {
  let s = 0;
  for (let i = off; i < off + n; i++) s += re[i] * re[i] + im[i] * im[i];
  return s;
}
