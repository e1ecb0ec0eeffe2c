/**
 * Geometric meshes for endpoint singularities (the h-part of hp-refinement).
 *
 * Method: the geometric mesh with grading factor σ and L levels toward a singular end a,
 *   a, a + σ^L h, a + σ^{L−1} h, …, a + σ h, a + h,
 * on which piecewise polynomials of (linearly increasing) degree approximate functions like |x − a|^γ or log|x − a|
 * at an exponential rate in the number of unknowns. σ ≈ 0.15 is close to the optimum (√2 − 1)² ≈ 0.17 found for
 * x^γ-type singularities. W. Gui and I. Babuška, "The h, p and h-p versions of the finite element method in 1
 * dimension", Numer. Math. 49 (1986), Parts I–III; C. Schwab, p- and hp-Finite Element Methods, Oxford, 1998
 * (geometric meshes in one dimension). When both ends are singular the interval is halved and each half is
 * graded toward its own end.
 *
 * Floating point: a singular end at 0 can be graded to any depth; near an end a ≠ 0 the grid spacing ε|a| limits
 * the useful depth, and integrands should then be written in the distance to the end where possible.
 */
import { QuadratureInputError, requireInteger } from './types';

export interface GradedPanelsOptions {
  /** Grade toward the left end a. */
  readonly towardA: boolean;
  /** Grade toward the right end b. */
  readonly towardB: boolean;
  /** Ratio σ ∈ (0, 1) between consecutive panel sizes near the graded end; default 0.15. */
  readonly ratio?: number;
  /** Number of geometric levels L (the smallest panel has size σ^L times the graded length); default 12. */
  readonly levels?: number;
}

export const DEFAULT_GRADING_RATIO = 0.15;
export const DEFAULT_GRADING_LEVELS = 12;

/** Breakpoints of [a, b] (ascending, a first, b last) refined geometrically toward the chosen end(s). */
export function gradedPanels(a: number, b: number, options: GradedPanelsOptions): number[] {
  if (!Number.isFinite(a) || !Number.isFinite(b) || !(b > a)) {
    throw new QuadratureInputError(`gradedPanels: need a finite interval with a < b, got [${a}, ${b}]`);
  }
  const ratio = options.ratio ?? DEFAULT_GRADING_RATIO;
  const levels = options.levels ?? DEFAULT_GRADING_LEVELS;
  if (!(ratio > 0 && ratio < 1)) {
    throw new QuadratureInputError(`gradedPanels: ratio must lie in (0, 1), got ${ratio}`);
  }
  requireInteger(levels, 'gradedPanels: levels', 0, 1000);
  const { towardA, towardB } = options;
  if (!towardA && !towardB) return [a, b];
  if (towardA && !towardB) return gradeLeft(a, b, ratio, levels);
  if (!towardA && towardB) return gradeLeft(-b, -a, ratio, levels).map((t) => -t).reverse();
  const mid = (a + b) / 2;
  const left = gradeLeft(a, mid, ratio, levels);
  const right = gradeLeft(-b, -mid, ratio, levels).map((t) => -t).reverse();
  return dedupe([...left, ...right.slice(1)]);
}

/**
 * a, a + σ^L h, …, a + σ h, b with h = b − a. Levels finer than the floating-point grid near a can resolve
 * (panels shorter than 1024 ε |a|, whose Gauss nodes would round onto a) are dropped.
 */
function gradeLeft(a: number, b: number, ratio: number, levels: number): number[] {
  const h = b - a;
  const finest = 1024 * Number.EPSILON * Math.abs(a);
  const out = [a];
  for (let k = levels; k >= 1; k--) {
    const size = h * ratio ** k;
    const t = a + size;
    if (size >= finest && t > out[out.length - 1] && t < b) out.push(t);
  }
  out.push(b);
  return out;
}

function dedupe(points: number[]): number[] {
  const out = [points[0]];
  for (let i = 1; i < points.length; i++) if (points[i] > out[out.length - 1]) out.push(points[i]);
  return out;
}
