import { describe, expect, it } from 'vitest';
import {
  gaussLegendre,
  legendreDerivative,
  legendreMatrix,
  mapRule,
  panelBasis,
  panelBasisDerivative,
  QuadratureInputError,
} from '../../../src-core/numerics/quadrature/index';

/** Gram matrix Σ_i w_i f_j(x_i) f_k(x_i) of a row-major value table. */
function gram(values: Float64Array, weights: Float64Array, cols: number): number[][] {
  const g = Array.from({ length: cols }, () => new Array<number>(cols).fill(0));
  for (let i = 0; i < weights.length; i++) {
    for (let j = 0; j < cols; j++) {
      for (let k = 0; k < cols; k++) g[j][k] += weights[i] * values[i * cols + j] * values[i * cols + k];
    }
  }
  return g;
}

function expectIdentity(g: number[][], tol: number): void {
  for (let j = 0; j < g.length; j++) {
    for (let k = 0; k < g.length; k++) {
      expect(Math.abs(g[j][k] - (j === k ? 1 : 0)), `G[${j}][${k}]`).toBeLessThan(tol);
    }
  }
}

describe('legendreMatrix', () => {
  it('is orthonormal on [-1, 1] (Gram matrix by Gauss quadrature = I to 1e-14), degree 0..40', () => {
    const degree = 40;
    const rule = gaussLegendre(degree + 1); // exact for degree 2·degree + 1 products
    expectIdentity(gram(legendreMatrix(rule.nodes, degree), rule.weights, degree + 1), 1e-14);
  });

  it('matches P_0 = 1, P_1 = x, P_2 = (3x² − 1)/2, P_3 = (5x³ − 3x)/2 scaled by √((2k+1)/2)', () => {
    const x = new Float64Array([-1, -0.7, -0.2, 0, 0.3, 0.9, 1]);
    const v = legendreMatrix(x, 3);
    for (let i = 0; i < x.length; i++) {
      const t = x[i];
      const closed = [1, t, (3 * t * t - 1) / 2, (5 * t ** 3 - 3 * t) / 2];
      for (let k = 0; k <= 3; k++) {
        expect(v[i * 4 + k]).toBeCloseTo(Math.sqrt((2 * k + 1) / 2) * closed[k], 15);
      }
    }
  });

  it('has p_k(1) = √((2k+1)/2) and p_k(−1) = (−1)^k √((2k+1)/2) (P_k(±1) = (±1)^k)', () => {
    const v = legendreMatrix(new Float64Array([1, -1]), 60);
    for (let k = 0; k <= 60; k++) {
      const s = Math.sqrt((2 * k + 1) / 2);
      expect(Math.abs(v[k] - s)).toBeLessThan(1e-13 * s);
      expect(Math.abs(v[61 + k] - (-1) ** k * s)).toBeLessThan(1e-13 * s);
    }
  });

  it('rejects a negative or fractional degree and non-finite points', () => {
    expect(() => legendreMatrix(new Float64Array([0]), -1)).toThrow(QuadratureInputError);
    expect(() => legendreMatrix(new Float64Array([0]), 1.5)).toThrow(/degree/);
    expect(() => legendreMatrix(new Float64Array([Number.NaN]), 2)).toThrow(/not finite/);
  });
});

describe('legendreDerivative', () => {
  it('matches P_2′ = 3x and P_3′ = (15x² − 3)/2', () => {
    const x = new Float64Array([-0.8, 0.1, 0.55]);
    const d = legendreDerivative(x, 3);
    for (let i = 0; i < x.length; i++) {
      const t = x[i];
      expect(d[i * 4]).toBe(0);
      expect(d[i * 4 + 1]).toBeCloseTo(Math.sqrt(3 / 2), 15);
      expect(d[i * 4 + 2]).toBeCloseTo(Math.sqrt(5 / 2) * 3 * t, 14);
      expect(d[i * 4 + 3]).toBeCloseTo((Math.sqrt(7 / 2) * (15 * t * t - 3)) / 2, 14);
    }
  });

  it('has P_k′(1) = k(k+1)/2 (common practice)', () => {
    const d = legendreDerivative(new Float64Array([1]), 30);
    for (let k = 0; k <= 30; k++) {
      const expected = (Math.sqrt((2 * k + 1) / 2) * k * (k + 1)) / 2;
      expect(Math.abs(d[k] - expected)).toBeLessThan(1e-12 * (1 + expected));
    }
  });

  it('agrees with central differences of legendreMatrix at degree 20', () => {
    const h = 1e-6;
    const x = new Float64Array([-0.93, -0.4, 0.05, 0.61, 0.97]);
    const d = legendreDerivative(x, 20);
    const up = legendreMatrix(x.map((t) => t + h), 20);
    const down = legendreMatrix(x.map((t) => t - h), 20);
    for (let i = 0; i < d.length; i++) {
      const fd = (up[i] - down[i]) / (2 * h);
      expect(Math.abs(d[i] - fd)).toBeLessThan(1e-6 * (1 + Math.abs(d[i])));
    }
  });
});

describe('panelBasis', () => {
  it('is orthonormal on [a, b] = [0.3, 2.1]', () => {
    const degree = 12;
    const rule = mapRule(gaussLegendre(degree + 1), 0.3, 2.1);
    expectIdentity(gram(panelBasis(rule.nodes, 0.3, 2.1, degree), rule.weights, degree + 1), 1e-14);
  });

  it('is the reference basis times √(2/(b − a)) at mapped points', () => {
    const a = -2;
    const b = 3;
    const t = new Float64Array([-1, -0.25, 0.5, 1]);
    const x = t.map((v) => a + ((b - a) * (v + 1)) / 2);
    const ref = legendreMatrix(t, 5);
    const pan = panelBasis(x, a, b, 5);
    for (let i = 0; i < ref.length; i++) expect(pan[i]).toBeCloseTo(ref[i] * Math.sqrt(2 / (b - a)), 14);
  });

  it('has derivatives d/dx q_2 = √(2/(b−a)) √(5/2) · 3t · 2/(b−a)', () => {
    const a = 1;
    const b = 1.5;
    const x = new Float64Array([1.1, 1.4]);
    const d = panelBasisDerivative(x, a, b, 2);
    for (let i = 0; i < 2; i++) {
      const t = (2 * x[i] - a - b) / (b - a);
      expect(d[i * 3 + 2]).toBeCloseTo(Math.sqrt(2 / (b - a)) * Math.sqrt(5 / 2) * 3 * t * (2 / (b - a)), 12);
    }
  });

  it('rejects an empty or reversed panel', () => {
    expect(() => panelBasis(new Float64Array([0]), 1, 1, 2)).toThrow(QuadratureInputError);
    expect(() => panelBasis(new Float64Array([0]), 2, 1, 2)).toThrow(/a < b/);
  });
});
