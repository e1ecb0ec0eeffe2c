/**
 * The spectral engine: climbs a ladder of Galerkin discretisations (see ladder.ts) until the leading eigenvalues
 * and the norm agree between levels to the target accuracy or the time budget is spent, and reports every figure
 * with an error estimate from the level-to-level differences (errorEstimate.ts).
 */
import type { IrFunction } from '../../semantics/ir';
import { compileKernel, type CompiledKernel } from '../../semantics/evaluator';
import type { CancellationToken } from '../../util/cancellation';
import { throwIfCancelled } from '../../util/cancellation';
import type { AnalysisOptions, EigenEstimate, Estimate, NormEstimate, SpectrumReport } from '../../analysis/types';
import { findLoci, type Locus, type LociCap, type LociResult } from './loci';
import { planMesh } from './mesh';
import { buildLadder, discretisationSize } from './ladder';
import { assembleGalerkin } from './assemble';
import { solveLevel, type LevelSolution } from './solveLevel';
import { estimateSequenceError, roundingFloor } from './errorEstimate';
import { entriesFinite } from '../linalg';
import { DEFAULT_GRADING_RATIO } from '../quadrature';
import { estimateSingularity, type SingularityEstimate } from './singularity';
import { schurBound, traceIntegral } from './bounds';
import { sampleEigenfunctions } from './eigenfunctions';
import { confirmUnknownLoci } from './confirmLoci';
import { tailRoundingFloor, withPowerTails } from './pairRule';
import { absoluteFloor, scaleKernel, scaleResultBack } from './kernelScale';

export interface SpectralResult {
  readonly spectrum: SpectrumReport | null;
  /** Why there is no spectrum (unbounded kernel, values not finite at quadrature points), else null. */
  readonly reason: string | null;
  readonly loci: LociResult;
  readonly singularities: readonly SingularityEstimate[];
  /** The finest level solved (for checks and exports), or null. */
  readonly finest: LevelSolution | null;
  readonly hermitian: boolean;
  /** Hermitian defect of the finest Galerkin matrix. */
  readonly defect: number;
  /** Reached relative accuracy (max eigenvalue error / norm) and the target it was held to. */
  readonly reached: number;
  readonly target: number;
  /**
   * Work units spent on the Galerkin levels (assembly plus dense solves, see workUnitsPerMs). A level is started
   * only when its predicted work fits the budget, except the first three; so `work` stays below the budget plus
   * the first three levels' work, and in practice within a small factor (about 1.5) of the budget.
   */
  readonly work: number;
  /** Caps on loci the analysis hit (each becomes a diagnostic: the figures converge more slowly, errors say how far). */
  readonly caps: readonly EngineCap[];
}

/**
 * A cap hit by the engine: too many jump lines of one floor (from the loci search), or more loci than panels the
 * resolution cap allows (`loci` found, `followed` of them kept as breakpoints, the others left to uniform refinement).
 */
export type EngineCap = LociCap | { readonly kind: 'mesh-loci'; readonly loci: number; readonly followed: number; readonly maxResolution: number };

const now = () => (typeof performance !== 'undefined' ? performance.now() : Date.now());

/**
 * The budget is counted in work, not wall-clock time, so that a kernel gets the same discretisations, figures and
 * diagnostics on every machine and under any load (a code review must not see figures move because CI was busy).
 * One unit is about a nanosecond on the 2-core machine the defaults were tuned on: a budget of 250 ms there buys
 * 250·10⁶ units. A level's work is its assembly (counted multiply-adds and evaluations) plus its dense solve,
 * c·N³ with c measured per solver. Only a machine many times slower than that (or heavily overloaded) meets the
 * wall-clock safety net of four times the budget plus a second, and then its result depends on the machine.
 */
export const workUnitsPerMs = 1e6;

export function safetyNetMs(budgetMs: number): number {
  return 4 * budgetMs + 1000;
}

export function levelWork(sol: LevelSolution): number {
  const m = sol.matrix;
  const complex = m.im !== null;
  const solve = sol.hermitian ? (complex ? 6 : 3) : (complex ? 20 : 4);
  return m.work + solve * m.n ** 3;
}

/** Target relative accuracy by kernel class: smooth and piecewise smooth kernels can do far better than singular ones. */
export function classTarget(options: AnalysisOptions, singular: readonly SingularityEstimate[]): number {
  if (singular.some((s) => s.type === 'power' && s.exponent >= 0.5)) return Math.max(options.targetAccuracy, 1e-6);
  if (singular.some((s) => s.type !== 'none')) return Math.max(options.targetAccuracy, 1e-8);
  if (singular.length > 0) return Math.max(options.targetAccuracy, 1e-9);
  return options.targetAccuracy;
}

