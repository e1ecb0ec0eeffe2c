import { describe, expect, it } from 'vitest';
import { compositeRule, gradedPanels, QuadratureInputError } from '../../../src-core/numerics/quadrature/index';
import type { Rule1D } from '../../../src-core/numerics/quadrature/index';

const integrate = (rule: Rule1D, f: (x: number) => number): number => {
  let s = 0;
  for (let i = 0; i < rule.nodes.length; i++) s += rule.weights[i] * f(rule.nodes[i]);
  return s;
};

describe('compositeRule', () => {
  it('integrates a kink at a breakpoint exactly: ∫_0^1 |x − 0.3| dx = 0.29', () => {
    const rule = compositeRule([0, 0.3, 1], 2);
    expect(integrate(rule, (x) => Math.abs(x - 0.3))).toBeCloseTo(0.29, 15);
  });

  it('is exact for degree 2n − 1 on each panel and has ascending nodes, weights summing to the length', () => {
    const rule = compositeRule([-1, -0.2, 0.5, 2], [3, 4, 5]);
    expect(rule.nodes.length).toBe(12);
    for (let i = 1; i < rule.nodes.length; i++) expect(rule.nodes[i]).toBeGreaterThan(rule.nodes[i - 1]);
    expect(integrate(rule, () => 1)).toBeCloseTo(3, 14);
    // ∫_{-1}^{2} x^5 dx = (64 − 1)/6
    expect(integrate(rule, (x) => x ** 5)).toBeCloseTo(63 / 6, 13);
  });

  it('rejects bad partitions and counts', () => {
    expect(() => compositeRule([0], 3)).toThrow(QuadratureInputError);
    expect(() => compositeRule([0, 1, 1], 3)).toThrow(/increase strictly/);
    expect(() => compositeRule([0, 1], [2, 3])).toThrow(/point counts/);
    expect(() => compositeRule([0, 1], 0)).toThrow(/pointsPerPanel/);
    expect(() => compositeRule([0, Number.NaN], 2)).toThrow(/not finite/);
  });
});

describe('gradedPanels', () => {
  it('grades geometrically toward a: a, a + σ^L h, …, a + σ h, b', () => {
    const t = gradedPanels(2, 4, { towardA: true, towardB: false, ratio: 0.5, levels: 3 });
    expect(t).toEqual([2, 2.25, 2.5, 3, 4]);
  });

  it('grades toward b as the mirror image, and toward both ends from the midpoint', () => {
    const right = gradedPanels(0, 1, { towardA: false, towardB: true, ratio: 0.5, levels: 2 });
    expect(right).toEqual([0, 0.5, 0.75, 1]);
    const both = gradedPanels(0, 1, { towardA: true, towardB: true, ratio: 0.5, levels: 1 });
    expect(both).toEqual([0, 0.25, 0.5, 0.75, 1]);
    expect(gradedPanels(0, 1, { towardA: false, towardB: false })).toEqual([0, 1]);
  });

  it('uses ratio 0.15 by default and stays strictly increasing even for many levels', () => {
    const t = gradedPanels(0, 1, { towardA: true, towardB: false, levels: 400 });
    expect(t[t.length - 2]).toBeCloseTo(0.15, 15);
    for (let i = 1; i < t.length; i++) expect(t[i]).toBeGreaterThan(t[i - 1]);
  });

  it('integrates x^(−1/2) on [0, 1] to 2 within 1e-12 with 30 levels and 20 points per panel', () => {
    const breaks = gradedPanels(0, 1, { towardA: true, towardB: false, levels: 30 });
    const rule = compositeRule(breaks, 20);
    expect(Math.abs(integrate(rule, (x) => 1 / Math.sqrt(x)) - 2)).toBeLessThan(1e-12);
    // while the same number of points on a uniform mesh is far off
    const uniform = compositeRule(
      Array.from({ length: breaks.length }, (_, i) => i / (breaks.length - 1)),
      20,
    );
    expect(Math.abs(integrate(uniform, (x) => 1 / Math.sqrt(x)) - 2)).toBeGreaterThan(1e-4);
  });

  it('hp variant: point counts growing away from the singularity reach 1e-12 with fewer points', () => {
    const breaks = gradedPanels(0, 1, { towardA: true, towardB: false, levels: 30 });
    const counts = breaks.slice(1).map((_, k) => Math.min(20, 4 + k));
    const rule = compositeRule(breaks, counts);
    expect(rule.nodes.length).toBeLessThan(20 * counts.length * 0.8);
    expect(Math.abs(integrate(rule, (x) => 1 / Math.sqrt(x)) - 2)).toBeLessThan(1e-12);
  });

  it('integrates log(1 − x) on [0, 1] to −1 within 1e-10 when graded toward b', () => {
    const rule = compositeRule(gradedPanels(0, 1, { towardA: false, towardB: true, levels: 14 }), 16);
    expect(Math.abs(integrate(rule, (x) => Math.log1p(-x)) + 1)).toBeLessThan(1e-10);
  });

  it('drops levels finer than the floating-point grid at a non-zero end, so no node rounds onto it', () => {
    const breaks = gradedPanels(0, 1, { towardA: false, towardB: true, levels: 40 });
    expect(1 - breaks[breaks.length - 2]).toBeGreaterThanOrEqual(1024 * Number.EPSILON);
    const rule = compositeRule(breaks, 20);
    for (const x of rule.nodes) expect(x).toBeLessThan(1);
    // toward 0, by contrast, all 40 levels are kept
    expect(gradedPanels(0, 1, { towardA: true, towardB: false, levels: 40 }).length).toBe(42);
  });

  it('rejects bad ratio, levels and intervals', () => {
    expect(() => gradedPanels(0, 1, { towardA: true, towardB: false, ratio: 1 })).toThrow(/ratio/);
    expect(() => gradedPanels(0, 1, { towardA: true, towardB: false, levels: -1 })).toThrow(/levels/);
    expect(() => gradedPanels(1, 0, { towardA: true, towardB: false })).toThrow(QuadratureInputError);
  });
});
