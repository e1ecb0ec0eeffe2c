/**
 * The discretisation behind a kernel's figures, as arrays a modeller can load elsewhere (see the README's command
 * reference for the list). Everything comes from the spectral engine's finest level, the one whose eigenvalues are
 * reported, so the exported matrix is the very matrix the figures were computed from.
 *
 * The Galerkin basis is L²-orthonormal and piecewise polynomial: on panel p = [x_p, x_{p+1}] of width h_p, basis
 * function number p·(d+1) + k (k = 0…d, d the degree) is √((2k+1)/h_p) · P_k((2x − x_p − x_{p+1}) / h_p), with P_k the
 * Legendre polynomial, and zero outside the panel. The Galerkin matrix is A[i, j] = ∫∫ φ_i(t) K(t, s) φ_j(s) ds dt.
 *
 * Pure: an analysis in, arrays out; the command line writes them as JSON, CSV or NPY files.
 */
import type { AnalysisOptions, FileAnalysis } from '../analysis/types';
import { defaultAnalysisOptions } from '../analysis/types';
import { analyzeKernelNumerics } from '../analysis/kernelAnalysis';
import { basisAtPoints, evaluateExpansion } from '../numerics/engine/eigenfunctions';
import type { LevelSolution } from '../numerics/engine/solveLevel';
import { gaussLegendre, mapRule } from '../numerics/quadrature';
import { compileKernel } from '../semantics/evaluator';
import type { KernelSymbol } from '../semantics/model';
import { LineIndex } from '../syntax/textRange';

export interface ExportArray {
  /** File-name-safe name, e.g. `galerkin_matrix`. */
  readonly name: string;
  /** What the array holds, in one or two sentences (written to the manifest). */
  readonly description: string;
  readonly shape: readonly number[];
  /** Row-major entries (real parts). */
  readonly re: Float64Array;
  /** Imaginary parts, or null for a real array. */
  readonly im: Float64Array | null;
}

export interface KernelExport {
  readonly kernel: string;
  readonly domain: readonly [number, number];
  readonly complex: boolean;
  readonly method: string;
  readonly converged: boolean;
  readonly discretisation: {
    readonly panels: number;
    readonly degree: number;
    readonly size: number;
    readonly nystromPointsPerPanel: number;
    readonly basis: string;
  };
  readonly notes: readonly string[];
  readonly arrays: readonly ExportArray[];
}

export type ExportResult = { readonly ok: true; readonly data: KernelExport } | { readonly ok: false; readonly message: string };

const basisText =
  'L²-orthonormal piecewise Legendre basis: on panel p = [x_p, x_{p+1}] (width h_p), function p·(degree+1) + k is ' +
  '√((2k+1)/h_p)·P_k((2x − x_p − x_{p+1})/h_p), k = 0…degree, and zero elsewhere';

function arrayOf(name: string, description: string, shape: number[], re: Float64Array, im: Float64Array | null): ExportArray {
  return { name, description, shape, re, im };
}

/** Multiplies coefficients and values by conj(phase) so that the value of largest modulus on the grid is real > 0. */
function fixPhase(coefRe: Float64Array, coefIm: Float64Array | null, valRe: Float64Array, valIm: Float64Array | null): void {
  let best = 0;
  let bestAbs = -1;
  for (let k = 0; k < valRe.length; k++) {
    const a = Math.hypot(valRe[k], valIm ? valIm[k] : 0);
    if (a > bestAbs) { bestAbs = a; best = k; }
  }
  if (!(bestAbs > 0)) return;
  const pr = valRe[best] / bestAbs;
  const pi = valIm ? valIm[best] / bestAbs : 0;
  const rotate = (re: Float64Array, im: Float64Array | null): void => {
    for (let k = 0; k < re.length; k++) {
      const xr = re[k];
      const xi = im ? im[k] : 0;
      re[k] = xr * pr + xi * pi;
      if (im) im[k] = xi * pr - xr * pi;
    }
  };
  rotate(coefRe, coefIm);
  rotate(valRe, valIm);
}