function matchChain(levels: readonly LevelSolution[], re: number, im: number): [number, number][] {
  const seq: [number, number][] = [[re, im]];
  let cr = re;
  let ci = im;
  for (let L = levels.length - 2; L >= 0; L--) {
    const lv = levels[L];
    let best = 0;
    let bestD = Infinity;
    for (let k = 0; k < lv.allRe.length; k++) {
      const d = Math.hypot(lv.allRe[k] - cr, lv.allIm[k] - ci);
      if (d < bestD) { bestD = d; best = k; }
    }
    cr = lv.allRe[best];
    ci = lv.allIm[best];
    seq.unshift([cr, ci]);
  }
  return seq;
}

export function runSpectralEngine(
  name: string,
  ir: IrFunction,
  domain: readonly [number, number],
  options: AnalysisOptions,
  token?: CancellationToken,
  compiled?: CompiledKernel,
): SpectralResult {
  const start = now();
  const [a, b] = domain;
  // Kernels near the ends of the double range are analysed as 2^−e·K and their figures scaled back (kernelScale.ts).
  const scaling = scaleKernel(ir, compiled ?? compileKernel(ir), a, b);
  const result = runScaled(ir, domain, options, scaling.kernel, absoluteFloor(scaling, a, b), start, token);
  const back = scaleResultBack(result, scaling.exponent);
  const sp = back.spectrum;
  if (sp && (!Number.isFinite(sp.norm?.value ?? 0) || sp.eigenvalues.some((e) => !Number.isFinite(e.re) || !Number.isFinite(e.im)))) {
    // The figures themselves are beyond the double range (K = 1e308 on [−1, 1] has λ₁ = 2e308): none is better
    // than an infinite one.
    return { ...back, spectrum: null, reason: 'the operator’s norm is beyond the double range (its eigenvalues overflow)' };
  }
  return back;
}

