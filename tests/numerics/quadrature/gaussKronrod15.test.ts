// Citations of books and papers in this file (authors, years, sections) are given from memory.
import { describe, expect, it } from 'vitest';
import {
  GAUSS7_WEIGHTS,
  gaussLegendre,
  KRONROD15_NODES,
  KRONROD15_WEIGHTS,
  kronrod15Abscissae,
  kronrod15Estimate,
} from '../../../src-core/numerics/quadrature/index';

/** ∫_{-1}^{1} x^k dx. */
const monomialIntegral = (k: number): number => (k % 2 === 0 ? 2 / (k + 1) : 0);

/** The full symmetric 15-point Kronrod rule on [-1, 1] from the tabulated half. */
function kronrodRule(): { x: number[]; w: number[] } {
  const x: number[] = [];
  const w: number[] = [];
  for (let j = 0; j < 7; j++) {
    x.push(-KRONROD15_NODES[j], KRONROD15_NODES[j]);
    w.push(KRONROD15_WEIGHTS[j], KRONROD15_WEIGHTS[j]);
  }
  x.push(0);
  w.push(KRONROD15_WEIGHTS[7]);
  return { x, w };
}

describe('Gauss–Kronrod 7–15 constants (QUADPACK QK15)', () => {
  it('K15 integrates every monomial of degree ≤ 22 exactly (catches any transcription slip)', () => {
    const { x, w } = kronrodRule();
    for (let k = 0; k <= 22; k++) {
      const s = x.reduce((acc, xi, i) => acc + w[i] * xi ** k, 0);
      expect(Math.abs(s - monomialIntegral(k)), `x^${k}`).toBeLessThan(4e-16);
    }
  });

  it('K15 is not exact for x^24 (degree 3·7 + 1 = 22 is the Kronrod bound)', () => {
    const { x, w } = kronrodRule();
    const s = x.reduce((acc, xi, i) => acc + w[i] * xi ** 24, 0);
    expect(Math.abs(s - monomialIntegral(24))).toBeGreaterThan(1e-10);
  });

  it('the embedded G7 rule is exact for degree ≤ 13 and equals gaussLegendre(7)', () => {
    const gx = [KRONROD15_NODES[1], KRONROD15_NODES[3], KRONROD15_NODES[5], 0];
    for (let k = 0; k <= 13; k++) {
      let s = GAUSS7_WEIGHTS[3] * (k === 0 ? 1 : 0);
      for (let j = 0; j < 3; j++) s += GAUSS7_WEIGHTS[j] * (gx[j] ** k + (-gx[j]) ** k);
      expect(Math.abs(s - monomialIntegral(k)), `x^${k}`).toBeLessThan(4e-16);
    }
    const g7 = gaussLegendre(7);
    for (let j = 0; j < 4; j++) {
      expect(Math.abs(g7.nodes[6 - j] - gx[j])).toBeLessThan(2e-16);
      expect(Math.abs(g7.weights[6 - j] - GAUSS7_WEIGHTS[j])).toBeLessThan(3e-16);
    }
  });

  it('the Kronrod nodes interlace the Gauss nodes (Kronrod 1965 property)', () => {
    for (let j = 0; j + 1 < KRONROD15_NODES.length; j++) expect(KRONROD15_NODES[j]).toBeGreaterThan(KRONROD15_NODES[j + 1]);
    for (const w of KRONROD15_WEIGHTS) expect(w).toBeGreaterThan(0);
  });
});

describe('kronrod15Estimate', () => {
  const panel = (f: (x: number) => number, a: number, b: number) => {
    const xs = new Float64Array(15);
    kronrod15Abscissae(a, b, xs, 0);
    const re = xs.map(f);
    return kronrod15Estimate(a, b, re, new Float64Array(15), 0);
  };

  it('a polynomial of degree 13 has an error estimate at rounding level', () => {
    const e = panel((x) => x ** 13 - 2 * x ** 4, 0, 2);
    // ∫_0^2 x^13 − 2x^4 dx = 2^14/14 − 2·2^5/5
    expect(e.re).toBeCloseTo(2 ** 14 / 14 - 64 / 5, 10);
    expect(e.error).toBeLessThan(1e-10);
  });

  it('the estimate bounds the true error for a function G7 cannot resolve', () => {
    const e = panel((x) => Math.cos(30 * x), 0, 1);
    const exact = Math.sin(30) / 30;
    expect(Math.abs(e.re - exact)).toBeLessThanOrEqual(e.error);
    expect(e.error).toBeGreaterThan(1e-6);
  });

  it('returns the absolute integral and reverses sign with the orientation', () => {
    const forward = panel((x) => x - 0.5, 0, 1);
    const backward = panel((x) => x - 0.5, 1, 0);
    expect(forward.absIntegral).toBeCloseTo(0.25, 2);
    expect(backward.re).toBeCloseTo(-forward.re, 15);
  });
});
