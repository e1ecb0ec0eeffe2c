// Citations of books and papers in this file (authors, years, sections) are given from memory.
import { describe, expect, it } from 'vitest';
import { gamma } from 'mathjs';
import { gaussLegendre, QuadratureInputError } from '../../../src-core/numerics/quadrature/index';
import { gaussJacobi, jacobiWeightIntegral } from '../../../src-core/numerics/quadrature/gaussJacobi';

const betaFn = (p: number, q: number): number => (gamma(p) * gamma(q)) / gamma(p + q);

/** ∫_{-1}^{1} (1 − x)^α (1 + x)^(β+m) dx = 2^(α+β+m+1) B(α+1, β+m+1) (substitute x = 2t − 1). */
const shiftedMoment = (alpha: number, beta: number, m: number): number =>
  2 ** (alpha + beta + m + 1) * betaFn(alpha + 1, beta + m + 1);

/**
 * ∫ (1 − x)^α (1 + x)^β x^k dx from the shifted moments: x^k = Σ_j C(k, j) (1 + x)^j (−1)^(k−j). Also returns the
 * sum of the absolute terms, the scale of the rounding error of this alternating sum.
 */
function monomialMoment(alpha: number, beta: number, k: number): { value: number; scale: number } {
  let value = 0;
  let scale = 0;
  let binom = 1;
  for (let j = 0; j <= k; j++) {
    const term = binom * shiftedMoment(alpha, beta, j);
    value += (-1) ** (k - j) * term;
    scale += term;
    binom = (binom * (k - j)) / (j + 1);
  }
  return { value, scale };
}

const cases: [number, number][] = [
  [-0.5, 0],
  [-0.5, -0.5],
  [0.3, -0.7],
  [-0.9, 1.5],
];

describe('gaussJacobi: moments against the Beta-function closed form', () => {
  for (const [alpha, beta] of cases) {
    it(`α = ${alpha}, β = ${beta}: exact for x^k, k ≤ 6, with n = 4`, () => {
      const { nodes, weights } = gaussJacobi(4, alpha, beta);
      for (let k = 0; k <= 6; k++) {
        let s = 0;
        for (let i = 0; i < 4; i++) s += weights[i] * nodes[i] ** k;
        const exact = monomialMoment(alpha, beta, k);
        expect(Math.abs(s - exact.value), `x^${k}`).toBeLessThan(1e-14 * exact.scale);
      }
    });

    it(`α = ${alpha}, β = ${beta}: exact for (1 + x)^m, m ≤ 2n − 1 (the same polynomial space), n = 1..30`, () => {
      for (let n = 1; n <= 30; n++) {
        const { nodes, weights } = gaussJacobi(n, alpha, beta);
        for (let m = 0; m <= 2 * n - 1; m++) {
          let s = 0;
          for (let i = 0; i < n; i++) s += weights[i] * (1 + nodes[i]) ** m;
          const exact = shiftedMoment(alpha, beta, m);
          expect(Math.abs(s - exact) / exact, `n = ${n}, m = ${m}`).toBeLessThan(3e-14);
        }
      }
    });
  }

  it('is not exact for (1 + x)^(2n): the Gauss degree bound is sharp', () => {
    const { nodes, weights } = gaussJacobi(5, -0.5, 0);
    let s = 0;
    for (let i = 0; i < 5; i++) s += weights[i] * (1 + nodes[i]) ** 10;
    expect(Math.abs(s - shiftedMoment(-0.5, 0, 10))).toBeGreaterThan(1e-6);
  });
});

describe('gaussJacobi: known special cases', () => {
  it('α = β = −1/2 gives Gauss–Chebyshev: nodes cos((2k−1)π/(2n)), weights π/n (common practice)', () => {
    for (const n of [1, 2, 3, 8, 33, 100]) {
      const { nodes, weights } = gaussJacobi(n, -0.5, -0.5);
      for (let k = 1; k <= n; k++) {
        // Ascending order: the k-th largest node sits at index n − k.
        expect(Math.abs(nodes[n - k] - Math.cos(((2 * k - 1) * Math.PI) / (2 * n)))).toBeLessThan(3e-16 * n + 1e-15);
        expect(Math.abs(weights[n - k] / (Math.PI / n) - 1)).toBeLessThan(5e-14);
      }
    }
  });

  it('α = β = 0 reproduces gaussLegendre', () => {
    for (const n of [1, 4, 17, 60]) {
      const j = gaussJacobi(n, 0, 0);
      const l = gaussLegendre(n);
      for (let i = 0; i < n; i++) {
        expect(Math.abs(j.nodes[i] - l.nodes[i])).toBeLessThan(1e-15);
        expect(Math.abs(j.weights[i] / l.weights[i] - 1)).toBeLessThan(5e-14);
      }
    }
  });

  it('μ₀ closed forms: α = β = −1/2 gives π, α = −1/2, β = 0 gives 2√2', () => {
    expect(jacobiWeightIntegral(-0.5, -0.5)).toBeCloseTo(Math.PI, 14);
    expect(jacobiWeightIntegral(-0.5, 0)).toBeCloseTo(2 * Math.SQRT2, 14);
  });

  it('handles an endpoint singularity: ∫_0^1 r^(−1/2) cos r dr via (1 − x)^(−1/2) after r = (1 − x)/2', () => {
    // ∫_0^1 r^(−1/2) cos r dr = √(2π) C(√(2/π)) with the Fresnel integral C; series: Σ (−1)^j / ((2j)! (2j + 1/2)).
    let series = 0;
    let fact = 1;
    for (let j = 0; j < 15; j++) {
      if (j > 0) fact *= 2 * j * (2 * j - 1);
      series += (-1) ** j / (fact * (2 * j + 0.5));
    }
    const { nodes, weights } = gaussJacobi(8, -0.5, 0);
    let s = 0;
    for (let i = 0; i < nodes.length; i++) {
      const r = (1 - nodes[i]) / 2;
      // dr = dx/2 and r^(−1/2) = √2 (1 − x)^(−1/2).
      s += weights[i] * Math.SQRT2 * Math.cos(r) * 0.5;
    }
    expect(Math.abs(s - series)).toBeLessThan(1e-15 * 10);
  });
});

describe('gaussJacobi: input checks', () => {
  it('rejects α ≤ −1, β ≤ −1, NaN and bad n', () => {
    expect(() => gaussJacobi(3, -1, 0)).toThrow(QuadratureInputError);
    expect(() => gaussJacobi(3, 0, -1.5)).toThrow(/β > −1/);
    expect(() => gaussJacobi(3, Number.NaN, 0)).toThrow(QuadratureInputError);
    expect(() => gaussJacobi(0, 0, 0)).toThrow(/number of points n/);
  });

  it('returns copies, so callers cannot alter the cache', () => {
    const r = gaussJacobi(3, -0.5, 0);
    const x0 = r.nodes[0];
    r.nodes[0] = 7;
    expect(gaussJacobi(3, -0.5, 0).nodes[0]).toBe(x0);
  });
});
