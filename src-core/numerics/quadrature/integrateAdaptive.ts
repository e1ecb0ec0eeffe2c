/**
 * Globally adaptive integration of a real or complex function on [a, b] with an error estimate.
 *
 * Method: QUADPACK's QAG strategy with the 15-point Gauss–Kronrod rule (R. Piessens, E. de Doncker-Kapenga,
 * C. W. Überhuber, D. K. Kahaner, QUADPACK, Springer, 1983, routine QAG with key 1 / QK15): start from the panels
 * given by the breakpoints, then repeatedly bisect the panel with the largest error estimate until the summed
 * estimate meets max(absTol, relTol·|I|). No extrapolation is done; integrable endpoint singularities such as x^(−1/2)
 * are handled by repeated bisection, which the Kronrod estimate follows honestly (pessimistically).
 *
 * Non-convergence is data, not an exception: the result says why it stopped (evaluation budget, a panel too
 * small to bisect in floating point, or a non-finite integrand value) and still carries the best value and its
 * error estimate. The array form lets compiled evaluators fill many values per call.
 */
import { throwIfCancelled, type CancellationToken } from '../../util/cancellation';
import { KRONROD15_POINTS, kronrod15Abscissae, kronrod15Estimate } from './gaussKronrod15';
import { PanelHeap, type Panel } from './panelHeap';
import { QuadratureInputError, type ComplexNumber } from './types';

/** A pointwise integrand returning a real number or a complex value. */
export type ScalarIntegrand = (x: number) => number | ComplexNumber;

/**
 * An array integrand: fills outRe[i] + i·outIm[i] = f(xs[i]) for every i. outIm is zeroed before each call, so a
 * real integrand may leave it untouched.
 */
export type ArrayIntegrand = (xs: Float64Array, outRe: Float64Array, outIm: Float64Array) => void;

export interface AdaptiveOptions {
  /** Interior points where f is known to be non-smooth (kinks, jumps, singularities); any order. */
  readonly breakpoints?: readonly number[];
  /** Absolute tolerance on the total error estimate; default 1e-12. */
  readonly absTol?: number;
  /** Relative tolerance (to |I|) on the total error estimate; default 1e-10. */
  readonly relTol?: number;
  /** Budget of integrand evaluations; default 200 000. */
  readonly maxEvaluations?: number;
  /** Checked between bisections; a cancelled token throws CancelledError. */
  readonly token?: CancellationToken;
}

export type AdaptiveStatus = 'converged' | 'maxEvaluations' | 'roundoffLimit' | 'nonFiniteValue';

export interface AdaptiveResult {
  readonly value: ComplexNumber;
  /** Estimated absolute error of value (sum of the panel estimates). */
  readonly error: number;
  readonly evaluations: number;
  readonly converged: boolean;
  readonly status: AdaptiveStatus;
  /** Number of panels in the final partition. */
  readonly panels: number;
  /** The first abscissa where the integrand was NaN or infinite (status 'nonFiniteValue'). */
  readonly nonFiniteAt?: number;
}

export const DEFAULT_ABS_TOL = 1e-12;
export const DEFAULT_REL_TOL = 1e-10;
export const DEFAULT_MAX_EVALUATIONS = 200_000;

/** ∫_a^b f(x) dx for a pointwise integrand (real or complex). */
export function integrateAdaptive(
  f: ScalarIntegrand,
  a: number,
  b: number,
  options: AdaptiveOptions = {},
): AdaptiveResult {
  const fill: ArrayIntegrand = (xs, outRe, outIm) => {
    for (let i = 0; i < xs.length; i++) {
      const v = f(xs[i]);
      if (typeof v === 'number') {
        outRe[i] = v;
      } else {
        outRe[i] = v.re;
        outIm[i] = v.im;
      }
    }
  };
  return integrateAdaptiveArray(fill, a, b, options);
}

