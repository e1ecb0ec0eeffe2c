// Citations of books and papers in this file (authors, years, sections) are given from memory.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { collapsedTriangleRule, QuadratureInputError } from '../../../src-core/numerics/quadrature/index';
import type { Rule2D, Vec2 } from '../../../src-core/numerics/quadrature/index';

const integrate = (r: Rule2D, f: (x: number, y: number, i: number) => number): number => {
  let s = 0;
  for (let i = 0; i < r.w.length; i++) s += r.w[i] * f(r.x[i], r.y[i], i);
  return s;
};
const factorial = (k: number): number => (k <= 1 ? 1 : k * factorial(k - 1));

const O: Vec2 = [0, 0];
const X: Vec2 = [1, 0];
const Y: Vec2 = [0, 1];

describe('collapsedTriangleRule: smooth integrands', () => {
  it('weights are positive and sum to the area, for either vertex orientation', () => {
    const coord = fc.double({ min: -10, max: 10, noNaN: true });
    fc.assert(
      fc.property(coord, coord, coord, coord, coord, coord, fc.integer({ min: 1, max: 9 }), (a, b, c, d, e, f, n) => {
        const area = Math.abs((c - a) * (f - b) - (d - b) * (e - a)) / 2;
        fc.pre(area > 1e-6);
        for (const r of [collapsedTriangleRule([a, b], [c, d], [e, f], n), collapsedTriangleRule([a, b], [e, f], [c, d], n)]) {
          expect(r.w.length).toBe(n * n);
          let s = 0;
          for (const w of r.w) {
            expect(w).toBeGreaterThan(0);
            s += w;
          }
          expect(Math.abs(s - area)).toBeLessThan(1e-13 * area + 1e-300);
        }
      }),
      { numRuns: 200 },
    );
  });

  it('integrates x^a y^b over the unit right triangle to a! b! / (a+b+2)! for a + b ≤ 2n − 2 (common practice)', () => {
    for (let n = 1; n <= 8; n++) {
      const r = collapsedTriangleRule(O, X, Y, n);
      for (let deg = 0; deg <= 2 * n - 2; deg++) {
        for (let a = 0; a <= deg; a++) {
          const b = deg - a;
          const exact = (factorial(a) * factorial(b)) / factorial(a + b + 2);
          const got = integrate(r, (x, y) => x ** a * y ** b);
          expect(Math.abs(got - exact) / exact, `n = ${n}, x^${a} y^${b}`).toBeLessThan(1e-13);
        }
      }
    }
  });

  it('is not exact beyond degree 2n − 1 in general (the bound is sharp in the collapsed direction)', () => {
    for (let n = 2; n <= 5; n++) {
      const r = collapsedTriangleRule(O, X, Y, n);
      const a = 2 * n - 1; // x^(2n−1) has degree 2n in u after the Jacobian
      const exact = factorial(a) / factorial(a + 2);
      expect(Math.abs(integrate(r, (x) => x ** a) - exact)).toBeGreaterThan(1e-8);
    }
  });

  it('matches the edge-midpoint rule on a general triangle for quadratics (common practice)', () => {
    const v0: Vec2 = [0.3, -1.2];
    const v1: Vec2 = [2.5, 0.4];
    const v2: Vec2 = [-0.7, 1.9];
    const f = (x: number, y: number) => 1 - 2 * x + 3 * y + 0.5 * x * x - 1.5 * x * y + 2 * y * y;
    const area = Math.abs((v1[0] - v0[0]) * (v2[1] - v0[1]) - (v1[1] - v0[1]) * (v2[0] - v0[0])) / 2;
    const mid = (p: Vec2, q: Vec2) => f((p[0] + q[0]) / 2, (p[1] + q[1]) / 2);
    const exact = (area / 3) * (mid(v0, v1) + mid(v1, v2) + mid(v2, v0));
    expect(integrate(collapsedTriangleRule(v0, v1, v2, 2), f)).toBeCloseTo(exact, 13);
  });

  it('Duffy without grading cancels 1/r at v0: ∫∫ (x² + y²)^(−1/2) = √2 ln(1 + √2) (polar coordinates)', () => {
    const exact = Math.SQRT2 * Math.log(1 + Math.SQRT2);
    // After the map the integrand is 1/|(1 − v, v)|, analytic with poles at v = (1 ± i)/2: geometric convergence
    // with ratio (1 + √2)^(−2) per point, so 20 points reach rounding level.
    const r = collapsedTriangleRule(O, X, Y, 20);
    expect(Math.abs(integrate(r, (x, y) => 1 / Math.hypot(x, y)) - exact)).toBeLessThan(1e-13);
  });

  it('reports distances to the edge v1–v2 and to v0 that agree with the coordinates', () => {
    const v0: Vec2 = [1, 2];
    const v1: Vec2 = [4, 3];
    const v2: Vec2 = [2, 5];
    const r = collapsedTriangleRule(v0, v1, v2, 5, { gradeTowardEdge: { levels: 4 }, gradeTowardVertex: { levels: 4 } });
    const ex = v2[0] - v1[0];
    const ey = v2[1] - v1[1];
    for (let i = 0; i < r.w.length; i++) {
      const toEdge = Math.abs((r.x[i] - v1[0]) * ey - (r.y[i] - v1[1]) * ex) / Math.hypot(ex, ey);
      expect(Math.abs(r.edgeDistance[i] - toEdge)).toBeLessThan(1e-13);
      expect(Math.abs(r.vertexDistance[i] - Math.hypot(r.x[i] - v0[0], r.y[i] - v0[1]))).toBeLessThan(1e-13);
    }
  });
});

