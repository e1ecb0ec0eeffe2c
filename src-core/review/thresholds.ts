/**
 * Whether a comparison passes the limits a reviewer set: any property flip (when asked), a relative change of the
 * norm, of any leading eigenvalue or of the trace above its limit, or a new version that has errors.
 *
 * A change counts against a limit only when it exceeds the limit by more than its own error estimate, so noise in
 * the last digits never fails a review; a figure that appeared, vanished or moved away from zero exceeds every limit.
 */
import { formatEstimate, formatNumber } from '../report/text';
import { eigenvalueIndex, exceedsRelative, type FigureChange } from './figureChange';
import type { Comparison, CompareThresholds, CompareVerdict, KernelComparison, PropertyName } from './types';

/** `−16.8 % ± 0.0012 %`, or `appeared` / `vanished` / `from zero` for figures without a relative change. */
export function formatRelativeChange(change: FigureChange): string {
  if (!change.old) return 'appeared';
  if (!change.new) return 'vanished';
  if (!change.relative) return 'from zero';
  const { value, error } = change.relative;
  const text = formatEstimate(100 * value, 100 * error).replace(' ± ', ' % ± ');
  return `${value > 0 && change.old.im === 0 && change.new.im === 0 ? '+' : ''}${text} %`;
}

/** `5 %` for 0.05. */
export function formatLimit(fraction: number): string {
  return `${formatNumber(100 * fraction, 6)} %`;
}

/** The figure's name in prose: `norm`, `trace`, `λ₃`. */
export function figureName(figure: string): string {
  const k = eigenvalueIndex(figure);
  if (k !== null) return `λ${String(k).replace(/\d/g, (d) => '₀₁₂₃₄₅₆₇₈₉'[Number(d)])}`;
  return figure === 'hsNorm' ? 'Hilbert–Schmidt norm' : figure;
}

function limitFor(figure: string, t: CompareThresholds): number | null {
  if (figure === 'norm') return t.maxNormChange;
  if (figure === 'trace') return t.maxTraceChange;
  if (eigenvalueIndex(figure) !== null) return t.maxEigenvalueChange;
  return null;
}

/** How a property is named in prose. */
export const propertyWords: Readonly<Record<PropertyName, string>> = {
  hermitian: 'Hermitian',
  positive: 'positive',
  boundedness: 'boundedness',
  continuity: 'continuity',
};

function kernelLabel(k: KernelComparison): string {
  return k.oldName ? `“${k.oldName}” → “${k.name}”` : `“${k.name}”`;
}

function kernelReasons(path: string, k: KernelComparison, t: CompareThresholds): string[] {
  const reasons: string[] = [];
  const who = `${path}: ${kernelLabel(k)}`;
  if (t.failOnFlip) {
    for (const f of k.flips) reasons.push(`${who}: ${propertyWords[f.property]} flipped from ${f.old} to ${f.new}`);
  }
  for (const c of k.figures) {
    const limit = limitFor(c.figure, t);
    if (limit === null || !exceedsRelative(c, limit)) continue;
    const how = !c.old || !c.new ? formatRelativeChange(c) : !c.relative ? 'changed from zero' : `changed by ${formatRelativeChange(c)}`;
    reasons.push(`${who}: ${figureName(c.figure)} ${how} (limit ${formatLimit(limit)})`);
  }
  return reasons;
}

export function compareVerdict(c: Comparison, t: CompareThresholds): CompareVerdict {
  const reasons: string[] = [];
  for (const f of c.files) {
    if (f.newErrors) reasons.push(`${f.path}: the new version has errors (${f.newErrors})`);
    for (const k of f.kernels) reasons.push(...kernelReasons(f.path, k, t));
  }
  return { failed: reasons.length > 0, reasons };
}