function runScaled(
  ir: IrFunction,
  domain: readonly [number, number],
  options: AnalysisOptions,
  kernel: CompiledKernel,
  absFloor: number,
  start: number,
  token?: CancellationToken,
): SpectralResult {
  const [a, b] = domain;
  const raw = findLoci(ir, domain);
  const loci: LociResult = { loci: raw.loci, unknown: confirmUnknownLoci(raw.unknown, domain), capped: raw.capped };
  const singularLoci = loci.loci.filter((l) => l.kind === 'singular');
  const singularities = singularLoci
    .map((l) => estimateSingularity(kernel, l, a, b))
    .filter((s): s is SingularityEstimate => s !== null);
  let spent = 0;
  const caps: EngineCap[] = [...loci.capped];
  const empty = (reason: string): SpectralResult => ({
    spectrum: null, reason, loci, singularities, finest: null, hermitian: false, defect: NaN, reached: NaN, target: NaN,
    work: spent, caps,
  });
  const fatal = singularities.find((s) => !s.integrable);
  if (fatal) {
    const where = fatal.point ? `the corner (t, s) = (${Number(fatal.at[0].toPrecision(6))}, ${Number(fatal.at[1].toPrecision(6))})` : describeLine(fatal.locus);
    return empty(`|K| grows like d^(−${fatal.exponent.toFixed(2)}) toward ${where}, which is not integrable, so the operator is not bounded on L²`);
  }
  const target = classTarget(options, singularities);
  const ladderOptions = {
    singular: singularLoci.length > 0,
    unknownLoci: loci.unknown.length > 0,
    maxSize: options.maxResolution,
    minSize: Math.max(16, 2 * options.eigenCount),
  };
  let followed: readonly Locus[] = loci.loci;
  let ladder = buildLadder(planMesh(followed, a, b), ladderOptions);
  if (ladder.length === 0) {
    // More loci than panels the resolution cap allows: the mesh follows the singular ones only and refines
    // uniformly across the kinks and jumps (as for loci it could not place).
    followed = singularLoci;
    ladder = buildLadder(planMesh(followed, a, b), { ...ladderOptions, unknownLoci: true });
    caps.push({ kind: 'mesh-loci', loci: loci.loci.length, followed: followed.length, maxResolution: options.maxResolution });
  }
  if (ladder.length === 0) {
    return empty(`K is singular along ${singularLoci.length} lines, more than a discretisation within the resolution cap of ${options.maxResolution} can follow`);
  }
  const oblique = withPowerTails(followed.filter((l) => l.line.ct !== 0 && l.line.cs !== 0), singularities);
  const count = options.eigenCount;
  const levels: LevelSolution[] = [];
  let lastWork = 0;
  const budget = options.timeBudgetMs * workUnitsPerMs;
  let reached = Infinity;
  let estimates: { eig: EigenEstimate[]; norm: Estimate; hs: Estimate | null } | null = null;
  const hsFinite = singularities.every((s) => s.squareIntegrable);
  const tailFloors = { eig: tailRoundingFloor(oblique, a, b, 1), hs: tailRoundingFloor(oblique, a, b, 2) };
  const contraction = levelContraction(singularities);

  for (let k = 0; k < ladder.length; k++) {
    throwIfCancelled(token);
    const d = ladder[k];
    // At least three levels always (so every estimate has a convergence rate behind it); then the budget rules.
    if (levels.length >= 3) {
      const growth = (discretisationSize(d) / levels[levels.length - 1].matrix.n) ** 2.5;
      if (spent + lastWork * growth > budget) break;
      if (now() - start > safetyNetMs(options.timeBudgetMs)) break; // see workUnitsPerMs
    }
    const matrix = assembleGalerkin(kernel, d, oblique, token);
    if (matrix.nonFinite > 0) {
      if (levels.length === 0) return empty('K is not finite at points inside the square where the analysis must evaluate it');
      break;
    }
    if (!entriesFinite(matrix.re) || (matrix.im && !entriesFinite(matrix.im))) {
      // Finite kernel values whose weighted integrals overflow (a domain such as [-1e300, 1e300]): the operator's
      // size is beyond the double range, as below.
      if (levels.length === 0) return empty('the Galerkin matrix of K is too large for double precision (its entries overflow)');
      break;
    }
    const sol = solveLevel(matrix, Math.max(count, 1) + 4);
    if (!Number.isFinite(sol.sigmaMax) || !Number.isFinite(sol.frobenius)) {
      // The entries are finite but the operator's size is beyond the double range: an evaluation fault, reported
      // by the fault probe; no figure is better than an infinite one.
      if (levels.length === 0) return empty('the Galerkin matrix of K is too large for double precision (its norm overflows)');
      break;
    }
    levels.push(sol);
    lastWork = levelWork(sol);
    spent += lastWork;
    if (levels.length < 2) continue;
    estimates = estimateAll(levels, count, hsFinite, singularLoci.length > 0, absFloor, tailFloors, contraction);
    const scale = Math.max(estimates.norm.value, 1e-300);
    const worst = Math.max(estimates.norm.error, ...estimates.eig.map((e) => e.error));
    reached = worst / scale;
    if (reached <= target) break;
    // Errors at the floor of subnormal kernel values: finer levels cannot lower them.
    if (absFloor > 0 && worst <= 1.5 * absFloor) break;
  }
  const finest = levels[levels.length - 1];
  if (!finest) return empty('the analysis was stopped before the first discretisation finished');
  if (!estimates) estimates = estimateAll(levels, count, hsFinite, singularLoci.length > 0, absFloor, tailFloors, contraction);

  const schur = schurBound(kernel, loci.loci, a, b, token);
  const trace = singularities.some((s) => s.type !== 'none' && s.locus.line.ct === -s.locus.line.cs && s.locus.line.c0 === 0)
    ? null : traceIntegral(kernel, loci.loci, a, b, token);
  const norm = bracketNorm(estimates.norm, estimates.hs, schur);
  const spectrum: SpectrumReport = {
    eigenvalues: estimates.eig,
    eigenfunctions: sampleEigenfunctions(finest, a, b, options.gridPoints, Math.min(count, finest.pairs.length)),
    norm,
    hsNorm: estimates.hs,
    trace: trace ? { value: trace.value, error: Math.max(trace.error, absFloor) } : null,
    method: describeMethod(finest, levels.length),
    converged: reached <= target,
    elapsedMs: now() - start,
  };
  return {
    spectrum, reason: null, loci, singularities, finest, hermitian: finest.hermitian, defect: finest.defect,
    reached, target, work: spent, caps,
  };
}

/**
 * `absFloor`: the absolute error of every figure from subnormal kernel values (kernelScale.ts), else 0.
 * `tailFloors`: relative errors from rounding in the power tails (pairRule.ts, tailRoundingFloor), of the Galerkin
 * figures (relative to ‖T‖) and of the Hilbert–Schmidt norm.
 */
