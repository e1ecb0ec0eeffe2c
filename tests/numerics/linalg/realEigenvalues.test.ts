/**
 * Eigenvalues of real general matrices without eigenvectors (Hessenberg reduction + Francis double-shift QR),
 * checked against ml-matrix's EigenvalueDecomposition (a reference library), and against matrices
 * with known spectra: companion matrices of polynomials with chosen roots, rotations, Jordan blocks, triangular and
 * zero matrices (facts of the trade).
 */
import { describe, expect, it } from 'vitest';
import { EigenvalueDecomposition, Matrix } from 'ml-matrix';
import {
  hessenbergEigenvalues, hessenbergEigenvector, hessenbergReduce, realEigenvalues,
} from '../../../src-core/numerics/linalg/realEigenvalues';
import { matchedDistance, randomMatrix } from './helpers';

function mlValues(a: Float64Array, n: number): { re: number[]; im: number[] } {
  const m = new Matrix(n, n);
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) m.set(i, j, a[i * n + j]);
  const e = new EigenvalueDecomposition(m);
  return { re: e.realEigenvalues, im: e.imaginaryEigenvalues };
}

describe('realEigenvalues', () => {
  for (const [n, seed] of [[1, 1], [2, 2], [3, 3], [7, 4], [30, 5], [120, 6]] as const) {
    it(`matches ml-matrix on a random ${n}×${n} matrix`, () => {
      const a = randomMatrix(n, n, 900 + seed);
      const copy = Float64Array.from(a);
      const r = realEigenvalues(a, n);
      expect(r.converged).toBe(true);
      expect(a).toEqual(copy); // input untouched
      const ref = mlValues(a, n);
      let scale = 0;
      for (let k = 0; k < n; k++) scale = Math.max(scale, Math.hypot(ref.re[k], ref.im[k]));
      expect(matchedDistance(r.re, r.im, ref.re, ref.im)).toBeLessThan(1e-11 * Math.max(1, scale) * Math.sqrt(n));
    });
  }

  it('finds the roots of a companion matrix: 1, 2, 3 and the pair 0.5 ± 2i', () => {
    // x⁵ − 7x⁴ + 21.25x³ − 42.5x² + 52.75x − 25.5 = (x − 1)(x − 2)(x − 3)(x² − x + 4.25)
    const c = [-7, 21.25, -42.5, 52.75, -25.5];
    const n = 5;
    const a = new Float64Array(n * n);
    for (let j = 0; j < n; j++) a[j] = -c[j];
    for (let i = 1; i < n; i++) a[i * n + i - 1] = 1;
    const r = realEigenvalues(a, n);
    expect(matchedDistance(r.re, r.im, [1, 2, 3, 0.5, 0.5], [0, 0, 0, 2, -2])).toBeLessThan(1e-10);
  });

  it('gives ±i·sin θ + cos θ for a plane rotation and keeps conjugate pairs exact', () => {
    const th = 0.7;
    const a = Float64Array.from([Math.cos(th), -Math.sin(th), Math.sin(th), Math.cos(th)]);
    const r = realEigenvalues(a, 2);
    expect(matchedDistance(r.re, r.im, [Math.cos(th), Math.cos(th)], [Math.sin(th), -Math.sin(th)])).toBeLessThan(1e-15);
  });

  it('handles zero, triangular and defective (Jordan block) matrices', () => {
    expect(Array.from(realEigenvalues(new Float64Array(16), 4).re)).toEqual([0, 0, 0, 0]);
    const tri = Float64Array.from([4, 1, 2, 0, -1, 5, 0, 0, 2.5]);
    const rt = realEigenvalues(tri, 3);
    expect(matchedDistance(rt.re, rt.im, [4, -1, 2.5], [0, 0, 0])).toBeLessThan(1e-14);
    // A 4×4 Jordan block for 2: eigenvalues are perturbed by about ε^(1/4) (common practice).
    const j = new Float64Array(16);
    for (let i = 0; i < 4; i++) { j[i * 4 + i] = 2; if (i < 3) j[i * 4 + i + 1] = 1; }
    const rj = realEigenvalues(j, 4);
    for (let k = 0; k < 4; k++) expect(Math.hypot(rj.re[k] - 2, rj.im[k])).toBeLessThan(1e-3);
  });

  it('finds unit eigenvectors of the leading eigenvalues by inverse iteration, real and complex, with residual at rounding level', () => {
    for (const [n, seed] of [[5, 11], [40, 12], [150, 13]] as const) {
      const a = randomMatrix(n, n, 1300 + seed);
      const form = hessenbergReduce(a, n);
      const values = hessenbergEigenvalues(Float64Array.from(form.h), n);
      const order = Array.from(values.re.keys())
        .sort((x, y) => Math.hypot(values.re[y], values.im[y]) - Math.hypot(values.re[x], values.im[x]));
      let anorm = 0;
      for (let i = 0; i < n; i++) {
        let row = 0;
        for (let j = 0; j < n; j++) row += Math.abs(a[i * n + j]);
        anorm = Math.max(anorm, row);
      }
      let complexSeen = false;
      for (const k of order.slice(0, Math.min(n, 10))) {
        const mr = values.re[k];
        const mi = values.im[k];
        if (mi !== 0) complexSeen = true;
        const v = hessenbergEigenvector(form, mr, mi);
        let norm2 = 0;
        let residual = 0;
        for (let i = 0; i < n; i++) {
          norm2 += v.re[i] ** 2 + v.im[i] ** 2;
          let rr = -(mr * v.re[i] - mi * v.im[i]);
          let ri = -(mr * v.im[i] + mi * v.re[i]);
          for (let j = 0; j < n; j++) { rr += a[i * n + j] * v.re[j]; ri += a[i * n + j] * v.im[j]; }
          residual = Math.max(residual, Math.hypot(rr, ri));
        }
        expect(Math.abs(norm2 - 1)).toBeLessThan(1e-12);
        expect(residual).toBeLessThan(1e-11 * anorm);
      }
      if (n >= 40) expect(complexSeen).toBe(true);
    }
  });
});
