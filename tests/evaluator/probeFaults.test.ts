/**
 * probeFaults finds the places where a kernel breaks down on [a, b]² and explains each with the faulty node.
 * Expected locations are facts of the formulas: log|t − s| is −∞ exactly on the diagonal; sqrt(t − 0.5) is not
 * real for t < 0.5; max(i·t, s) is undefined wherever i·t is not real.
 */
// Citations of books and papers in this file (authors, years, sections) are given from memory.
import { describe, expect, it } from 'vitest';
import { compileKernel, probeFaults, type KernelFault } from '../../src-core/semantics/evaluator';
import { probePoints } from '../../src-core/semantics/evaluator/probeFaults';
import { irFromText, sliceOf } from './irBuilder';

function probe(formula: string, a: number, b: number, n?: number, max?: number) {
  const { fn, text } = irFromText(formula);
  const faults = probeFaults(fn, compileKernel(fn), a, b, n, max);
  const on = (f: KernelFault) => sliceOf(text, f.fault.range);
  return { faults, on };
}

describe('probePoints', () => {
  it('holds the ends, the midpoint and n Chebyshev–Gauss points, sorted, inside [a, b]', () => {
    const p = probePoints(-1, 3, 8);
    expect(p.length).toBe(11);
    expect([p[0], p[p.length - 1]]).toEqual([-1, 3]);
    expect(Array.from(p)).toContain(1);
    for (let k = 1; k < p.length; k++) expect(p[k]).toBeGreaterThan(p[k - 1]);
    // cos((2k−1)π/16) mapped to [−1, 3]: the largest interior point is 1 + 2·cos(π/16).
    expect(p[p.length - 2]).toBeCloseTo(1 + 2 * Math.cos(Math.PI / 16), 14);
  });
});

describe('probeFaults', () => {
  it('log(abs(t - s)) on [0, 1]: −∞ on every diagonal point and nowhere else', () => {
    const points = probePoints(0, 1, 32);
    const { faults, on } = probe('log(abs(t - s))', 0, 1);
    expect(faults.length).toBe(points.length);
    for (const f of faults) {
      expect(f.t).toBe(f.s);
      expect(f.fault.kind).toBe('non-finite');
      expect(f.fault.fn).toBe('log');
      expect(f.fault.valueRe).toBe(-Infinity);
      expect(on(f)).toBe('log(abs(t - s))');
    }
  });

  it('sqrt(t - 0.5) on [0, 1]: real-domain faults exactly where t < 0.5, first at the corner (0, 0)', () => {
    const { faults, on } = probe('sqrt(t - 0.5)', 0, 1, 32, 1000);
    const below = probePoints(0, 1, 32).filter((x) => x < 0.5).length;
    expect(faults.length).toBe(below * probePoints(0, 1, 32).length);
    for (const f of faults) {
      expect(f.t).toBeLessThan(0.5);
      expect(f.fault.kind).toBe('real-domain');
      expect(on(f)).toBe('sqrt(t - 0.5)');
      expect(f.fault.argRe).toBeCloseTo(f.t - 0.5, 15);
    }
    expect([faults[0].t, faults[0].s]).toEqual([0, 0]);
  });

  it('at most `max` faults, ordered by kind, and one fault line does not hide another', () => {
    const { faults, on } = probe('sqrt(t - 0.5) + log(abs(t - s))', 0, 1, 16, 6);
    expect(faults.length).toBe(6);
    const kinds = faults.map((f) => f.fault.kind);
    expect(kinds.indexOf('non-finite')).toBeGreaterThan(kinds.lastIndexOf('real-domain'));
    expect(new Set(faults.map(on))).toEqual(new Set(['sqrt(t - 0.5)', 'log(abs(t - s))']));
    const diagonal = faults.filter((f) => f.fault.kind === 'non-finite');
    for (const f of diagonal) expect([f.t, f.s, f.t >= 0.5]).toEqual([f.s, f.t, true]);
  });

  it('max(i * t, s) on [0, 1]: complex-where-real wherever t ≠ 0', () => {
    const { faults, on } = probe('max(i * t, s)', 0, 1, 8, 1000);
    const m = probePoints(0, 1, 8).length;
    expect(faults.length).toBe((m - 1) * m);
    for (const f of faults) {
      expect(f.t).toBeGreaterThan(0);
      expect(f.fault.kind).toBe('complex-where-real');
      expect([f.fault.argRe, f.fault.argIm]).toEqual([0, f.t]);
      expect(on(f)).toBe('max(i * t, s)');
    }
  });

  it('a smooth kernel has no faults', () => {
    expect(probe('exp(-(t - s) ^ 2 / 0.1)', -1, 1).faults).toEqual([]);
  });

  it('a degenerate interval [a, a] probes the single point', () => {
    const { faults } = probe('1 / (t - s)', 2, 2);
    expect(faults.map((f) => [f.t, f.s])).toEqual([[2, 2]]);
  });
});