describe('collapsedTriangleRule: grading toward the edge v1–v2', () => {
  // Unit right triangle with v0 = (0, 0) and the hypotenuse x + y = 1 as the edge; d = (1 − x − y)/√2.
  // Level lines x + y = σ have length σ√2 and spacing dσ/√2, so ∫∫ g(x + y) dA = ∫_0^1 g(σ) σ dσ. Hence
  //   ∫∫ d^(−1/2) dA = 2^(1/4) ∫_0^1 (1 − σ)^(−1/2) σ dσ = 2^(1/4) (2 − 2/3) = 4·2^(1/4)/3,
  //   ∫∫ log d dA = ∫_0^1 σ log(1 − σ) dσ − (ln 2/2)(1/2) = −3/4 − ln 2/4,
  // using ∫_0^1 σ log(1 − σ) dσ = ∫_0^1 (1 − t) log t dt = −1 + 1/4.
  const exactSqrt = (4 * 2 ** 0.25) / 3;
  const exactLog = -0.75 - Math.LN2 / 4;

  it('∫∫ d^(−1/2) to 1e-10 using the accurate edge distances', () => {
    const r = collapsedTriangleRule(O, X, Y, 4, { gradeTowardEdge: { levels: 40, pointsPerPanel: 20, minDistance: 0 } });
    const got = integrate(r, (_x, _y, i) => 1 / Math.sqrt(r.edgeDistance[i]));
    expect(Math.abs(got - exactSqrt)).toBeLessThan(1e-10);
  });

  it('∫∫ log d to 1e-10, from the accurate distances and from the coordinates alike', () => {
    const accurate = collapsedTriangleRule(O, X, Y, 4, {
      gradeTowardEdge: { levels: 40, pointsPerPanel: 20, minDistance: 0 },
    });
    expect(Math.abs(integrate(accurate, (_x, _y, i) => Math.log(accurate.edgeDistance[i])) - exactLog)).toBeLessThan(1e-10);
    const r = collapsedTriangleRule(O, X, Y, 4, { gradeTowardEdge: { levels: 40, pointsPerPanel: 20 } });
    expect(Math.abs(integrate(r, (x, y) => Math.log((1 - x - y) / Math.SQRT2)) - exactLog)).toBeLessThan(1e-10);
  });

  it('by default no point rounds onto the edge, so d^(−1/2) from coordinates stays finite and within 1e-7', () => {
    const r = collapsedTriangleRule(O, X, Y, 4, { gradeTowardEdge: { levels: 40, pointsPerPanel: 20 } });
    for (let i = 0; i < r.w.length; i++) expect(1 - r.x[i] - r.y[i]).toBeGreaterThan(0);
    const got = integrate(r, (x, y) => 1 / Math.sqrt((1 - x - y) / Math.SQRT2));
    expect(Number.isFinite(got)).toBe(true);
    // The floating-point grid hides distances below ~1e-16, which caps the accuracy near √ε for d^(−1/2).
    expect(Math.abs(got - exactSqrt)).toBeLessThan(1e-7);
  });

  it('grading is what makes it work: the ungraded rule with as many points is off by more than 1e-4', () => {
    const r = collapsedTriangleRule(O, X, Y, 40);
    expect(Math.abs(integrate(r, (x, y) => 1 / Math.sqrt((1 - x - y) / Math.SQRT2)) - exactSqrt)).toBeGreaterThan(1e-4);
  });

  it('an edge through the origin (x = 0): ∫∫ x^(−1/2) dA = ∫_0^1 x^(−1/2)(1 − x) dx = 4/3 to 1e-12', () => {
    const r = collapsedTriangleRule(X, Y, O, 4, { gradeTowardEdge: { levels: 40, pointsPerPanel: 20, minDistance: 0 } });
    expect(Math.abs(integrate(r, (x) => 1 / Math.sqrt(x)) - 4 / 3)).toBeLessThan(1e-12);
  });
});

