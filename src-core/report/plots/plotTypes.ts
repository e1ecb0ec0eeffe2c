/**
 * The data of a kernel's pictures: what is sampled from the kernel (a grid of values, the non-smooth lines), what
 * the axes are called, and the figures themselves as plain Vega-Lite specifications with a caption and a table of
 * the numbers they show (each with its error estimate). Everything here is JSON: it can cross a process boundary
 * (language server → editor) unchanged; a number that is not finite travels as null.
 */
import type { KernelReport } from '../../analysis/types';
import type { LocusKind } from '../../numerics/engine/loci';

/** A Vega-Lite specification as plain JSON (no functions, no URLs: every data set is inline). */
export type VegaLiteSpec = { readonly [key: string]: unknown };

/** A line of the square along which K is not smooth, clipped to the square. */
export interface LocusSegment {
  readonly kind: LocusKind;
  /** How the engine names it, e.g. “the diagonal t = s”. */
  readonly label: string;
  /** End points (t, s); equal when the line only touches a corner. */
  readonly from: readonly [number, number];
  readonly to: readonly [number, number];
}

/**
 * K sampled at the centres of an n × n grid of cells covering the square [a, b]² (centres never fall on the edges,
 * where many kernels are singular): re[i·n + j] = Re K(grid[i], grid[j]), i indexing t and j indexing s. A value that
 * is not finite (on a singular line) is null.
 */
export interface KernelSamples {
  readonly domain: readonly [number, number];
  readonly points: number;
  readonly grid: readonly number[];
  readonly re: readonly (number | null)[];
  /** Imaginary parts; null for a real kernel. */
  readonly im: readonly (number | null)[] | null;
  /** Straight lines where K (or a derivative) is not smooth, read from the expression. */
  readonly loci: readonly LocusSegment[];
}

/** Axis titles: `t (mm)` and `s (mm)` when the domain's unit is known, else plain `t` and `s`. */
export interface AxisNames {
  readonly t: string;
  readonly s: string;
  readonly unit: string | null;
}

/** Everything the pictures of one kernel are drawn from (the reply of the editor's kernel-data request). */
export interface KernelPictureData {
  readonly report: KernelReport;
  /** Null when the kernel's definition has errors or no domain. */
  readonly samples: KernelSamples | null;
  readonly axes: AxisNames;
}

/** A small table printed under a figure; every number in it is already formatted with its error. */
export interface FigureTable {
  /** What the table lists, in a few words (shown when a long table is folded away). */
  readonly caption: string;
  readonly columns: readonly string[];
  readonly rows: readonly (readonly string[])[];
}

export type FigureKind = 'kernel' | 'kernel-re' | 'kernel-im' | 'defect' | 'eigenvalues' | 'trace-share' | 'eigenfunctions';

/** One picture: its Vega-Lite specification, a title, a caption saying what the marks mean, and its numbers. */
export interface PlotFigure {
  readonly kind: FigureKind;
  readonly title: string;
  readonly caption: string;
  readonly spec: VegaLiteSpec;
  /** The numbers behind the picture, each with its error; may be empty. */
  readonly tables: readonly FigureTable[];
}

/** A figure with its specification rendered to an SVG document (by a renderer outside the core). */
export interface RenderedFigure {
  readonly kind: FigureKind;
  readonly title: string;
  readonly caption: string;
  readonly svg: string;
  readonly tables: readonly FigureTable[];
}

/** The mark names the figures give their data marks (the SVG groups carry the class `<name>_marks`). */
export const markNames = {
  kernelCells: 'kernel_cells',
  loci: 'loci_lines',
  lociPoints: 'loci_points',
  defectCells: 'defect_cells',
  worstPoint: 'worst_point',
  eigenvalues: 'eigenvalue_points',
  normBound: 'norm_bound',
  shares: 'share_points',
  eigenfunctions: 'eigenfunction_lines',
} as const;
