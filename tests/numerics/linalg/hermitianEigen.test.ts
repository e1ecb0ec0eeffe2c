import { describe, expect, it } from 'vitest';
import { eigs } from 'mathjs';
import { hermitianEigen } from '../../../src-core/numerics/linalg';
import {
  adjoint,
  cmatmul,
  type CMat,
  mathjsValues,
  maxResidual,
  orthonormalityDefect,
  randomHermitian,
  randomSymmetric,
  randomUnitary,
  toMathjs,
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

function check(a: CMat, n: number, tol: number) {
  const r = hermitianEigen(a.re, a.im, n);
  const v = { re: r.vectorsRe, im: r.vectorsIm };
  expect(r.values).toHaveLength(n);
  expect(orthonormalityDefect(v, n)).toBeLessThan(tol);
  expect(maxResidual(a, n, r.values, zeros(n), v)).toBeLessThan(tol);
  for (let k = 1; k < n; k++) expect(r.values[k]).toBeLessThanOrEqual(r.values[k - 1]);
  return r;
}

describe('hermitianEigen', () => {
  it.each([41, 42, 43])('agrees with mathjs eigs on a random complex Hermitian 8×8 matrix (seed %i)', (seed) => {
    const n = 8;
    const a = randomHermitian(n, seed);
    const r = check(a, n, 1e-12);
    const ref = mathjsValues(eigs(toMathjs(a.re, a.im, n)).values);
    expect(Math.max(...ref.im.map(Math.abs))).toBeLessThan(1e-12); // mathjs agrees they are real
    const refSorted = ref.re.sort((x, y) => y - x);
    for (let k = 0; k < n; k++) expect(Math.abs(r.values[k] - refSorted[k])).toBeLessThan(1e-12);
  });

  it('gives an orthonormal basis of a repeated eigenvalue, each eigenvalue once', () => {
    const d = [3, 3, 1, 0.5, -2, -2, -2, 7];
    const n = d.length;
    const a = withSpectrum(d, 51);
    const r = check(a, n, 1e-12);
    const expected = [...d].sort((x, y) => y - x);
    for (let k = 0; k < n; k++) expect(Math.abs(r.values[k] - expected[k])).toBeLessThan(1e-12);
  });

  it('handles the identity (one eigenvalue of multiplicity n, zero imaginary part)', () => {
    const n = 6;
    const re = new Float64Array(n * n);
    for (let i = 0; i < n; i++) re[i * n + i] = 1;
    const r = check({ re, im: zeros(n * n) }, n, 1e-14);
    expect(Array.from(r.values)).toEqual(new Array(n).fill(1).map((x) => expect.closeTo(x, 14)));
  });

  it('handles a genuinely complex matrix with a triple eigenvalue and a zero eigenvalue', () => {
    const d = [0, 4, 4, 4, -1, 2, 0.25, 9, 1e-3, 5];
    const n = d.length;
    const a = withSpectrum(d, 52);
    const r = check(a, n, 1e-12);
    const expected = [...d].sort((x, y) => y - x);
    for (let k = 0; k < n; k++) expect(Math.abs(r.values[k] - expected[k])).toBeLessThan(1e-12);
  });

  it('handles a low-rank complex matrix (a large cluster of eigenvalues at zero)', () => {
    const n = 40;
    const d = new Array(n).fill(0);
    d[0] = 2;
    d[1] = -1;
    d[2] = 0.5;
    const a = withSpectrum(d, 56);
    const r = check(a, n, 1e-12);
    expect(r.values[0]).toBeCloseTo(2, 12);
    expect(r.values[n - 1]).toBeCloseTo(-1, 12);
    for (let k = 2; k < n - 1; k++) expect(Math.abs(r.values[k])).toBeLessThan(1e-12);
  });

  it('keeps eigenvectors orthonormal across nearby clusters of a smooth low-rank kernel matrix', () => {
    // K(s, t) = exp(−(s − t)²) e^{3i(s − t)}/n on a grid: eigenvalues decay like those of a smooth kernel, so many are
    // close together near zero (where the former real-embedding solver had to merge them into clusters).
    const n = 120;
    const re = new Float64Array(n * n);
    const im = new Float64Array(n * n);
    for (let i = 0; i < n; i++) {
      for (let j = 0; j < n; j++) {
        const d = (i - j) / (n - 1);
        const g = Math.exp(-d * d) / n;
        re[i * n + j] = g * Math.cos(3 * d);
        im[i * n + j] = g * Math.sin(3 * d);
      }
    }
    const r = hermitianEigen(re, im, n);
    const v = { re: r.vectorsRe, im: r.vectorsIm };
    expect(orthonormalityDefect(v, n)).toBeLessThan(1e-13);
    const norm = Math.abs(r.values[0]);
    // A unitary reduction gives residuals at rounding level for every eigenpair, clustered or not.
    expect(maxResidual({ re, im }, n, r.values, zeros(n), v)).toBeLessThan(1e-13 * norm);
    // Trace = sum of eigenvalues (the diagonal is 1/n).
    expect(r.values.reduce((a, b) => a + b, 0)).toBeCloseTo(1, 13);
  });

  it('resolves eigenvalues 1e-9 and 1e-14 apart with an orthonormal basis', () => {
    const d = [1, 1 + 1e-9, 1 + 1e-14, 0.5, -0.25, 2, 2 - 1e-9, 0];
    const n = d.length;
    const a = withSpectrum(d, 57);
    const r = check(a, n, 1e-12);
    const expected = [...d].sort((x, y) => y - x);
    for (let k = 0; k < n; k++) expect(Math.abs(r.values[k] - expected[k])).toBeLessThan(1e-12);
  });

  it('reduces to the real symmetric problem when im is null', () => {
    const n = 12;
    const re = randomSymmetric(n, 53);
    const r = check({ re, im: zeros(n * n) }, n, 1e-12);
    expect(Array.from(r.vectorsIm).every((x) => x === 0)).toBe(true);
    const same = hermitianEigen(re, null, n);
    expect(Array.from(same.values)).toEqual(Array.from(r.values));
  });

  it('uses the Hermitian part (A + Aᴴ)/2 of a non-Hermitian input', () => {
    const n = 8;
    const a = randomHermitian(n, 54);
    const noisy = { re: Float64Array.from(a.re), im: Float64Array.from(a.im) };
    noisy.re[1] += 2e-9; // symmetric part unchanged up to 1e-9
    noisy.im[n] += 2e-9;
    const clean = hermitianEigen(a.re, a.im, n);
    const dirty = hermitianEigen(noisy.re, noisy.im, n);
    for (let k = 0; k < n; k++) expect(Math.abs(clean.values[k] - dirty.values[k])).toBeLessThan(3e-9);
    const imDiag = Float64Array.from(a.im);
    imDiag[0] = 5; // the Hermitian part has a zero imaginary diagonal
    const r = hermitianEigen(a.re, imDiag, n);
    for (let k = 0; k < n; k++) expect(r.values[k]).toBeCloseTo(clean.values[k], 12);
  });

  it('makes the largest entry of every eigenvector real and positive', () => {
    const n = 9;
    const r = hermitianEigen(randomHermitian(n, 55).re, randomHermitian(n, 55).im, n);
    for (let k = 0; k < n; k++) {
      let best = 0;
      for (let i = 0; i < n; i++) {
        const m = Math.hypot(r.vectorsRe[i * n + k], r.vectorsIm[i * n + k]);
        if (m > Math.hypot(r.vectorsRe[best * n + k], r.vectorsIm[best * n + k])) best = i;
      }
      expect(r.vectorsIm[best * n + k]).toBe(0);
      expect(r.vectorsRe[best * n + k]).toBeGreaterThan(0);
    }
  });

  it('handles a 1×1 matrix', () => {
    const r = hermitianEigen(Float64Array.of(-2.5), Float64Array.of(0.75), 1);
    expect(Array.from(r.values)).toEqual([-2.5]);
    expect(r.vectorsRe[0]).toBeCloseTo(1, 15);
  });

  it.each([
    ['a short imaginary part', () => hermitianEigen(new Float64Array(4), new Float64Array(3), 2), /im must hold 2×2 = 4 entries.*got 3/],
    ['an infinite entry', () => hermitianEigen(Float64Array.of(1, Infinity, 0, 1), null, 2), /re\[0, 1\] is Infinity/],
    ['a fractional n', () => hermitianEigen(new Float64Array(4), null, 1.5), /n must be a positive integer, got 1.5/],
  ])('rejects %s with a precise message', (_name, call, message) => {
    expect(call).toThrow(message);
  });
});
