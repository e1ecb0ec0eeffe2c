import { describe, expect, it } from 'vitest';
import { eigs } from 'mathjs';
import { EigenvalueDecomposition, Matrix } from 'ml-matrix';
import { frobeniusNorm, generalEigen } from '../../../src-core/numerics/linalg';
import {
  adjoint,
  cmatmul,
  type CMat,
  matchedDistance,
  mathjsValues,
  maxResidual,
  randomMatrix,
  randomUnitary,
  toMathjs,
  zeros,
} from './helpers';

/** Companion matrix (first row −c_{n−1} … −c_0, ones on the subdiagonal) of the monic polynomial with these roots. */
function companion(rootsRe: number[], rootsIm: number[]): CMat {
  const n = rootsRe.length;
  // coefficients of Π (x − r), highest first: c[0] = 1
  let cRe = [1];
  let cIm = [0];
  for (let k = 0; k < n; k++) {
    const nr = new Array(cRe.length + 1).fill(0);
    const ni = new Array(cRe.length + 1).fill(0);
    for (let p = 0; p < cRe.length; p++) {
      nr[p] += cRe[p];
      ni[p] += cIm[p];
      nr[p + 1] -= cRe[p] * rootsRe[k] - cIm[p] * rootsIm[k];
      ni[p + 1] -= cRe[p] * rootsIm[k] + cIm[p] * rootsRe[k];
    }
    cRe = nr;
    cIm = ni;
  }
  const re = new Float64Array(n * n);
  const im = new Float64Array(n * n);
  for (let j = 0; j < n; j++) {
    re[j] = -cRe[j + 1];
    im[j] = -cIm[j + 1];
  }
  for (let i = 1; i < n; i++) re[i * n + i - 1] = 1;
  return { re, im };
}

function checkPairs(a: CMat, n: number, tolRel = 1e-10) {
  const r = generalEigen(a.re, a.im, n);
  expect(r.converged).toBe(true);
  const v = { re: r.vectorsRe, im: r.vectorsIm };
  const norm = frobeniusNorm(a.re, a.im);
  expect(maxResidual(a, n, r.valuesRe, r.valuesIm, v)).toBeLessThanOrEqual(tolRel * norm);
  for (let k = 0; k < n; k++) {
    let s = 0;
    for (let i = 0; i < n; i++) s += r.vectorsRe[i * n + k] ** 2 + r.vectorsIm[i * n + k] ** 2;
    expect(Math.abs(Math.sqrt(s) - 1)).toBeLessThan(1e-13);
    if (k > 0) {
      expect(Math.hypot(r.valuesRe[k], r.valuesIm[k])).toBeLessThanOrEqual(Math.hypot(r.valuesRe[k - 1], r.valuesIm[k - 1]));
    }
  }
  return r;
}

