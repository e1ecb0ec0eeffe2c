/**
 * The comparison of one kernel's two versions: whether its definition changed (the hash of the resolved
 * definition), and if so which properties flipped, how its figures moved (each with its error) and how far K itself
 * moved on a grid. A kernel whose hash is unchanged is reported as unchanged without looking at any figure.
 */
import type { EffectiveRankReport, KernelReport } from '../analysis/types';
import type { IrFunction } from '../semantics/ir';
import { compareFigure, eigenFigure, realFigure, type FigureChange } from './figureChange';
import { defaultGridPoints, intersectDomains, pointwiseChange, type PointwiseChange } from './pointwise';
import type { KernelComparison, PropertyFlip, PropertyName, RankChange } from './types';

/** One version of a kernel as the comparison sees it. */
export interface KernelVersion {
  readonly report: KernelReport;
  /** The resolved definition; null when it has errors. */
  readonly ir: IrFunction | null;
  /** 1-based line of the declaration. */
  readonly line: number;
  /** The first error inside the declaration (`line 3: …`), or null. */
  readonly error: string | null;
}

export interface KernelDiffOptions {
  readonly gridPoints: number;
}

const defaults: KernelDiffOptions = { gridPoints: defaultGridPoints };

function base(name: string, oldV: KernelVersion | null, newV: KernelVersion | null): Omit<KernelComparison, 'status'> {
  const oldDomain = oldV?.report.domain ?? null;
  const newDomain = newV?.report.domain ?? null;
  return {
    name,
    oldName: oldV && newV && oldV.report.name !== newV.report.name ? oldV.report.name : null,
    rewritten: false,
    oldLine: oldV?.line ?? null,
    newLine: newV?.line ?? null,
    oldDomain,
    newDomain,
    domainChanged: !!oldDomain && !!newDomain && (oldDomain[0] !== newDomain[0] || oldDomain[1] !== newDomain[1]),
    flips: [],
    figures: [],
    rank: [],
    pointwise: null,
    notes: [],
  };
}

/** A kernel present in one version only. */
export function kernelOnlyIn(status: 'added' | 'removed', v: KernelVersion): KernelComparison {
  return { ...base(v.report.name, status === 'removed' ? v : null, status === 'added' ? v : null), status };
}

function yesNo(x: boolean | null | undefined): string | null {
  return x === true ? 'yes' : x === false ? 'no' : null;
}

/** Each property as a word for each version; a property unknown on either side cannot flip. */
function propertyFlips(o: KernelReport, n: KernelReport): PropertyFlip[] {
  const words: [PropertyName, string | null, string | null][] = [
    ['hermitian', yesNo(o.hermitian?.holds), yesNo(n.hermitian?.holds)],
    ['positive', yesNo(o.positive?.holds), yesNo(n.positive?.holds)],
    ['boundedness', o.boundedness?.class ?? null, n.boundedness?.class ?? null],
    ['continuity', o.continuity?.class ?? null, n.continuity?.class ?? null],
  ];
  return words
    .filter(([, a, b]) => a !== null && b !== null && a !== b)
    .map(([property, a, b]) => ({ property, old: a!, new: b! }));
}

function figureChanges(o: KernelReport, n: KernelReport): FigureChange[] {
  const so = o.spectrum;
  const sn = n.spectrum;
  if (!so && !sn) return [];
  // A spectrum that appeared or vanished is one change (the norm), not one per eigenvalue.
  if (!so || !sn) return [compareFigure('norm', realFigure(so?.norm), realFigure(sn?.norm))];
  const out: FigureChange[] = [
    compareFigure('norm', realFigure(so?.norm), realFigure(sn?.norm)),
    compareFigure('hsNorm', realFigure(so?.hsNorm), realFigure(sn?.hsNorm)),
    compareFigure('trace', realFigure(so?.trace), realFigure(sn?.trace)),
  ];
  const count = Math.max(so?.eigenvalues.length ?? 0, sn?.eigenvalues.length ?? 0);
  for (let k = 0; k < count; k++) {
    out.push(compareFigure(`eigenvalue${k + 1}`, eigenFigure(so?.eigenvalues[k]), eigenFigure(sn?.eigenvalues[k])));
  }
  // A figure that neither version has (an infinite Hilbert–Schmidt norm on both sides) is no change.
  return out.filter((c) => c.old !== null || c.new !== null);
}

function rankChanges(o: EffectiveRankReport | null | undefined, n: EffectiveRankReport | null | undefined): RankChange[] {
  if (!o || !n) return [];
  return (['p90', 'p99', 'p999'] as const).filter((l) => o[l] !== n[l]).map((level) => ({ level, old: o[level], new: n[level] }));
}

function spectrumNotes(o: KernelReport, n: KernelReport): string[] {
  if (o.spectrum && !n.spectrum) return [`the new version has no spectrum${n.boundedness?.class === 'unbounded' ? ' (the operator is not bounded)' : ''}`];
  if (!o.spectrum && n.spectrum) return [`the old version had no spectrum${o.boundedness?.class === 'unbounded' ? ' (the operator was not bounded)' : ''}`];
  return [];
}

/** Two versions of the same kernel (same name, or a rename found by the hash). */
export function diffKernel(
  oldV: KernelVersion,
  newV: KernelVersion,
  options: Partial<KernelDiffOptions> = {},
): KernelComparison {
  const opts = { ...defaults, ...options };
  const o = oldV.report;
  const n = newV.report;
  const head = base(n.name, oldV, newV);
  if (o.hash !== null && o.hash === n.hash) {
    return { ...head, status: o.name === n.name ? 'unchanged' : 'renamed' };
  }
  if (!oldV.ir || !newV.ir || !o.domain || !n.domain) {
    const notes: string[] = [];
    if (!oldV.ir || !o.domain) notes.push(`the old version cannot be analysed: ${oldV.error ?? 'its definition or domain has errors'}`);
    if (!newV.ir || !n.domain) notes.push(`the new version cannot be analysed: ${newV.error ?? 'its definition or domain has errors'}`);
    return { ...head, status: 'not-comparable', notes };
  }
  const flips = propertyFlips(o, n);
  const figures = figureChanges(o, n);
  const rank = rankChanges(o.effectiveRank, n.effectiveRank);
  const notes = spectrumNotes(o, n);
  const common = intersectDomains(o.domain, n.domain);
  let pointwise: PointwiseChange | null = null;
  if (common) pointwise = pointwiseChange(oldV.ir, newV.ir, common, opts.gridPoints);
  else notes.push('the two domains do not overlap, so K cannot be compared point by point');
  const changed =
    head.domainChanged ||
    flips.length > 0 ||
    rank.length > 0 ||
    notes.length > 0 ||
    figures.some((f) => f.significant) ||
    (pointwise?.significant ?? false);
  return { ...head, status: changed ? 'changed' : 'unchanged', rewritten: !changed, flips, figures, rank, pointwise, notes };
}
