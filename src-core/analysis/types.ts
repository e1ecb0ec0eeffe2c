/**
 * What an analysis of one kernel file returns: plain data that every front end (command line, language server,
 * reports) presents in its own way. Numbers always travel with their error estimates.
 */
import type { Diagnostic, Severity } from '../diagnostics/types';
import type { SourceFile } from '../syntax/ast';
import type { TextRange } from '../syntax/textRange';
import type { FileModel } from '../semantics/model';

/** A real figure and its estimated absolute error. */
export interface Estimate {
  readonly value: number;
  readonly error: number;
}

/** An eigenvalue (complex in general) and the estimated absolute error of it. */
export interface EigenEstimate {
  readonly re: number;
  readonly im: number;
  readonly error: number;
}

/** The operator norm with its error and a bracket [lower, upper] from independent arguments. */
export interface NormEstimate extends Estimate {
  readonly lower: number;
  readonly upper: number;
}

/** Leading eigenfunctions sampled on a grid of the domain (L²-normalised; orthonormal for Hermitian kernels). */
export interface Eigenfunctions {
  readonly grid: readonly number[];
  /** values[k][j] = Re φ_k(grid[j]). */
  readonly re: readonly (readonly number[])[];
  /** Imaginary parts, or null when all eigenfunctions are real. */
  readonly im: readonly (readonly number[])[] | null;
}

export interface SpectrumReport {
  /** By decreasing modulus. */
  readonly eigenvalues: readonly EigenEstimate[];
  readonly eigenfunctions: Eigenfunctions | null;
  readonly norm: NormEstimate | null;
  /** Hilbert–Schmidt norm (∫∫|K|²)^½, or null when infinite. */
  readonly hsNorm: Estimate | null;
  /** ∫ K(t, t) dt, or null when the diagonal is not integrable. */
  readonly trace: Estimate | null;
  /** Short description of the discretisation and its size. */
  readonly method: string;
  /** True when the target accuracy was reached within the time budget. */
  readonly converged: boolean;
  readonly elapsedMs: number;
  /**
   * Set when an argument shows σ(T) = {0} (a Volterra-type kernel: K = 0 on one side of the diagonal, square
   * integrable): `eigenvalues` is then empty, as T has no nonzero eigenvalue, and the spectral radius is 0.
   */
  readonly quasinilpotent?: QuasinilpotentReport;
}

/** Why the spectrum is {0}. */
export interface QuasinilpotentReport {
  /** 'lower': K(t, s) = 0 for s > t, so (Tf)(t) = ∫_a^t K(t, s) f(s) ds; 'upper': K(t, s) = 0 for s < t. */
  readonly side: 'lower' | 'upper';
  /** The argument in one sentence, for messages. */
  readonly reason: string;
}

export interface KernelReport {
  readonly name: string;
  readonly nameRange: TextRange;
  /** The whole declaration. */
  readonly range: TextRange;
  /** [a, b], or null when the domain is missing or invalid. */
  readonly domain: readonly [number, number] | null;
  /** True when the kernel may take complex values. */
  readonly complex: boolean;
  /** Hash of the resolved definition (domain, body with constants and helpers substituted). */
  readonly hash: string | null;
  /** Null when the kernel was not analysed numerically (errors, unbounded, numerics switched off). */
  readonly spectrum: SpectrumReport | null;
  /** The property checks (src-core/checks/); null (or empty) when the kernel was not analysed numerically. */
  readonly hermitian: HermitianReport | null;
  readonly boundedness: BoundednessReport | null;
  readonly continuity: ContinuityReport | null;
  readonly positive: PositivityReport | null;
  /** How many modes carry 90 %, 99 % and 99.9 % of the trace; null unless the kernel is continuous and positive. */
  readonly effectiveRank: EffectiveRankReport | null;
  /** One entry per declared `resolvent μ`, in the order written. */
  readonly resolvent: readonly ResolventReport[];
}

/** A point (t, s) of the square. */
export interface PointTS {
  readonly t: number;
  readonly s: number;
}

/** A complex number as plain data. */
export interface ComplexFigure {
  readonly re: number;
  readonly im: number;
}

export interface HermitianReport {
  /** K(t, s) = conj K(s, t) to within the tolerance (or exactly, by construction). */
  readonly holds: boolean;
  /** Relative defect ‖K − K*‖_HS / ‖K‖_HS (0 when Hermitian by construction). */
  readonly defect: number;
  /** Estimated absolute error of `defect` (0 when Hermitian by construction). */
  readonly defectError: number;
  /** 'symbolic' when the expression is Hermitian by construction, else 'numeric'. */
  readonly method: 'symbolic' | 'numeric';
  /** Where |K(t, s) − conj K(s, t)| is largest on the sample grid (null when Hermitian by construction). */
  readonly worst: (PointTS & { readonly value: ComplexFigure; readonly mirrored: ComplexFigure }) | null;
}

export type BoundednessClass = 'hilbert-schmidt' | 'bounded' | 'unbounded';