function estimateAll(levels: readonly LevelSolution[], count: number, hsFinite: boolean, cautious: boolean, absFloor: number,
  tailFloors: { readonly eig: number; readonly hs: number }, contraction: number) {
  const finest = levels[levels.length - 1];
  const floor = Math.max(roundingFloor(finest.sigmaMax, finest.matrix.n), absFloor, tailFloors.eig * finest.sigmaMax);
  const eig: EigenEstimate[] = finest.pairs.slice(0, count).map((p) => {
    const seq = matchChain(levels, p.re, p.im);
    const e = estimateSequenceError(seq.slice(-3), floor, cautious, contraction);
    // A non-normal kernel's eigenvalue that does not settle between levels (no Rayleigh–Ritz bound holds it, and
    // its differences do not shrink) is not converged: its error covers 0 as well as the value, so the accuracy
    // note (KW401) says how far the figures are from settled, instead of a level difference posing as an error.
    // Differences below 1e-8·‖T‖ are taken as the rounding noise of an ill-conditioned eigenvalue, not wandering.
    const wandering = !finest.hermitian && !e.converging && levels.length >= 3 && e.error > 1e-8 * finest.sigmaMax;
    const error = wandering ? Math.max(e.error, Math.hypot(p.re, p.im)) : e.error;
    return { re: p.re, im: finest.hermitian ? 0 : p.im, error };
  });
  const normSeq = levels.slice(-3).map((l) => [l.sigmaMax, 0] as [number, number]);
  const ne = estimateSequenceError(normSeq, floor, cautious, contraction);
  const norm = { value: finest.sigmaMax, error: ne.error };
  let hs: Estimate | null = null;
  if (hsFinite) {
    const hsSeq = levels.slice(-3).map((l) => [Math.sqrt(l.matrix.hsSquared), 0] as [number, number]);
    const hsValue = Math.sqrt(finest.matrix.hsSquared);
    const he = estimateSequenceError(hsSeq, Math.max((8 * Number.EPSILON + tailFloors.hs) * hsValue, absFloor), cautious, contraction);
    hs = { value: Math.sqrt(finest.matrix.hsSquared), error: he.error };
  }
  return { eig, norm, hs };
}

/**
 * The contraction of the error per ladder level that a singularity along a line t = c (or s = c) allows. There
 * K ≈ |t − c|^(−β)·h, so the eigenfunctions grow like |t − c|^(−β) too, and the part of them (and of ∫∫|K|²) on the
 * innermost graded panel, of size ε, is of order ε^(1 − 2β). Each level grades one step further (ε shrinks by the
 * grading ratio σ), so the error shrinks by at least σ^(1 − 2β) per level and no faster in general: 0.98 at
 * β = 0.495, where the observed ratio of two differences looked geometric (λ₁ = 73 ± 2.9 against 100). Derived
 * from the approximation of a power by piecewise polynomials on a geometric mesh (C. Schwab, p- and hp-Finite
 * Element Methods, 1998, ch. 4; the rate argument here is ours). 0 when no such line is singular.
 */
function levelContraction(singularities: readonly SingularityEstimate[]): number {
  let worst = 0;
  for (const s of singularities) {
    if (s.point || s.geometry !== 'axis' || s.type !== 'power') continue;
    const margin = 1 - 2 * (s.exponent + s.exponentError);
    if (margin > 0) worst = Math.max(worst, DEFAULT_GRADING_RATIO ** margin);
  }
  return worst;
}

function bracketNorm(norm: Estimate, hs: Estimate | null, schur: Estimate | null): NormEstimate {
  const lower = Math.max(0, norm.value - norm.error);
  let upper = Infinity;
  if (hs) upper = Math.min(upper, hs.value + hs.error);
  if (schur) upper = Math.min(upper, schur.value + schur.error);
  upper = Math.max(upper, norm.value + norm.error);
  return { value: norm.value, error: norm.error, lower, upper };
}

export function describeLine(l: Locus): string {
  const { ct, cs, c0 } = l.line;
  const fmt = (x: number) => String(Number(x.toPrecision(6)));
  if (cs === 0) return `the line t = ${fmt(-c0 / ct)}`;
  if (ct === 0) return `the line s = ${fmt(-c0 / cs)}`;
  if (ct === -cs && c0 === 0) return 'the diagonal t = s';
  const term = (c: number, v: string, first: boolean) => {
    const mag = Math.abs(c) === 1 ? v : `${fmt(Math.abs(c))}·${v}`;
    if (first) return c < 0 ? `−${mag}` : mag;
    return c < 0 ? ` − ${mag}` : ` + ${mag}`;
  };
  return `the line ${term(ct, 't', true)}${term(cs, 's', false)} = ${fmt(-c0)}`;
}

function describeMethod(finest: LevelSolution, levels: number): string {
  const d = finest.matrix.discretisation;
  const panels = d.breakpoints.length - 1;
  return `Galerkin, piecewise Legendre degree ${d.degree} on ${panels} panel${panels === 1 ? '' : 's'} (N = ${finest.matrix.n})`
    + `${d.singularLevels > 0 ? ', graded singular quadrature' : ''}, ${levels} levels compared`;
}
