/**
 * Warming the analysis worker while the user is idle. Every numerical path (Hermitian and general solvers, cut
 * and singular quadrature, the checks) runs two to three times slower for its first few dozen calls, until the
 * JavaScript engine has compiled it; without this, the first edits after opening a file pay for that. So, whenever
 * the worker has had no job for a while, it analyses one small kernel from the set below (one kernel per step, a
 * tight budget, at most a few tens of milliseconds each) and forgets the results, until every kernel has been
 * analysed a few times. A job that arrives meanwhile waits at most for the step in progress.
 *
 * The kernels are invented for this purpose, one per path through the engine.
 */
import { analyzeText, forgetChecks, forgetSpectra } from '@kernwright/core';

const kernels: readonly string[] = [
  'exp(-(t - s)^2 / 0.5)',
  'exp(-abs(t - s))',
  'exp(-abs(t - s - 0.7)) / 2',
  'exp(i * 3 * (t - s)) * exp(-abs(t - s) / 0.8)',
  'log(abs(t - s))',
  'min(t, s) - t * s / 4',
  's < t ? exp(s - t) : 0',
  '1 / (1 + (t - s)^2)',
];

/** Rounds over the whole set: enough calls for the hot functions to be optimised. */
const rounds = 6;

export const warmUpSteps = kernels.length * rounds;

/** The text analysed at step k (a different factor each round, so that no cached result short-cuts it). */
export function warmUpText(step: number): string {
  const factor = 1 + (Math.floor(step / kernels.length) + 1) / 1000;
  return `domain [0, 4]\nkernel warm(t, s) = ${factor} * ${kernels[step % kernels.length]}\n  expect hermitian, positive\n`;
}

/** Runs warm-up step k and drops what it put in the caches. */
export function runWarmUpStep(step: number): void {
  const result = analyzeText(warmUpText(step), { numerics: true, timeBudgetMs: 40, maxResolution: 192 });
  const hashes = new Set<string>();
  for (const k of result.kernels) if (k.hash) hashes.add(k.hash);
  forgetSpectra(hashes);
  forgetChecks(hashes);
}
