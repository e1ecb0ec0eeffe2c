/**
 * The direct complex solver (hermitianEigen) against the real symmetric embedding of order 2n it replaced
 * (hermitianEigenByEmbedding, kept as a reference), on random, degenerate and low-rank kernel-like Hermitian
 * matrices: eigenvalues agree to 1e-13·‖A‖₂, both give residuals ‖A v_k − λ_k v_k‖ ≤ 1e-13·‖A‖₂ and
 * |VᴴV − I| ≤ 1e-13, and eigenvectors of well-separated eigenvalues span the same lines. The one documented
 * exception is the reference's residual inside a merged cluster of nearly equal eigenvalues, bounded only by the
 * cluster's width; the direct solver has no such clusters.
 */
import { describe, expect, it } from 'vitest';
import { hermitianEigen } from '../../../src-core/numerics/linalg';
import { hermitianEigenByEmbedding } from '../../../src-core/numerics/linalg/hermitianEigenEmbedding';
import {
  adjoint,
  cmatmul,
  type CMat,
  maxResidual,
  orthonormalityDefect,
  randomHermitian,
  randomUnitary,
  zeros,
} from './helpers';

/** U diag(d) Uᴴ for a random unitary U. */
function withSpectrum(d: number[], seed: number): CMat {
  const n = d.length;
  const u = randomUnitary(n, seed);
  const ud: CMat = { re: new Float64Array(n * n), im: new Float64Array(n * n) };
  for (let i = 0; i < n; i++) {
    for (let k = 0; k < n; k++) {
      ud.re[i * n + k] = u.re[i * n + k] * d[k];
      ud.im[i * n + k] = u.im[i * n + k] * d[k];
    }
  }
  return cmatmul(ud, adjoint(u, n, n), n, n, n);
}

/** A_jk = Σ_{m<rank} c_m e^{i m (x_j − x_k)} g(x_j) g(x_k) / n on a uniform grid of [−1, 1], c_m = 1/(m + 1)². */
function degenerateKernel(n: number, rank: number): CMat {
  const re = new Float64Array(n * n);
  const im = new Float64Array(n * n);
  const x = (j: number) => -1 + (2 * j) / (n - 1);
  const g = (s: number) => Math.exp(-s * s) * (1 + 0.5 * s);
  for (let j = 0; j < n; j++) {
    for (let k = 0; k < n; k++) {
      const w = (g(x(j)) * g(x(k))) / n;
      for (let m = 0; m < rank; m++) {
        const c = 1 / (m + 1) ** 2;
        re[j * n + k] += w * c * Math.cos(m * (x(j) - x(k)));
        im[j * n + k] += w * c * Math.sin(m * (x(j) - x(k)));
      }
    }
  }
  return { re, im };
}

/** K(s, t) = e^{−(s − t)²} e^{3i(s − t)} / n: smooth, numerically low rank, eigenvalues decaying to noise level. */
function smoothKernel(n: number): CMat {
  const re = new Float64Array(n * n);
  const im = new Float64Array(n * n);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) {
      const d = (2 * (i - j)) / (n - 1);
      re[i * n + j] = (Math.exp(-d * d) * Math.cos(3 * d)) / n;
      im[i * n + j] = (Math.exp(-d * d) * Math.sin(3 * d)) / n;
    }
  }
  return { re, im };
}

function scaled(a: CMat, s: number): CMat {
  return { re: a.re.map((x) => x * s), im: a.im.map((x) => x * s) };
}

/**
 * Runs both solvers on `a` and checks the invariants against `exact` (the Hermitian matrix meant, by default `a`);
 * `refResidual` loosens the reference's residual bound (relative to ‖A‖₂). Returns both results and ‖A‖₂.
 */
function compare(a: CMat, n: number, { exact = a, refResidual = 1e-13 }: { exact?: CMat; refResidual?: number } = {}) {
  const tol = 1e-13;
  const fresh = hermitianEigen(a.re, a.im, n);
  const ref = hermitianEigenByEmbedding(a.re, a.im, n);
  const norm = Math.max(Math.abs(fresh.values[0]), Math.abs(fresh.values[n - 1]));
  for (let k = 0; k < n; k++) {
    expect(Math.abs(fresh.values[k] - ref.values[k])).toBeLessThanOrEqual(tol * norm);
    if (k > 0) expect(fresh.values[k]).toBeLessThanOrEqual(fresh.values[k - 1]);
  }
  for (const [r, resTol] of [[fresh, tol], [ref, refResidual]] as const) {
    const v = { re: r.vectorsRe, im: r.vectorsIm };
    expect(orthonormalityDefect(v, n)).toBeLessThan(tol);
    expect(maxResidual(exact, n, r.values, zeros(n), v)).toBeLessThanOrEqual(resTol * norm);
  }
  return { fresh, ref, norm };
}

