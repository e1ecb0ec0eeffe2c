import { describe, expect, it } from 'vitest';
import { complexHessenberg } from '../../../src-core/numerics/linalg/complexHessenberg';
import { complexSchur } from '../../../src-core/numerics/linalg/complexSchur';
import { generalEigen } from '../../../src-core/numerics/linalg';
import { adjoint, cmatmul, type CMat, matchedDistance, orthonormalityDefect, randomMatrix } from './helpers';

function maxDiff(a: CMat, b: CMat): number {
  let worst = 0;
  for (let p = 0; p < a.re.length; p++) worst = Math.max(worst, Math.hypot(a.re[p] - b.re[p], a.im[p] - b.im[p]));
  return worst;
}

describe('complex Hessenberg and Schur factors', () => {
  it.each([3, 9, 25])('A = Q H Qᴴ with H Hessenberg and Q unitary, then A = Z T Zᴴ with T triangular (n = %i)', (n) => {
    const a = { re: randomMatrix(n, n, 200 + n), im: randomMatrix(n, n, 300 + n) };
    const h = { re: Float64Array.from(a.re), im: Float64Array.from(a.im) };
    const q = complexHessenberg(h.re, h.im, n);
    expect(orthonormalityDefect(q, n)).toBeLessThan(1e-13);
    for (let i = 0; i < n; i++) for (let j = 0; j < i - 1; j++) expect(Math.hypot(h.re[i * n + j], h.im[i * n + j])).toBe(0);
    const back = cmatmul(cmatmul(q, h, n, n, n), adjoint(q, n, n), n, n, n);
    expect(maxDiff(back, a)).toBeLessThan(1e-13 * n);

    const result = complexSchur(h.re, h.im, q.re, q.im, n);
    expect(result.converged).toBe(true);
    expect(orthonormalityDefect(q, n)).toBeLessThan(1e-13 * n);
    for (let i = 0; i < n; i++) for (let j = 0; j < i; j++) expect(Math.hypot(h.re[i * n + j], h.im[i * n + j])).toBe(0);
    const schurBack = cmatmul(cmatmul(q, h, n, n, n), adjoint(q, n, n), n, n, n);
    expect(maxDiff(schurBack, a)).toBeLessThan(1e-13 * n);
  });

  it('reports converged = false instead of looping when the step budget is exhausted', () => {
    const n = 12;
    const h = { re: randomMatrix(n, n, 400), im: randomMatrix(n, n, 401) };
    complexHessenberg(h.re, h.im, n);
    const z = { re: new Float64Array(n * n), im: new Float64Array(n * n) };
    for (let i = 0; i < n; i++) z.re[i * n + i] = 1;
    const result = complexSchur(h.re, h.im, z.re, z.im, n, 1);
    expect(result.converged).toBe(false);
    expect(result.steps).toBeGreaterThanOrEqual(1);
  });

  it('gets past the stall of the cyclic shift (Wilkinson shift 0) through exceptional shifts', () => {
    // The cyclic permutation is unitary Hessenberg; a QR step with shift 0 maps it to itself, so only the
    // exceptional shifts make progress. Its eigenvalues are the n-th roots of unity (times e^{iφ}).
    const n = 7;
    const phi = 0.3;
    const re = new Float64Array(n * n);
    const im = new Float64Array(n * n);
    for (let i = 0; i < n; i++) {
      const j = (i + n - 1) % n;
      re[i * n + j] = Math.cos(phi);
      im[i * n + j] = Math.sin(phi);
    }
    const r = generalEigen(re, im, n);
    expect(r.converged).toBe(true);
    const expRe = Array.from({ length: n }, (_, k) => Math.cos(phi + (2 * Math.PI * k) / n));
    const expIm = Array.from({ length: n }, (_, k) => Math.sin(phi + (2 * Math.PI * k) / n));
    expect(matchedDistance(r.valuesRe, r.valuesIm, expRe, expIm)).toBeLessThan(1e-12);
  });
});