function eigenArrays(level: LevelSolution, count: number, a: number, b: number, gridPoints: number): ExportArray[] {
  const { n, discretisation: d } = level.matrix;
  const m = Math.max(2, gridPoints);
  const grid = new Float64Array(m);
  for (let k = 0; k < m; k++) grid[k] = k + 1 === m ? b : a + ((b - a) * k) / (m - 1);
  const basis = basisAtPoints(d.breakpoints, d.degree, grid);
  const pairs = level.pairs.slice(0, count);
  const complex = pairs.some((p) => p.vecIm !== null);
  const coefRe = new Float64Array(pairs.length * n);
  const coefIm = complex ? new Float64Array(pairs.length * n) : null;
  const funRe = new Float64Array(pairs.length * m);
  const funIm = complex ? new Float64Array(pairs.length * m) : null;
  pairs.forEach((p, k) => {
    const cr = Float64Array.from(p.vecRe);
    const ci = p.vecIm ? Float64Array.from(p.vecIm) : complex ? new Float64Array(n) : null;
    const v = evaluateExpansion(basis, d.degree, cr, ci);
    const vi = v.im ?? (complex ? new Float64Array(m) : null);
    fixPhase(cr, ci, v.re, vi);
    coefRe.set(cr, k * n);
    if (coefIm && ci) coefIm.set(ci, k * n);
    funRe.set(v.re, k * m);
    if (funIm && vi) funIm.set(vi, k * m);
  });
  return [
    arrayOf('eigenvector_coefficients', 'Row k: the coefficients of eigenfunction k in the Galerkin basis (an eigenvector of galerkin_matrix, unit length), phase chosen so that the function’s value of largest modulus on the grid is real and positive.', [pairs.length, n], coefRe, coefIm),
    arrayOf('eigenfunction_grid', 'Uniform grid of the domain, ends included, on which the eigenfunctions are sampled.', [m], grid, null),
    arrayOf('eigenfunctions', 'Row k: eigenfunction k (L²-normalised) at the points of eigenfunction_grid.', [pairs.length, m], funRe, funIm),
  ];
}

/** Gauss–Legendre nodes and weights per panel, and the kernel at every pair of nodes; null when K is not finite there. */
function nystromArrays(symbol: KernelSymbol, breakpoints: readonly number[], points: number): ExportArray[] | null {
  const rule = gaussLegendre(points);
  const nodes: number[] = [];
  const weights: number[] = [];
  for (let p = 0; p + 1 < breakpoints.length; p++) {
    const mapped = mapRule(rule, breakpoints[p], breakpoints[p + 1]);
    nodes.push(...mapped.nodes);
    weights.push(...mapped.weights);
  }
  const x = Float64Array.from(nodes);
  const kernel = compileKernel(symbol.ir!);
  const q = x.length;
  const re = new Float64Array(q * q);
  const im = kernel.complex ? new Float64Array(q * q) : null;
  kernel.evaluateGrid(x, x, re, im);
  for (let k = 0; k < q * q; k++) if (!Number.isFinite(re[k]) || (im && !Number.isFinite(im[k]))) return null;
  return [
    arrayOf('nystrom_nodes', `Gauss–Legendre nodes, ${points} per panel of breakpoints, ascending.`, [q], x, null),
    arrayOf('nystrom_weights', 'The Gauss–Legendre weights of nystrom_nodes: ∫ f ≈ Σ_j w_j f(x_j) over the domain.', [q], Float64Array.from(weights), null),
    arrayOf('nystrom_kernel', 'K(x_i, x_j) at the Nyström nodes; the Nyström matrix of the operator is nystrom_kernel · diag(nystrom_weights).', [q, q], re, im),
  ];
}

