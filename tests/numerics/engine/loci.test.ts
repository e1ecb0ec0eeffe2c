/**
 * Where a kernel is not smooth, read from its expression: comparisons of a piecewise-affine side with a constant
 * give straight lines (|t − s| < r jumps on t − s = ±r), so the engine can put panel breaks and cuts on them and
 * keep exponential convergence (a kernel with a jump on a line it does not know converges only algebraically).
 */
import { describe, expect, it } from 'vitest';
import { parse, bindFile } from '@kernwright/core';
import { findLoci } from '../../../src-core/numerics/engine/loci';
import { obliqueTracePoints } from '../../../src-core/numerics/engine/mesh';
import { analyseKernel } from './helpers';

function lociOf(expr: string, domain: [number, number] = [0, 10]) {
  const k = bindFile(parse(`domain [${domain[0]}, ${domain[1]}]\nconst r = 3\nkernel k(t, s) = ${expr}`)).kernels[0];
  const found = findLoci(k.ir!, domain);
  return {
    lines: found.loci.filter((l) => l.kind === 'jump').map((l) => [l.line.ct, l.line.cs, l.line.c0]).sort((x, y) => x[2] - y[2]),
    unknown: found.unknown.length,
  };
}

describe('level sets of comparisons', () => {
  it.each([
    ['abs(t - s) < r ? 1 : 0', [[1, -1, -3], [1, -1, 3]]],
    ['abs(t - s) / 2 <= 1.5 ? 1 : 0', [[1, -1, -3], [1, -1, 3]]],
    ['(t - s)^2 < 9 ? 1 : 0', [[1, -1, -3], [1, -1, 3]]],
    ['3 > abs(s - t) ? 1 : 0', [[1, -1, -3], [1, -1, 3]]],
    ['abs(t - s - 2) + 1 < 4 ? 1 : 0', [[1, -1, -5], [1, -1, 1]]],
    ['-abs(t - 5) > -2 ? 1 : 0', [[1, 0, -7], [1, 0, -3]]],
    ['abs(t - s) < -1 ? 1 : 0', []],
  ] as const)('%s jumps on the expected lines', (expr, expected) => {
    const { lines, unknown } = lociOf(expr);
    expect(unknown).toBe(0);
    expect(lines.length).toBe(expected.length);
    lines.forEach((l, i) => l.forEach((c, j) => expect(c).toBeCloseTo(expected[i][j], 12)));
  });

  it('leaves level sets it cannot place to the numerical search', () => {
    expect(lociOf('sin(t - s) < 0.5 ? 1 : 0').unknown).toBe(1);
    expect(lociOf('t * s < 4 ? 1 : 0').unknown).toBe(1);
  });

  it('makes a box kernel converge: |t − s| < 0.3 on [0, 1] reaches 1e-10 (with the lines unknown, h-refinement alone converged only algebraically)', () => {
    const k = analyseKernel('domain [0, 1]\nkernel box(t, s) = abs(t - s) < 0.3 ? 1 : 0', { timeBudgetMs: 5000 });
    const worst = Math.max(...k.spectrum!.eigenvalues.map((e) => e.error));
    expect(worst / k.spectrum!.norm!.value).toBeLessThan(1e-10);
  });

  it('does not take the kink of abs inside a comparison it resolved for a kink of K', () => {
    const k = bindFile(parse('domain [0, 10]\nkernel k(t, s) = abs(t - s) < 3 ? 1 : 0')).kernels[0];
    expect(findLoci(k.ir!, [0, 10]).loci.map((l) => l.kind)).toEqual(['jump', 'jump']);
  });
});

describe('breakpoints behind oblique loci', () => {
  it('follow a jump on t − s = 3 across [0, 10] for three generations: 3, 7, then 6, 4, then 9, 1', () => {
    const pts = obliqueTracePoints({ ct: 1, cs: -1, c0: -3 }, 0, 10, 3).sort((x, y) => x - y);
    expect(pts).toEqual([1, 3, 4, 6, 7, 9]);
  });

  it('follow a kink for one generation only, and stop at the edge of the square', () => {
    expect(obliqueTracePoints({ ct: 1, cs: -1, c0: -3 }, 0, 10, 1).sort((x, y) => x - y)).toEqual([3, 4, 6, 7]);
    expect(obliqueTracePoints({ ct: 1, cs: -1, c0: -6 }, 0, 10, 3).sort((x, y) => x - y)).toEqual([4, 6]);
  });
});
