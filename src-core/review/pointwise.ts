/**
 * The largest pointwise change of a kernel between two versions: both compiled kernels are evaluated on the same
 * uniform grid of the square (97 × 97 points by default, ends included) and the largest |K_new − K_old| is reported
 * with the point where it occurs and both values there.
 *
 * When the two versions have different domains the grid covers their intersection (and the caller says that the
 * domain changed); when the intersection is empty there is nothing to compare. Grid points where either version is
 * not finite (a singular diagonal, say) are skipped and counted.
 *
 * The figure is a maximum over the grid, not the supremum over the square. Its error is the rounding of the two
 * evaluations: 64 ε · max|K| over the grid (ε the machine epsilon), which also covers cancellation between terms no
 * larger than the kernel's largest value. A change below that is no change.
 */
import type { IrFunction } from '../semantics/ir';
import { compileKernel } from '../semantics/evaluator';
import type { ComplexFigure, Estimate, PointTS } from '../analysis/types';

export const defaultGridPoints = 97;

export interface PointwiseChange {
  /** The interval whose square was sampled. */
  readonly domain: readonly [number, number];
  /** Points per axis. */
  readonly gridPoints: number;
  /** max |K_new − K_old| over the grid, with its rounding error. */
  readonly max: Estimate;
  /** Where the maximum is, with both values there; null when no grid point could be compared. */
  readonly at: PointTS | null;
  readonly old: ComplexFigure | null;
  readonly new: ComplexFigure | null;
  /** max |K| over the grid, both versions (to put the change in proportion). */
  readonly scale: number;
  /** Grid points skipped because a version is not finite there. */
  readonly skipped: number;
  /** True when the change exceeds its error. */
  readonly significant: boolean;
}

/** The common part of two intervals, or null when they do not overlap in more than a point. */
export function intersectDomains(a: readonly [number, number], b: readonly [number, number]): [number, number] | null {
  const lo = Math.max(a[0], b[0]);
  const hi = Math.min(a[1], b[1]);
  return hi > lo ? [lo, hi] : null;
}

function uniformGrid(a: number, b: number, n: number): Float64Array {
  const g = new Float64Array(n);
  for (let k = 0; k < n; k++) g[k] = k + 1 === n ? b : a + ((b - a) * k) / (n - 1);
  return g;
}

/** K(grid[i], grid[j]) at index i·n + j; imaginary parts only for a complex kernel. */
function sample(ir: IrFunction, grid: Float64Array): { re: Float64Array; im: Float64Array | null } {
  const kernel = compileKernel(ir);
  const n = grid.length;
  const re = new Float64Array(n * n);
  const im = kernel.complex ? new Float64Array(n * n) : null;
  kernel.evaluateGrid(grid, grid, re, im);
  return { re, im };
}

/** The largest pointwise change of K between the two definitions on `domain`, sampled on a gridPoints² grid. */
export function pointwiseChange(
  oldIr: IrFunction,
  newIr: IrFunction,
  domain: readonly [number, number],
  gridPoints = defaultGridPoints,
): PointwiseChange {
  const n = Math.max(2, Math.floor(gridPoints));
  const grid = uniformGrid(domain[0], domain[1], n);
  const o = sample(oldIr, grid);
  const w = sample(newIr, grid);
  let best = -1;
  let bestAt = -1;
  let scale = 0;
  let skipped = 0;
  for (let k = 0; k < n * n; k++) {
    const or = o.re[k];
    const oi = o.im ? o.im[k] : 0;
    const nr = w.re[k];
    const ni = w.im ? w.im[k] : 0;
    if (!Number.isFinite(or) || !Number.isFinite(oi) || !Number.isFinite(nr) || !Number.isFinite(ni)) {
      skipped++;
      continue;
    }
    scale = Math.max(scale, Math.hypot(or, oi), Math.hypot(nr, ni));
    const d = Math.hypot(nr - or, ni - oi);
    if (d > best) {
      best = d;
      bestAt = k;
    }
  }
  const error = 64 * Number.EPSILON * scale;
  if (bestAt < 0) {
    return { domain: [domain[0], domain[1]], gridPoints: n, max: { value: NaN, error: NaN }, at: null, old: null, new: null, scale, skipped, significant: false };
  }
  const i = Math.floor(bestAt / n);
  const j = bestAt % n;
  return {
    domain: [domain[0], domain[1]],
    gridPoints: n,
    max: { value: best, error },
    at: { t: grid[i], s: grid[j] },
    old: { re: o.re[bestAt], im: o.im ? o.im[bestAt] : 0 },
    new: { re: w.re[bestAt], im: w.im ? w.im[bestAt] : 0 },
    scale,
    skipped,
    significant: best > error,
  };
}
