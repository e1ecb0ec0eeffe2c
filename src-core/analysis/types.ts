/**
 * What an analysis of one kernel file returns: plain data that every front end (command line, language server,
 * reports) presents in its own way. Numbers always travel with their error estimates.
 */
import type { Diagnostic } from '../diagnostics/types';
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
}

export const defaultAnalysisOptions: AnalysisOptions = {
  numerics: true,
  eigenCount: 8,
  timeBudgetMs: 250,
  maxResolution: 384,
  targetAccuracy: 1e-12,
  gridPoints: 101,
};
