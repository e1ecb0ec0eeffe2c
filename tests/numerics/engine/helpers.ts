/** Shared helpers for spectral-engine tests: analyse one kernel line, find roots, compare with tolerance. */
import { analyzeText, type KernelReport, type AnalysisOptions } from '@kernwright/core';

export function analyseKernel(source: string, options: Partial<AnalysisOptions> = {}): KernelReport {
  const result = analyzeText(source, { timeBudgetMs: 5000, ...options });
  const errors = result.diagnostics.filter((d) => d.severity === 'error');
  if (errors.length > 0) throw new Error(`unexpected errors: ${errors.map((e) => `${e.code} ${e.message}`).join('; ')}`);
  const k = result.kernels[result.kernels.length - 1];
  if (!k?.spectrum) throw new Error(`no spectrum: ${result.diagnostics.map((d) => d.message).join('; ')}`);
  return k;
}

/** Bisection root of f on [lo, hi] (f changes sign), to full double accuracy. */
export function bisect(f: (x: number) => number, lo: number, hi: number): number {
  let flo = f(lo);
  for (let i = 0; i < 200; i++) {
    const mid = 0.5 * (lo + hi);
    const fm = f(mid);
    if (fm === 0 || hi - lo <= 4 * Number.EPSILON * Math.abs(mid)) return mid;
    if (Math.sign(fm) === Math.sign(flo)) { lo = mid; flo = fm; } else hi = mid;
  }
  return 0.5 * (lo + hi);
}

/**
 * Checks that an estimate is honest: the true error is below it, and it is at most `factor` times the true error
 * (or both are below `floor`, where the true error itself is rounding noise).
 */
export function honest(estimate: number, trueError: number, floor: number, factor = 100): boolean {
  if (trueError > estimate) return false;
  return estimate <= factor * Math.max(trueError, floor);
}