export interface BoundednessReport {
  readonly class: BoundednessClass;
  /** The growth exponent α of |K| ~ d^(−α) at the worst singularity (0 for a logarithm); null when there is none. */
  readonly exponent: number | null;
  /** Where the worst singularity lies (“the diagonal t = s”, “the corner (0, 0)”), or null. */
  readonly where: string | null;
  /**
   * Set when the class is not settled: which property is open (`bounded`, or only `hilbert-schmidt` while the
   * operator is bounded) and why (an exponent whose error interval contains the threshold). The class then says
   * what is known: 'bounded' with `undecided.property` 'bounded' means boundedness itself is open.
   */
  readonly undecided?: { readonly property: 'bounded' | 'hilbert-schmidt'; readonly reason: string };
}

export type ContinuityClass = 'continuous' | 'jump' | 'singular';

export interface ContinuityReport {
  readonly class: ContinuityClass;
  /** The curve across which K jumps or where it is singular, or null. */
  readonly where: string | null;
  /** The largest jump measured across that curve, with its error; null unless class is 'jump'. */
  readonly jump: Estimate | null;
  /** Every curve across which K jumps, largest jump first (empty unless class is 'jump'). */
  readonly jumps: readonly string[];
  /** Curves along which the first derivative jumps (information: they slow plain quadrature). */
  readonly kinks: readonly string[];
}

export interface PositivityReport {
  /** Positive semidefinite; null when it cannot be decided (no spectrum). Non-Hermitian kernels are not. */
  readonly holds: boolean | null;
  /** The most negative (smallest) eigenvalue with its error; null when not Hermitian or no spectrum. */
  readonly minEigenvalue: Estimate | null;
  /** A point proof of indefiniteness for a continuous kernel: K(t, t) < 0, or |K(t, s)|² > K(t, t) K(s, s). */
  readonly certificate: (PointTS & { readonly kind: 'diagonal' | 'minor'; readonly margin: number }) | null;
  /** Mercer's trace identity for a continuous positive kernel: ∫K(t, t) dt against the sum of all eigenvalues. */
  readonly mercer: { readonly trace: Estimate; readonly sum: Estimate; readonly holds: boolean } | null;
}

export interface EffectiveRankReport {
  /** Modes needed for 90 %, 99 %, 99.9 % of the trace; null when more than the resolved modes would be needed. */
  readonly p90: number | null;
  readonly p99: number | null;
  readonly p999: number | null;
  /** How many eigenvalues were resolved (agree between two discretisations). */
  readonly resolvedModes: number;
}

export interface ResolventReport {
  readonly mu: ComplexFigure;
  /** True or false when decided; null when μ lies within the error of an eigenvalue (or no spectrum). */
  readonly inResolventSet: boolean | null;
  /** dist(μ, σ(T)) over the computed eigenvalues and 0, with its error; null without a spectrum. */
  readonly distance: Estimate | null;
  /** ‖(μ − T)⁻¹‖ = 1 / dist(μ, σ(T)) for Hermitian T in the resolvent set, else null. */
  readonly resolventNorm: Estimate | null;
  /** True when |μ| exceeds the spectral radius, so that the Neumann series of (μ − T)⁻¹ converges. */
  readonly neumannConverges: boolean | null;
}

export interface FileAnalysis {
  readonly source: SourceFile;
  readonly model: FileModel;
  /** Syntax, name, evaluation, numerical and check diagnostics, sorted by position. */
  readonly diagnostics: readonly Diagnostic[];
  readonly kernels: readonly KernelReport[];
}

export interface AnalysisOptions {
  /** Run the numerical analysis (spectra, checks); false gives syntax and name diagnostics only. */
  readonly numerics: boolean;
  /** How many leading eigenvalues to report. */
  readonly eigenCount: number;
  /** Time budget per kernel, in milliseconds. */
  readonly timeBudgetMs: number;
  /** Largest discretisation size (number of basis functions). */
  readonly maxResolution: number;
  /** Relative accuracy target (of each eigenvalue, relative to the operator norm). */
  readonly targetAccuracy: number;
  /** Points per axis for the eigenfunction grids. */
  readonly gridPoints: number;
  /**
   * Severity of each property-check finding, by its catalogue name (e.g. `not-hermitian`, `kink`); 'off' silences
   * it. Unlisted findings keep their catalogue severity. Failed declared claims are always errors.
   */
  readonly severities: Readonly<Partial<Record<string, Severity | 'off'>>>;
  /** Largest relative defect ‖K − K*‖_HS / ‖K‖_HS still taken for Hermitian (raised to the engine's accuracy). */
  readonly hermitianTolerance: number;
  /**
   * Eigenvalues above −(error + positivityTolerance · ‖T‖) count as non-negative (1e-8 by default: kernels with a
   * removable singularity such as sin(t − s)/(t − s) lose digits near the diagonal, where t − s cancels).
   */
  readonly positivityTolerance: number;
}

export const defaultAnalysisOptions: AnalysisOptions = {
  numerics: true,
  eigenCount: 8,
  timeBudgetMs: 250,
  maxResolution: 384,
  targetAccuracy: 1e-12,
  gridPoints: 101,
  severities: {},
  hermitianTolerance: 1e-9,
  positivityTolerance: 1e-8,
};