describe('generalEigen', () => {
  it.each([0.3, 1, 2.5])('finds e^{±iθ} for the rotation by θ = %f', (theta) => {
    const a = { re: Float64Array.of(Math.cos(theta), -Math.sin(theta), Math.sin(theta), Math.cos(theta)), im: zeros(4) };
    const r = checkPairs(a, 2);
    expect(matchedDistance(r.valuesRe, r.valuesIm, [Math.cos(theta), Math.cos(theta)], [Math.sin(theta), -Math.sin(theta)])).toBeLessThan(1e-15);
    expect(r.valuesIm[0]).toBeGreaterThan(0); // ties in modulus: larger imaginary part first
  });

  it('finds e^{i(φ±θ)} for a rotation times the complex phase e^{iφ} (complex path)', () => {
    const theta = 0.7;
    const phi = 0.4;
    const c = Math.cos(theta);
    const s = Math.sin(theta);
    const rot = [c, -s, s, c];
    const a = {
      re: Float64Array.from(rot.map((x) => x * Math.cos(phi))),
      im: Float64Array.from(rot.map((x) => x * Math.sin(phi))),
    };
    const r = checkPairs(a, 2);
    const expRe = [Math.cos(phi + theta), Math.cos(phi - theta)];
    const expIm = [Math.sin(phi + theta), Math.sin(phi - theta)];
    expect(matchedDistance(r.valuesRe, r.valuesIm, expRe, expIm)).toBeLessThan(1e-14);
  });

  it.each([
    ['real polynomial', [1, 1, -3, 0.5, 0, 0], [2, -2, 0, 0, 2, -2]],
    ['complex polynomial', [1, 2, -1, 0, 0.5], [1, -1, 0, 3, -0.5]],
    ['complex polynomial, 9 roots', [1, 2, -1, 0, 0.5, -2, 1.5, 0.1, -0.7], [1, -1, 0, 3, -0.5, 2, -2.5, 0.3, -1.2]],
  ])('finds the roots of a %s from its companion matrix', (_name, rootsRe, rootsIm) => {
    const n = rootsRe.length;
    const a = companion(rootsRe, rootsIm);
    const r = checkPairs(a, n);
    expect(matchedDistance(r.valuesRe, r.valuesIm, rootsRe, rootsIm)).toBeLessThan(1e-9);
  });

  it.each([61, 62, 63, 64])('agrees with mathjs eigs on a random complex 10×10 matrix (seed %i)', (seed) => {
    const n = 10;
    const a = { re: randomMatrix(n, n, seed), im: randomMatrix(n, n, seed + 100) };
    const r = checkPairs(a, n, 1e-10);
    const ref = mathjsValues(eigs(toMathjs(a.re, a.im, n)).values);
    expect(matchedDistance(r.valuesRe, r.valuesIm, ref.re, ref.im)).toBeLessThan(1e-10);
  });

  // (mathjs eigs stops without converging on some real 12×12 matrices, e.g. seed 72; these seeds it handles.)
  it.each([71, 73, 75])('agrees with ml-matrix and mathjs on a real nonsymmetric 12×12 matrix (seed %i)', (seed) => {
    const n = 12;
    const re = randomMatrix(n, n, seed);
    const r = checkPairs({ re, im: zeros(n * n) }, n);
    const evd = new EigenvalueDecomposition(new Matrix(Array.from({ length: n }, (_, i) => Array.from(re.subarray(i * n, i * n + n)))));
    expect(matchedDistance(r.valuesRe, r.valuesIm, evd.realEigenvalues, evd.imaginaryEigenvalues)).toBeLessThan(1e-12);
    const ref = mathjsValues(eigs(toMathjs(re, null, n)).values);
    expect(matchedDistance(r.valuesRe, r.valuesIm, ref.re, ref.im)).toBeLessThan(1e-10);
    // Conjugate pairs come with conjugate vectors.
    expect(Array.from(r.valuesIm).some((x) => x !== 0)).toBe(true);
  });

  it('the complex path on e^{iφ}A gives e^{iφ} times the real path on A', () => {
    const n = 30;
    const re = randomMatrix(n, n, 81);
    const phi = 1.1;
    const rotated = { re: re.map((x) => x * Math.cos(phi)), im: re.map((x) => x * Math.sin(phi)) };
    const real = checkPairs({ re, im: zeros(n * n) }, n);
    const cplx = checkPairs(rotated, n);
    const expRe = Array.from(real.valuesRe, (x, k) => x * Math.cos(phi) - real.valuesIm[k] * Math.sin(phi));
    const expIm = Array.from(real.valuesRe, (x, k) => x * Math.sin(phi) + real.valuesIm[k] * Math.cos(phi));
    expect(matchedDistance(cplx.valuesRe, cplx.valuesIm, expRe, expIm)).toBeLessThan(1e-11);
  });

  it('returns the diagonal of a triangular complex matrix', () => {
    const n = 5;
    const a = { re: new Float64Array(n * n), im: new Float64Array(n * n) };
    const diag = [
      [4, 1],
      [-3, 0.5],
      [0, 2],
      [1, -1],
      [0.25, 0],
    ];
    for (let i = 0; i < n; i++) {
      a.re[i * n + i] = diag[i][0];
      a.im[i * n + i] = diag[i][1];
      for (let j = i + 1; j < n; j++) {
        a.re[i * n + j] = 0.3 * (i + j);
        a.im[i * n + j] = -0.1 * j;
      }
    }
    const r = checkPairs(a, n, 1e-13);
    expect(matchedDistance(r.valuesRe, r.valuesIm, diag.map((d) => d[0]), diag.map((d) => d[1]))).toBe(0);
  });

  describe('defective Jordan blocks return (no hang) with values close to the exact one', () => {
    it.each([4, 8])('real Jordan block of size %i hidden by an orthogonal similarity', (n) => {
      const j = new Float64Array(n * n);
      for (let i = 0; i < n; i++) {
        j[i * n + i] = 2;
        if (i + 1 < n) j[i * n + i + 1] = 1;
      }
      // Q = I − 2 w wᵀ / wᵀw: a real orthogonal (and symmetric) similarity.
      const w = randomMatrix(n, 1, 91 + n);
      const wn = Math.hypot(...w);
      const q = new Float64Array(n * n);
      for (let a = 0; a < n; a++) for (let b = 0; b < n; b++) q[a * n + b] = (a === b ? 1 : 0) - (2 * w[a] * w[b]) / (wn * wn);
      const qc = { re: q, im: zeros(n * n) };
      const a = cmatmul(cmatmul(qc, { re: j, im: zeros(n * n) }, n, n, n), qc, n, n, n);
      const r = generalEigen(a.re, null, n);
      expect(r.converged).toBe(true);
      // Perturbations of size ε move the eigenvalues of a Jordan block by about ε^{1/n}.
      const spread = 10 * Math.pow(2 ** -52 * 4, 1 / n);
      for (let k = 0; k < n; k++) expect(Math.hypot(r.valuesRe[k] - 2, r.valuesIm[k])).toBeLessThan(spread);
      for (const x of r.vectorsRe) expect(Number.isFinite(x)).toBe(true);
    });

    it.each([4, 8, 16])('complex Jordan block of size %i hidden by a unitary similarity', (n) => {
      const j = { re: new Float64Array(n * n), im: new Float64Array(n * n) };
      for (let i = 0; i < n; i++) {
        j.re[i * n + i] = 1;
        j.im[i * n + i] = 2;
        if (i + 1 < n) j.re[i * n + i + 1] = 1;
      }
      const u = randomUnitary(n, 100 + n);
      const a = cmatmul(cmatmul(u, j, n, n, n), adjoint(u, n, n), n, n, n);
      const r = generalEigen(a.re, a.im, n);
      expect(typeof r.converged).toBe('boolean');
      expect(r.converged).toBe(true);
      const spread = 10 * Math.pow(2 ** -52 * 4, 1 / n);
      for (let k = 0; k < n; k++) expect(Math.hypot(r.valuesRe[k] - 1, r.valuesIm[k] - 2)).toBeLessThan(spread);
      for (let p = 0; p < n * n; p++) expect(Number.isFinite(r.vectorsRe[p]) && Number.isFinite(r.vectorsIm[p])).toBe(true);
      // Every computed vector is (nearly) the single true eigenvector u₀ = first column of U.
      for (let k = 0; k < n; k++) {
        let dr = 0;
        let di = 0;
        for (let i = 0; i < n; i++) {
          dr += u.re[i * n] * r.vectorsRe[i * n + k] + u.im[i * n] * r.vectorsIm[i * n + k];
          di += u.re[i * n] * r.vectorsIm[i * n + k] - u.im[i * n] * r.vectorsRe[i * n + k];
        }
        expect(Math.hypot(dr, di)).toBeGreaterThan(0.99);
      }
    });
  });

  it.each([
    ['a non-square size', () => generalEigen(new Float64Array(6), null, 2), /re must hold 2×2 = 4 entries.*got 6/],
    ['a NaN imaginary entry', () => generalEigen(new Float64Array(4), Float64Array.of(0, 0, NaN, 0), 2), /im\[1, 0\] is NaN/],
    ['a negative n', () => generalEigen(new Float64Array(4), null, -2), /n must be a positive integer, got -2/],
  ])('rejects %s with a precise message', (_name, call, message) => {
    expect(call).toThrow(message);
  });
});