describe('collapsedTriangleRule: grading toward the vertex v0', () => {
  it('∫∫ (x + y)^(−3/2) dA = ∫_0^1 σ^(−3/2) σ dσ = 2 to 1e-10 (singular like r^(−3/2) at v0)', () => {
    const r = collapsedTriangleRule(O, X, Y, 4, { gradeTowardVertex: { levels: 40, pointsPerPanel: 20 } });
    expect(Math.abs(integrate(r, (x, y) => (x + y) ** -1.5) - 2)).toBeLessThan(1e-10);
    const plain = collapsedTriangleRule(O, X, Y, 20);
    expect(Math.abs(integrate(plain, (x, y) => (x + y) ** -1.5) - 2)).toBeGreaterThan(1e-3);
  });

  it('grading both ways keeps the area and integrates both singularities', () => {
    const r = collapsedTriangleRule(O, X, Y, 4, {
      gradeTowardVertex: { levels: 40, pointsPerPanel: 20 },
      gradeTowardEdge: { levels: 40, pointsPerPanel: 20, minDistance: 0 },
    });
    expect(Math.abs(integrate(r, () => 1) - 0.5)).toBeLessThan(1e-15);
    // ∫_0^1 σ^(−1/2) (1 − σ)^(−1/2) σ dσ · 2^(1/4) = 2^(1/4) B(3/2, 1/2) = 2^(1/4) π/2
    const got = integrate(r, (x, y, i) => (x + y) ** -1.5 * (x + y) / Math.sqrt(r.edgeDistance[i]));
    expect(Math.abs(got - (2 ** 0.25 * Math.PI) / 2)).toBeLessThan(1e-10);
  });
});

describe('collapsedTriangleRule: input checks', () => {
  it('rejects bad n, non-finite vertices, bad grading', () => {
    expect(() => collapsedTriangleRule(O, X, Y, 0)).toThrow(QuadratureInputError);
    expect(() => collapsedTriangleRule([Number.NaN, 0], X, Y, 3)).toThrow(/v0/);
    expect(() => collapsedTriangleRule(O, X, Y, 3, { gradeTowardEdge: { ratio: 2 } })).toThrow(/ratio/);
    expect(() => collapsedTriangleRule(O, X, Y, 3, { gradeTowardEdge: { pointsPerPanel: 0 } })).toThrow(/pointsPerPanel/);
    expect(() => collapsedTriangleRule(O, X, Y, 3, { gradeTowardVertex: { minDistance: -1 } })).toThrow(/minDistance/);
  });
});
