/**
 * The level-to-level error estimate with a known slow rate (errorEstimate.ts, minRatio). Sequences with a closed-form
 * limit (common practice: x_k = L − c·r^k converges geometrically to L with ratio r, and its error after x_k is
 * c·r^k): an estimate that only looks at the last differences can call a slow sequence converged; with the rate the
 * kind of kernel allows, the error covers the distance to the limit.
 */
import { describe, expect, it } from 'vitest';
import { estimateSequenceError } from '../../../src-core/numerics/engine/errorEstimate';

const sequence = (limit: number, c: number, r: number, ks: number[]) => ks.map((k) => [limit - c * r ** k, 0] as [number, number]);

describe('estimateSequenceError with a known contraction per level', () => {
  it('x_k = 100 − 80·0.98^k (three late levels): covers the distance to 100 with the rate 0.98', () => {
    const xs = sequence(100, 80, 0.98, [10, 11, 12]);
    const truth = 100 - xs[2][0];
    expect(estimateSequenceError(xs, 1e-12, true, 0.98).error).toBeGreaterThanOrEqual(truth);
  });

  it('levels whose last differences grew (pre-asymptotic): the rate still bounds the tail', () => {
    const xs: [number, number][] = [[70, 0], [71, 0], [73, 0]]; // differences 1 then 2; the limit 100 is 27 away
    expect(estimateSequenceError(xs, 1e-12, true, 0.98).error).toBeGreaterThanOrEqual(27);
    // Without a rate the estimate is the larger recent difference, twice: it does not cover the limit.
    expect(estimateSequenceError(xs, 1e-12, true).error).toBeLessThan(27);
  });

  it('a fast sequence keeps its fast estimate when the rate allowed is fast too', () => {
    const xs = sequence(1, 1, 0.1, [5, 6, 7]);
    const e = estimateSequenceError(xs, 1e-16, false, 0.1).error;
    expect(e).toBeGreaterThanOrEqual(1e-7);
    expect(e).toBeLessThan(1e-5);
  });
});
