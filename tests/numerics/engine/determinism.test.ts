/**
 * The engine's budget is counted in work, not time: the same kernel must get the same levels and the same figures
 * whether its evaluation is fast or slowed down (as on a busy CI machine), down to the last bit.
 */
import { describe, expect, it } from 'vitest';
import { parse, bindFile, defaultAnalysisOptions } from '@kernwright/core';
import { compileKernel, type CompiledKernel } from '../../../src-core/semantics/evaluator';
import { runSpectralEngine } from '../../../src-core/numerics/engine/spectralEngine';

/** The same kernel, but every batch of evaluations also waits `ms` milliseconds. */
function slowed(k: CompiledKernel, ms: number): CompiledKernel {
  const wait = () => { const until = performance.now() + ms; while (performance.now() < until) { /* busy */ } };
  return {
    ...k,
    evaluateColumns: (c, re, im) => { wait(); k.evaluateColumns(c, re, im); },
    evaluateGrid: (t, s, re, im) => { wait(); k.evaluateGrid(t, s, re, im); },
  };
}

describe('work-counted budget', () => {
  // A kernel that does not reach the target within a small budget, so the budget decides where the ladder stops.
  // (exp(3i·t·s) on [0, 3] stops at N = 48 with 10 ms of work and reaches the target at N = 72 with 30.)
  const source = 'domain [0, 3]\nkernel k(t, s) = exp(i * 3 * t * s)';
  const k = bindFile(parse(source)).kernels[0];
  const options = { ...defaultAnalysisOptions, timeBudgetMs: 10 };

  it('gives bit-identical figures when evaluation is slowed down (2 ms per batch: more than the whole budget)', () => {
    const compiled = compileKernel(k.ir!);
    const fast = runSpectralEngine('k', k.ir!, [0, 3], options, undefined, compiled);
    const slow = runSpectralEngine('k', k.ir!, [0, 3], options, undefined, slowed(compiled, 2));
    expect(fast.spectrum).not.toBeNull();
    expect(fast.reached).toBeGreaterThan(fast.target); // the budget, not the target, stopped the ladder
    expect(slow.spectrum!.method).toBe(fast.spectrum!.method);
    expect(slow.spectrum!.eigenvalues).toEqual(fast.spectrum!.eigenvalues);
    expect(slow.spectrum!.norm).toEqual(fast.spectrum!.norm);
    expect(slow.reached).toBe(fast.reached);
  });

  it('buys more levels with a larger budget', () => {
    const small = runSpectralEngine('k', k.ir!, [0, 3], options);
    const large = runSpectralEngine('k', k.ir!, [0, 3], { ...options, timeBudgetMs: 1000 });
    expect(small.reached).toBeGreaterThan(small.target);
    expect(large.finest!.matrix.n).toBeGreaterThan(small.finest!.matrix.n);
    expect(large.reached).toBeLessThan(small.reached);
  });
});
