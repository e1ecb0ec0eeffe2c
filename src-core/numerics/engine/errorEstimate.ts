/**
 * A-posteriori error estimates from a sequence of approximations x_0, x_1, …, x_k of one quantity computed at
 * increasing resolution. With differences e_j = |x_j − x_{j−1}| and their ratio r = e_k / e_{k−1}, a geometrically
 * converging sequence has error(x_k) ≈ r·e_k / (1 − r) (the tail of a geometric series; the same argument as
 * Aitken's Δ² and Richardson extrapolation: G. Dahlquist & Å. Björck, Numerical Methods in Scientific Computing,
 * vol. 1, 2008, §3.4). A safety factor guards against pre-asymptotic luck; a sequence that stops converging gets
 * the larger recent difference; everything is floored at rounding level. In cautious mode, for sequences that
 * converge slower than geometrically, the estimate is never below the last difference.
 */

export interface SequenceEstimate {
  /** Estimated absolute error of the last value. */
  readonly error: number;
  /** Observed contraction ratio of the last two differences (NaN with fewer than three values). */
  readonly ratio: number;
  /** True when the differences shrink (ratio < 0.9) or sit at rounding level. */
  readonly converging: boolean;
}

export const safetyFactor = 4;

/**
 * @param values the approximations, coarse to fine (complex as [re, im] pairs or reals)
 * @param floor rounding-level error below which differences are noise
 * @param minRatio the contraction per level that the error cannot beat, when the kind of kernel fixes one (0: none).
 *   The observed ratio of two differences may be lucky; a singularity whose integrability margin is small makes
 *   the true ratio close to 1 while the differences look small (see spectralEngine.ts, levelContraction).
 */
export function estimateSequenceError(
  values: readonly (readonly [number, number])[],
  floor: number,
  cautious = false,
  minRatio = 0,
): SequenceEstimate {
  const k = values.length - 1;
  if (k < 1) return { error: Infinity, ratio: NaN, converging: false };
  const diff = (j: number) => Math.hypot(values[j][0] - values[j - 1][0], values[j][1] - values[j - 1][1]);
  const ek = diff(k);
  if (k < 2) {
    // Two values: the difference bounds the coarse error; for the fine one, take it whole (no rate known).
    return { error: Math.max(ek, floor), ratio: NaN, converging: ek <= floor };
  }
  const ek1 = diff(k - 1);
  if (ek <= floor && ek1 <= 4 * floor) return { error: floor, ratio: 0, converging: true };
  const ratio = ek1 > 0 ? ek / ek1 : ek > 0 ? Infinity : 0;
  if (minRatio > 0 && Math.max(ratio, minRatio) >= 0.9) {
    // A known slow rate (minRatio, see the parameter): the geometric tail at that rate, however close to 1 (and at
    // that rate when the last differences did not shrink: the levels are still before the asymptotic regime).
    const r = ratio < 1 ? Math.max(ratio, minRatio) : minRatio;
    return { error: Math.max((safetyFactor * r * ek) / (1 - r), 2 * Math.max(ek, ek1), floor), ratio, converging: false };
  }
  if (ratio < 0.9) {
    const r = Math.max(ratio, minRatio, 1e-3);
    // Cautious mode (sub-geometric convergence, as for hp-refinement of singular kernels, where the ratio of
    // successive differences keeps growing): never claim less than the last difference.
    const geometric = safetyFactor * (r * ek) / (1 - r);
    return { error: Math.max(cautious ? Math.max(geometric, ek) : geometric, floor, ek * 1e-3), ratio, converging: true };
  }
  return { error: Math.max(2 * Math.max(ek, ek1), floor), ratio, converging: false };
}

/** Rounding-level error of eigenvalues of an n×n matrix of 2-norm `scale` computed by a backward-stable solver. */
export function roundingFloor(scale: number, n: number): number {
  return 8 * Number.EPSILON * scale * Math.sqrt(Math.max(1, n));
}
