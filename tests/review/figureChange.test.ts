/** The change of one figure with its error (src-core/review/figureChange.ts) and the limits built on it. */
import { describe, expect, it } from 'vitest';
import { compareFigure, exceedsRelative, formatRelativeChange, type Figure } from '@kernwright/core';

const f = (re: number, error: number, im = 0): Figure => ({ re, im, error });

function check(oldF: Figure | null, newF: Figure | null, expected: { significant: boolean; relative?: number | null; relError?: number }): void {
  const c = compareFigure('norm', oldF, newF);
  expect(c.significant).toBe(expected.significant);
  if (expected.relative === null) expect(c.relative).toBeNull();
  else if (expected.relative !== undefined) expect(c.relative!.value).toBeCloseTo(expected.relative, 12);
  if (expected.relError !== undefined) expect(c.relative!.error).toBeCloseTo(expected.relError, 12);
}

describe('compareFigure', () => {
  it('calls a change within the combined error no change, and one beyond it a change', () => {
    check(f(1, 1e-3), f(1.0015, 1e-3), { significant: false });
    check(f(1, 1e-3), f(1.0025, 1e-3), { significant: true, relative: 0.0025 });
    check(f(1, 0), f(1, 0), { significant: false, relative: 0 });
  });
  it('gives the first-order error of the relative change', () => {
    // (e_old + e_new)/|old| + |Δ| e_old/|old|² = 0.03/2 + 1·0.01/4
    check(f(2, 0.01), f(3, 0.02), { significant: true, relative: 0.5, relError: 0.015 + 0.0025 });
  });
  it('keeps the sign for real figures and uses the modulus for complex ones', () => {
    check(f(2, 1e-9), f(1, 1e-9), { significant: true, relative: -0.5 });
    check(f(0, 1e-9, 2), f(0, 1e-9, -2), { significant: true, relative: 2 });
  });
  it('has no relative change for a figure that is zero within its error', () => {
    check(f(1e-12, 1e-10), f(0.5, 1e-10), { significant: true, relative: null });
  });
  it('counts a figure that appeared or vanished as a change, and one missing on both sides as none', () => {
    check(null, f(1, 0), { significant: true, relative: null });
    check(f(1, 0), null, { significant: true, relative: null });
    check(null, null, { significant: false, relative: null });
  });
  it('never calls a change with an unknown error significant', () => {
    check(f(1, NaN), f(2, 1e-9), { significant: false });
  });
});

describe('exceedsRelative', () => {
  it('needs the change to exceed the limit by more than its error', () => {
    expect(exceedsRelative(compareFigure('norm', f(1, 0.001), f(1.06, 0.001)), 0.05)).toBe(true);
    // 6 % ± 2 %: possibly below 5 %, so not certainly above the limit.
    expect(exceedsRelative(compareFigure('norm', f(1, 0.01), f(1.06, 0.01)), 0.05)).toBe(false);
    expect(exceedsRelative(compareFigure('norm', f(1, 1e-9), f(0.9, 1e-9)), 0.05)).toBe(true);
    expect(exceedsRelative(compareFigure('norm', f(1, 1e-9), f(0.99, 1e-9)), 0.05)).toBe(false);
  });
  it('fails every limit for a figure that vanished or moved away from zero', () => {
    expect(exceedsRelative(compareFigure('norm', f(1, 0), null), 10)).toBe(true);
    expect(exceedsRelative(compareFigure('norm', f(0, 1e-12), f(1, 1e-12)), 10)).toBe(true);
  });
  it('formats the relative change in percent with its error', () => {
    expect(formatRelativeChange(compareFigure('norm', f(2, 0.01), f(3, 0.02)))).toMatch(/^\+50 % ± 1\.[78] %$/);
    expect(formatRelativeChange(compareFigure('norm', f(4, 1e-9), f(3, 1e-9)))).toMatch(/^-25(\.0+)? % ± 5\.6e-8 %$/); // (2e-9/4 + 1·1e-9/16) · 100
    expect(formatRelativeChange(compareFigure('norm', f(1, 0), null))).toBe('vanished');
    expect(formatRelativeChange(compareFigure('norm', null, f(1, 0)))).toBe('appeared');
  });
});
