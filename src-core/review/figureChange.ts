/**
 * The change of one figure between two versions of a kernel, with its error.
 *
 * Each version's figure comes from the numerics with its own absolute error estimate e_old and e_new. The difference
 * Δ = new − old is known to within e_old + e_new, so a change with |Δ| ≤ e_old + e_new is not a measurable change:
 * it is reported as unchanged, never as a small number that is really noise.
 *
 * The relative change is Δ / |old| (signed for real figures, the modulus |Δ| / |old| for complex ones). To first
 * order its error is (e_old + e_new) / |old| + |Δ| e_old / |old|²; it is null when |old| does not exceed its own error
 * (a relative change of a figure that may be zero means nothing).
 */
import type { EigenEstimate, Estimate } from '../analysis/types';

/** A figure of one version: real figures have im = 0. */
export interface Figure {
  readonly re: number;
  readonly im: number;
  readonly error: number;
}

export interface FigureChange {
  /** Stable key: `norm`, `hsNorm`, `trace`, `eigenvalue1`, `eigenvalue2`, … */
  readonly figure: string;
  readonly old: Figure | null;
  readonly new: Figure | null;
  /** new − old with the combined error e_old + e_new; null when one side has no such figure. */
  readonly difference: Figure | null;
  /** Relative change with its error; null when it means nothing (see the header). */
  readonly relative: Estimate | null;
  /** True when the change exceeds the combined error, or the figure appeared or vanished. */
  readonly significant: boolean;
}

export function realFigure(e: Estimate | null | undefined): Figure | null {
  return e ? { re: e.value, im: 0, error: e.error } : null;
}

export function eigenFigure(e: EigenEstimate | null | undefined): Figure | null {
  return e ? { re: e.re, im: e.im, error: e.error } : null;
}

function modulus(f: Figure): number {
  return Math.hypot(f.re, f.im);
}

/** The size of an error; an unknown (NaN) error counts as infinite. */
function errorOf(f: Figure): number {
  return Number.isFinite(f.error) ? Math.abs(f.error) : Infinity;
}

/** Compares one figure; `figure` is its key. */
export function compareFigure(figure: string, oldF: Figure | null, newF: Figure | null): FigureChange {
  if (!oldF || !newF) {
    return { figure, old: oldF, new: newF, difference: null, relative: null, significant: oldF !== newF };
  }
  const dRe = newF.re - oldF.re;
  const dIm = newF.im - oldF.im;
  const combined = errorOf(oldF) + errorOf(newF);
  const size = Math.hypot(dRe, dIm);
  const significant = Number.isFinite(combined) ? size > combined : false;
  const difference: Figure = { re: dRe, im: dIm, error: combined };
  const base = modulus(oldF);
  let relative: Estimate | null = null;
  if (base > errorOf(oldF) && base > 0) {
    const real = oldF.im === 0 && newF.im === 0;
    const value = real ? dRe / base : size / base;
    const error = combined / base + (size * errorOf(oldF)) / (base * base);
    relative = { value, error };
  }
  return { figure, old: oldF, new: newF, difference, relative, significant };
}

/**
 * True when the relative change certainly exceeds `limit` (a fraction, 0.05 for 5 %): a significant change whose
 * relative size, less its error, is above the limit. A change of a figure that was zero within its error, or that
 * appeared or vanished, exceeds every limit.
 */
export function exceedsRelative(change: FigureChange, limit: number): boolean {
  if (!change.significant) return false;
  if (!change.relative) return true;
  return Math.abs(change.relative.value) - change.relative.error > limit;
}

/** `eigenvalue3` → 3; other keys → null. */
export function eigenvalueIndex(figure: string): number | null {
  const m = /^eigenvalue(\d+)$/.exec(figure);
  return m ? Number(m[1]) : null;
}