/** |v_newᴴ v_ref| for column k: 1 when both are the same eigenvector up to phase. */
function overlap(x: ReturnType<typeof compare>, n: number, k: number): number {
  let hr = 0;
  let hi = 0;
  const a = x.fresh;
  const b = x.ref;
  for (let i = 0; i < n; i++) {
    const p = i * n + k;
    hr += a.vectorsRe[p] * b.vectorsRe[p] + a.vectorsIm[p] * b.vectorsIm[p];
    hi += a.vectorsRe[p] * b.vectorsIm[p] - a.vectorsIm[p] * b.vectorsRe[p];
  }
  return Math.hypot(hr, hi);
}

describe('hermitianEigen (direct) against the real embedding reference', () => {
  it.each([
    [1, 301],
    [2, 302],
    [3, 303],
    [5, 304],
    [31, 305],
    [80, 306],
  ])('random Hermitian of order %i (seed %i): same values, both solvers exact to rounding', (n, seed) => {
    const x = compare(randomHermitian(n, seed), n);
    // Well-separated eigenvalues: the eigenvectors are the same up to phase, and the phase convention agrees.
    for (let k = 0; k < n; k++) {
      const gap = Math.min(k > 0 ? x.fresh.values[k - 1] - x.fresh.values[k] : Infinity, k < n - 1 ? x.fresh.values[k] - x.fresh.values[k + 1] : Infinity);
      if (gap < 1e-3 * x.norm) continue;
      expect(1 - overlap(x, n, k)).toBeLessThan(1e-12);
      for (let i = 0; i < n; i++) {
        expect(Math.abs(x.fresh.vectorsRe[i * n + k] - x.ref.vectorsRe[i * n + k])).toBeLessThan(1e-11);
        expect(Math.abs(x.fresh.vectorsIm[i * n + k] - x.ref.vectorsIm[i * n + k])).toBeLessThan(1e-11);
      }
    }
  });

  it('repeated eigenvalues (multiplicities 3, 2, 4 and a zero eigenvalue)', () => {
    const d = [5, 5, 5, -1, -1, 0, 2, 2, 2, 2, 0.5, 7];
    const n = d.length;
    const x = compare(withSpectrum(d, 311), n);
    const expected = [...d].sort((p, q) => q - p);
    for (let k = 0; k < n; k++) expect(Math.abs(x.fresh.values[k] - expected[k])).toBeLessThan(1e-13 * 7);
  });

  it('eigenvalues closer than rounding apart (1e-15 splits) and a tight cluster 1e-9 wide', () => {
    const d = [1, 1 + 1e-15, 1 - 1e-15, 3, 3 + 1e-9, 3 - 1e-9, -2, 0.25, -2 + 1e-15, 0];
    compare(withSpectrum(d, 312), d.length);
  });

  it('the identity times a complex phase structure: one eigenvalue of multiplicity n', () => {
    const n = 9;
    const u = randomUnitary(n, 313);
    compare(cmatmul(u, adjoint(u, n, n), n, n, n), n); // = I up to rounding, with a rounding-level complex part
  });

  it.each([
    [40, 5],
    [90, 5],
    [60, 1],
  ])('degenerate kernel of order %i and rank %i: n − rank eigenvalues at zero', (n, rank) => {
    const x = compare(degenerateKernel(n, rank), n);
    for (let k = rank; k < n; k++) expect(Math.abs(x.fresh.values[k])).toBeLessThan(1e-14 * x.norm);
    for (let k = 0; k < rank; k++) expect(x.fresh.values[k]).toBeGreaterThan(1e-6 * x.norm);
    // The leading eigenvalues are well separated: same eigenvectors.
    for (let k = 0; k < rank; k++) expect(1 - overlap(x, n, k)).toBeLessThan(1e-10);
  });

  it('smooth complex kernel of order 100 (eigenvalues decaying into a cluster at noise level)', () => {
    const n = 100;
    const a = smoothKernel(n);
    // The reference merges the noise-level eigenvalues into clusters; its residuals there are of their width.
    const x = compare(a, n, { refResidual: 1e-11 });
    let trace = 0;
    for (let i = 0; i < n; i++) trace += a.re[i * n + i];
    expect(x.fresh.values.reduce((p, q) => p + q, 0)).toBeCloseTo(trace, 13);
  });

  it.each([1e-150, 1e150])('is scale-invariant (entries scaled by %s)', (s) => {
    const n = 20;
    const a = randomHermitian(n, 314);
    const base = hermitianEigen(a.re, a.im, n);
    const x = compare(scaled(a, s), n);
    for (let k = 0; k < n; k++) expect(Math.abs(x.fresh.values[k] / s - base.values[k])).toBeLessThan(1e-13 * Math.abs(base.values[0]));
  });

  it('a complex input whose Hermitian part is real goes through the complex path and agrees', () => {
    const n = 15;
    const a = randomHermitian(n, 315);
    const im = new Float64Array(n * n);
    for (let i = 0; i < n; i++) im[i * n + i] = 1; // dropped by the Hermitian part, but not all zero
    const complexPath = hermitianEigen(a.re, im, n);
    const realPath = hermitianEigen(a.re, null, n);
    for (let k = 0; k < n; k++) expect(Math.abs(complexPath.values[k] - realPath.values[k])).toBeLessThan(1e-13 * n);
    compare({ re: a.re, im }, n, { exact: { re: a.re, im: zeros(n * n) } });
  });
});