/** ∫_a^b f(x) dx for an integrand that fills arrays of values (15 or 30 points per call, more at the start). */
export function integrateAdaptiveArray(
  f: ArrayIntegrand,
  a: number,
  b: number,
  options: AdaptiveOptions = {},
): AdaptiveResult {
  const absTol = options.absTol ?? DEFAULT_ABS_TOL;
  const relTol = options.relTol ?? DEFAULT_REL_TOL;
  const maxEvaluations = options.maxEvaluations ?? DEFAULT_MAX_EVALUATIONS;
  if (!Number.isFinite(a) || !Number.isFinite(b)) {
    throw new QuadratureInputError(`integrateAdaptive: interval ends must be finite, got [${a}, ${b}]`);
  }
  if (!(absTol >= 0) || !(relTol >= 0) || (absTol === 0 && relTol === 0)) {
    throw new QuadratureInputError(
      `integrateAdaptive: need absTol ≥ 0 and relTol ≥ 0, not both zero; got absTol = ${absTol}, relTol = ${relTol}`,
    );
  }
  if (!Number.isInteger(maxEvaluations) || maxEvaluations < KRONROD15_POINTS) {
    throw new QuadratureInputError(
      `integrateAdaptive: maxEvaluations must be an integer ≥ ${KRONROD15_POINTS}, got ${maxEvaluations}`,
    );
  }
  if (a === b) {
    return { value: { re: 0, im: 0 }, error: 0, evaluations: 0, converged: true, status: 'converged', panels: 0 };
  }
  const sign = a < b ? 1 : -1;
  const lo = Math.min(a, b);
  const hi = Math.max(a, b);
  const cuts = interiorBreakpoints(options.breakpoints ?? [], lo, hi);
  const ends = [lo, ...cuts, hi];
  const initialPanels = ends.length - 1;
  if (initialPanels * KRONROD15_POINTS > maxEvaluations) {
    throw new QuadratureInputError(
      `integrateAdaptive: ${initialPanels} initial panels need ${initialPanels * KRONROD15_POINTS} evaluations, ` +
        `more than maxEvaluations = ${maxEvaluations}`,
    );
  }

  const heap = new PanelHeap();
  let evaluations = 0;
  let nonFiniteAt: number | undefined;

  /** Evaluates the K15 rule on each [lefts[i], rights[i]] in one call of f and pushes the panels. */
  const evaluatePanels = (lefts: number[], rights: number[]): Panel[] => {
    const m = lefts.length * KRONROD15_POINTS;
    const xs = new Float64Array(m);
    const re = new Float64Array(m);
    const im = new Float64Array(m);
    for (let p = 0; p < lefts.length; p++) kronrod15Abscissae(lefts[p], rights[p], xs, p * KRONROD15_POINTS);
    f(xs, re, im);
    evaluations += m;
    for (let i = 0; i < m && nonFiniteAt === undefined; i++) {
      if (!Number.isFinite(re[i]) || !Number.isFinite(im[i])) nonFiniteAt = xs[i];
    }
    const made: Panel[] = [];
    for (let p = 0; p < lefts.length; p++) {
      const e = kronrod15Estimate(lefts[p], rights[p], re, im, p * KRONROD15_POINTS);
      const panel = { a: lefts[p], b: rights[p], re: e.re, im: e.im, error: e.error };
      heap.push(panel);
      made.push(panel);
    }
    return made;
  };

  evaluatePanels(ends.slice(0, -1), ends.slice(1));
  let status: AdaptiveStatus = 'converged';
  // Panels that cannot be bisected further in floating point are set aside; their errors still count.
  const finished: Panel[] = [];
  let finishedError = 0;
  let sums = totals(heap.all(), finished);
  let iterations = 0;
  for (;;) {
    if (nonFiniteAt !== undefined) {
      status = 'nonFiniteValue';
      break;
    }
    const tolerance = Math.max(absTol, relTol * Math.hypot(sums.re, sums.im));
    if (sums.error <= tolerance) {
      status = 'converged';
      break;
    }
    if (evaluations + 2 * KRONROD15_POINTS > maxEvaluations) {
      status = 'maxEvaluations';
      break;
    }
    throwIfCancelled(options.token);
    const worst = heap.pop();
    if (worst === undefined) {
      status = 'roundoffLimit';
      break;
    }
    const mid = (worst.a + worst.b) / 2;
    if (!(mid > worst.a && mid < worst.b) || worst.b - worst.a <= 8 * Number.EPSILON * Math.abs(mid)) {
      // Too small to bisect in floating point. If such panels alone exceed the tolerance, no amount of work
      // elsewhere can converge, so stop (QUADPACK's ier = 3, "bad integrand behaviour").
      finished.push(worst);
      finishedError += worst.error;
      if (finishedError > tolerance) {
        status = 'roundoffLimit';
        break;
      }
      continue;
    }
    const [left, right] = evaluatePanels([worst.a, mid], [mid, worst.b]);
    // Running totals, recomputed from scratch now and then so that they cannot drift.
    iterations++;
    sums =
      iterations % 64 === 0
        ? totals(heap.all(), finished)
        : {
            re: sums.re - worst.re + left.re + right.re,
            im: sums.im - worst.im + left.im + right.im,
            error: Math.max(0, sums.error - worst.error + left.error + right.error),
          };
  }
  sums = totals(heap.all(), finished);
  const converged = status === 'converged';
  return {
    value: { re: sign * sums.re, im: sign * sums.im },
    error: sums.error,
    evaluations,
    converged,
    status,
    panels: heap.size + finished.length,
    ...(nonFiniteAt !== undefined ? { nonFiniteAt } : {}),
  };
}

interface Totals {
  readonly re: number;
  readonly im: number;
  readonly error: number;
}

function totals(open: readonly Panel[], finished: readonly Panel[]): Totals {
  let re = 0;
  let im = 0;
  let error = 0;
  for (const list of [open, finished]) {
    for (const p of list) {
      re += p.re;
      im += p.im;
      error += p.error;
    }
  }
  return { re, im, error };
}

/** Sorted, de-duplicated breakpoints strictly inside (lo, hi); points outside [lo, hi] are an input error. */
function interiorBreakpoints(points: readonly number[], lo: number, hi: number): number[] {
  for (const t of points) {
    if (!Number.isFinite(t) || t < lo || t > hi) {
      throw new QuadratureInputError(`integrateAdaptive: breakpoint ${t} is not inside [${lo}, ${hi}]`);
    }
  }
  const sorted = points.filter((t) => t > lo && t < hi).sort((u, v) => u - v);
  return sorted.filter((t, i) => i === 0 || t > sorted[i - 1]);
}