function kernelProblem(analysis: FileAnalysis, symbol: KernelSymbol): string {
  const index = new LineIndex(analysis.source.text);
  const d = analysis.diagnostics.find((x) => x.severity === 'error' && x.range.start >= symbol.decl.range.start && x.range.start <= symbol.decl.range.end)
    ?? analysis.diagnostics.find((x) => x.range.start >= symbol.decl.range.start && x.range.start <= symbol.decl.range.end && (x.severity === 'warning' || x.severity === 'error'));
  return d ? `line ${index.position(d.range.start).line + 1}: ${d.message}` : 'it could not be analysed numerically';
}

/**
 * The arrays of kernel `name` of an analysed file. `options` must be the options the file was analysed with, so
 * that the engine's cached result (the one behind the reported figures) is the one exported.
 */
export function exportKernelData(analysis: FileAnalysis, name: string, options: Partial<AnalysisOptions> = {}): ExportResult {
  const opts: AnalysisOptions = { ...defaultAnalysisOptions, ...options, numerics: true };
  const symbol = analysis.model.kernels.find((k) => k.name === name);
  const report = analysis.kernels.find((k) => k.name === name);
  if (!symbol || !report) {
    const names = analysis.kernels.map((k) => k.name);
    return { ok: false, message: `there is no kernel named '${name}'${names.length > 0 ? ` (kernels: ${names.join(', ')})` : ' (the file declares no kernel)'}` };
  }
  if (!symbol.ir || !symbol.domain) return { ok: false, message: `kernel '${name}' has errors: ${kernelProblem(analysis, symbol)}` };
  const spectrum = report.spectrum;
  if (!spectrum) return { ok: false, message: `kernel '${name}' has no discretisation to export: ${kernelProblem(analysis, symbol)}` };
  const numerics = analyzeKernelNumerics(symbol, opts);
  const finest = numerics?.result.finest;
  if (!finest) return { ok: false, message: `kernel '${name}' has no discretisation to export: ${numerics?.result.reason ?? 'no spectrum'}` };
  const { n, re, im, discretisation: d } = finest.matrix;
  const [a, b] = [symbol.domain.a, symbol.domain.b];
  const count = Math.min(spectrum.eigenvalues.length, finest.pairs.length);
  const eig = spectrum.eigenvalues.slice(0, count);
  const complexEig = eig.some((e) => e.im !== 0);
  const notes: string[] = [];
  const points = Math.max(d.order, d.degree + 1);
  const nystrom = nystromArrays(symbol, d.breakpoints, points);
  if (!nystrom) notes.push('No Nyström arrays: K is not finite at some pairs of nodes (a singular kernel), where a plain Nyström rule does not apply.');
  if (!spectrum.converged) notes.push('The spectral engine did not reach its accuracy target within the time budget; the eigenvalue errors say how accurate the figures are.');
  const arrays: ExportArray[] = [
    arrayOf('breakpoints', 'Panel ends x_0 < x_1 < … of the Galerkin discretisation.', [d.breakpoints.length], Float64Array.from(d.breakpoints), null),
    arrayOf('galerkin_matrix', 'A[i, j] = ∫∫ φ_i(t) K(t, s) φ_j(s) ds dt in the Galerkin basis (see basis); its eigenvalues approximate those of the operator.', [n, n], Float64Array.from(re), im ? Float64Array.from(im) : null),
    arrayOf('eigenvalues', 'The leading eigenvalues of the operator, by decreasing modulus, as reported by kernwright check.', [count], Float64Array.from(eig, (e) => e.re), complexEig ? Float64Array.from(eig, (e) => e.im) : null),
    arrayOf('eigenvalue_errors', 'The estimated absolute error of each eigenvalue.', [count], Float64Array.from(eig, (e) => e.error), null),
    ...eigenArrays(finest, count, a, b, opts.gridPoints),
    ...(nystrom ?? []),
  ];
  return {
    ok: true,
    data: {
      kernel: name,
      domain: [a, b],
      complex: report.complex,
      method: spectrum.method,
      converged: spectrum.converged,
      discretisation: { panels: d.breakpoints.length - 1, degree: d.degree, size: n, nystromPointsPerPanel: points, basis: basisText },
      notes,
      arrays,
    },
  };
}
