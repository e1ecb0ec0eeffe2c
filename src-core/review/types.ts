/**
 * What a comparison of two versions of kernel files finds: plain data for the text, markdown and JSON reports and
 * for the exit code. Every figure travels with its error; a change within the combined errors is no change.
 */
import type { FigureChange } from './figureChange';
import type { PointwiseChange } from './pointwise';

/**
 * - added / removed: the kernel exists in one version only;
 * - renamed: the same resolved definition under another name;
 * - changed: the definition differs and something measurable changed (a property, a figure, K itself, the domain);
 * - unchanged: same definition, or a different definition whose every figure agrees within the error estimates;
 * - not-comparable: one version has errors in the definition (or could not be analysed), so there is nothing to
 *   compare it with.
 */
export type KernelStatus = 'added' | 'removed' | 'renamed' | 'changed' | 'unchanged' | 'not-comparable';

export type PropertyName = 'hermitian' | 'positive' | 'boundedness' | 'continuity';

/** A property that differs between the versions; values are words (`yes`, `no`, `bounded`, `jump`, …). */
export interface PropertyFlip {
  readonly property: PropertyName;
  readonly old: string;
  readonly new: string;
}

/** How many modes carry 90 %, 99 % and 99.9 % of the trace, when that changed. */
export interface RankChange {
  readonly level: 'p90' | 'p99' | 'p999';
  readonly old: number | null;
  readonly new: number | null;
}

export interface KernelComparison {
  /** The new name (the old one for a removed kernel). */
  readonly name: string;
  /** The old name when it differs (renamed kernels). */
  readonly oldName: string | null;
  readonly status: KernelStatus;
  /** True when the definition differs (hash changed) although no change was measurable. */
  readonly rewritten: boolean;
  /** 1-based lines of the declarations, for pointers into the files. */
  readonly oldLine: number | null;
  readonly newLine: number | null;
  readonly oldDomain: readonly [number, number] | null;
  readonly newDomain: readonly [number, number] | null;
  readonly domainChanged: boolean;
  readonly flips: readonly PropertyFlip[];
  /** Every figure compared (norm, hsNorm, trace, eigenvalue1…); `significant` marks the measurable changes. */
  readonly figures: readonly FigureChange[];
  readonly rank: readonly RankChange[];
  readonly pointwise: PointwiseChange | null;
  /** Plain sentences: why something could not be compared, a spectrum that appeared or vanished, … */
  readonly notes: readonly string[];
}

/**
 * - modified: both versions exist; added / removed: one version only;
 * - unchanged: both versions exist and every kernel is unchanged (or renamed).
 */
export type FileStatus = 'added' | 'removed' | 'modified' | 'unchanged';

export interface FileComparison {
  /** The path shown (the new path, or the old one for a removed file). */
  readonly path: string;
  readonly oldPath: string | null;
  readonly newPath: string | null;
  readonly status: FileStatus;
  readonly kernels: readonly KernelComparison[];
  /** The first error of each version that has errors (`line 3: …`), else null. */
  readonly oldErrors: string | null;
  readonly newErrors: string | null;
}

export interface ComparisonSummary {
  readonly files: number;
  readonly kernels: Readonly<Record<KernelStatus, number>>;
  readonly flips: number;
}

export interface Comparison {
  readonly files: readonly FileComparison[];
  readonly summary: ComparisonSummary;
}

/** Limits that decide the exit code of a comparison. Fractions: 0.05 is 5 %. */
export interface CompareThresholds {
  /** Fail when any property flipped. */
  readonly failOnFlip: boolean;
  readonly maxNormChange: number | null;
  readonly maxEigenvalueChange: number | null;
  readonly maxTraceChange: number | null;
}

export const noThresholds: CompareThresholds = { failOnFlip: false, maxNormChange: null, maxEigenvalueChange: null, maxTraceChange: null };

export interface CompareVerdict {
  readonly failed: boolean;
  /** One sentence per reason, e.g. `examples/a.kw: cov: norm changed by −16.8 % ± 1e-12 % (limit 5 %)`. */
  readonly reasons: readonly string[];
}
