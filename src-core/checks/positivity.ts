/**
 * Positive semidefiniteness: ∫∫ conj f(t) K(t, s) f(s) ≥ 0 for every f, which on a complex L² space implies that
 * T is self-adjoint; so a kernel that is not Hermitian is not positive.
 *
 * The zero operator (Hilbert–Schmidt norm 0 ± 0, K = 0 on the sample grid) is positive, trivially: ⟨Tf, f⟩ = 0.
 *
 * For a Hermitian kernel:
 *  - the most negative eigenvalue, from the engine's leading eigenvalues (with their errors) and from all
 *    eigenvalues of the Galerkin matrix A. Since ⟨A v, v⟩ = ⟨T f, f⟩ for f = Σ v_i φ_i, a negative eigenvalue of A
 *    shows a negative direction of T (up to quadrature error); one beyond the leading ones gets its error from the
 *    nested coarser discretisation (galerkin.ts); no error is taken below the relative accuracy the engine
 *    reached times ‖T‖. The kernel counts as positive when no eigenvalue lies below −(its error +
 *    positivityTolerance · ‖T‖), and as undecided when that error exceeds 1 % of ‖T‖;
 *  - a point certificate for a continuous kernel, searched on a 48-point Gauss grid: K(t, t) < 0, or a 2 × 2
 *    principal minor |K(t, s)|² > K(t, t)·K(s, s) (either one is impossible for a continuous positive kernel),
 *    by more than positivityTolerance relative to max |K| (or max |K|²);
 *  - for a continuous positive kernel, Mercer's trace identity ∫K(t, t) dt = Σ λ_k (F. Riesz & B. Sz.-Nagy,
 *    Functional Analysis, 1955, §98), with Σ λ_k = trace(A) over all Galerkin eigenvalues and its error from the
 *    traces on degrees p − 4, p − 2, p (errorEstimate.ts), and the effective rank: how many modes carry 90 %, 99 %
 *    and 99.9 % of the trace, counted only over eigenvalues that agree to 10⁻³ between the two discretisations.
 * Findings: KW530 (not positive although it looks like a covariance: real, K ≥ 0, K(t, t) ≥ 0 and
 * |K(t, s)|² ≤ K(t, t)K(s, s) on the grid; warning), KW531 (not positive, info), KW532 (Mercer not confirmed,
 * info). Claim: `positive` (KW602).
 */
import type { EffectiveRankReport, Estimate, PositivityReport } from '../analysis/types';
import { estimateSequenceError, roundingFloor } from '../numerics/engine/errorEstimate';
import type { BoundednessFacts } from './boundedness';
import type { ContinuityFacts } from './continuity';
import type { SymmetryFacts } from './symmetry';
import type { ClaimVerdict, CheckContext, Finding } from './types';
import { holds, undecided } from './types';
import { coarserHermitianEigenvalues, comparisonDrop, finestHermitianEigenvalues, subTrace } from './galerkin';
import { fmt, fmtEstimate, fmtProduct, gaussGrid, kernelScale, sampleGrid } from './sampling';

export interface PositivityFacts {
  readonly report: PositivityReport;
  readonly effectiveRank: EffectiveRankReport | null;
  /** Real, non-negative, largest on the diagonal: shaped like a covariance. */
  readonly looksLikeCovariance: boolean;
  /** Why it is not positive (a clause for messages), or why it cannot be decided; null when it holds. */
  readonly evidence: string | null;
  readonly galerkinCount: number;
}

interface Certificate {
  readonly t: number;
  readonly s: number;
  readonly kind: 'diagonal' | 'minor';
  readonly margin: number;
  readonly text: string;
}

/** Point certificates and the covariance shape, from K on a Gauss grid of the square. */
function inspectGrid(ctx: CheckContext, continuous: boolean): { certificate: Certificate | null; covarianceShape: boolean } {
  const [a, b] = ctx.domain;
  const g = gaussGrid(a, b, 48);
  const x = g.nodes;
  const n = x.length;
  const v = sampleGrid(ctx.compiled, x, x);
  const scale = Math.max(kernelScale(ctx.compiled, a, b), 1e-300);
  const diag = Array.from({ length: n }, (_, i) => v.re[i * n + i]);
  let certificate: Certificate | null = null;
  let covarianceShape = !ctx.ir.complex;
  // Certificates must clear the same relative tolerance as eigenvalues (and rounding with room to spare).
  const rel = Math.max(1e-9, ctx.options.positivityTolerance);
  let best = rel * scale;
  for (let i = 0; i < n; i++) {
    if (!(diag[i] >= -1e-12 * scale)) covarianceShape = false;
    if (continuous && -diag[i] > best) {
      best = -diag[i];
      certificate = { t: x[i], s: x[i], kind: 'diagonal', margin: -diag[i], text: `K(t, t) = ${fmt(diag[i], 4)} < 0 at t = ${fmt(x[i], 4)}` };
    }
  }
  if (certificate) return { certificate, covarianceShape: false };
  // Squares relative to the power of two nearest the largest value (exact), so that they neither overflow
  // (1e154·(t + s)) nor underflow (1e-200·K); figures are written as products of the scale and those squares.
  const unit = 2 ** Math.round(Math.log2(scale));
  let bestMinor = rel * (scale / unit) ** 2;
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) {
      const k = i * n + j;
      const re = v.re[k];
      const im = v.im ? v.im[k] : 0;
      if (!Number.isFinite(re) || !Number.isFinite(im)) continue;
      if (re < -1e-12 * scale) covarianceShape = false;
      const [ur, ui, di, dj] = [re / unit, im / unit, diag[i] / unit, diag[j] / unit];
      const excess = ur * ur + ui * ui - di * dj;
      if (excess > 1e-9 * (scale / unit) ** 2) covarianceShape = false;
      if (continuous && j > i && excess > bestMinor) {
        bestMinor = excess;
        const kk = Math.hypot(ur, ui) ** 2;
        certificate = {
          t: x[i], s: x[j], kind: 'minor', margin: excess * unit * unit,
          text: `at t = ${fmt(x[i], 4)}, s = ${fmt(x[j], 4)}, |K(t, s)|² = ${fmtProduct([kk, unit, unit], 4)} exceeds K(t, t)·K(s, s) = ${fmtProduct([di * dj, unit, unit], 4)}`,
        };
      }
    }
  }
  return { certificate, covarianceShape };
}

/** The positivity verdict last measured on an engine result, for checks that need it (the resolvent's enclosure). */
const verdicts = new WeakMap<object, PositivityReport>();

/** The report measurePositivity gave for this engine result, or undefined when it has not run on it. */
export function positivityReportOf(engine: CheckContext['engine']): PositivityReport | undefined {
  return verdicts.get(engine);
}

export function measurePositivity(ctx: CheckContext, sym: SymmetryFacts, cont: ContinuityFacts, bounded: BoundednessFacts): PositivityFacts {
  const facts = measure(ctx, sym, cont, bounded);
  verdicts.set(ctx.engine, facts.report);
  return facts;
}

/**
 * The zero operator: the Hilbert–Schmidt norm is 0 with error 0 (every Galerkin matrix of three levels vanishes)
 * and K is 0 on the sample grid; ⟨Tf, f⟩ = 0 for every f, so it is positive, trivially.
 */
function isZeroOperator(ctx: CheckContext, bounded: BoundednessFacts): boolean {
  const s = ctx.spectrum;
  if (!s || bounded.report.class === 'unbounded' || !s.hsNorm || s.hsNorm.value !== 0 || s.hsNorm.error !== 0) return false;
  if (!s.norm || s.norm.upper !== 0) return false;
  return kernelScale(ctx.compiled, ctx.domain[0], ctx.domain[1]) === 0;
}

function measure(ctx: CheckContext, sym: SymmetryFacts, cont: ContinuityFacts, bounded: BoundednessFacts): PositivityFacts {
  const none = (evidence: string, holdsValue: boolean | null, covariance = false): PositivityFacts => ({
    report: { holds: holdsValue, minEigenvalue: null, certificate: null, mercer: null },
    effectiveRank: null, looksLikeCovariance: covariance, evidence, galerkinCount: 0,
  });
  if (!sym.report.holds) return none('it is not Hermitian, and a positive operator is self-adjoint', false);
  const spectrum = ctx.spectrum;
  const finest = ctx.engine.finest;
  if (isZeroOperator(ctx, bounded)) {
    return {
      report: { holds: true, minEigenvalue: { value: 0, error: 0 }, certificate: null, mercer: null },
      effectiveRank: null, looksLikeCovariance: false, evidence: null, galerkinCount: finest?.matrix.n ?? 0,
    };
  }
  if (bounded.report.class === 'unbounded' || !spectrum || !finest || spectrum.eigenvalues.length === 0) {
    return none('there is no spectrum to decide it', null);
  }
  const normT = spectrum.norm?.value ?? finest.sigmaMax;
  const tol = ctx.options.positivityTolerance * normT;
  const floor = roundingFloor(finest.sigmaMax, finest.matrix.n);
  const reached = Number.isFinite(ctx.engine.reached) ? ctx.engine.reached : 0;
  // No eigenvalue error below the relative accuracy the engine reached (a proxy for the error of the matrix).
  const leadErr = Math.max(floor, reached * normT, ...spectrum.eigenvalues.map((e) => e.error));
  let minEig: Estimate = spectrum.eigenvalues.reduce<Estimate>(
    (m, e) => (e.re < m.value ? { value: e.re, error: Math.max(e.error, reached * normT) } : m), { value: Infinity, error: 0 },
  );
  // Eigenvalues beyond the leading ones: the smallest of all Galerkin eigenvalues, its error from the comparison
  // with the coarser nested discretisation (never below the leading eigenvalues' errors). That comparison costs an
  // eigenvalue solve, so it is made when the smallest one may be negative, or (below) when the effective rank
  // needs the coarser eigenvalues anyway.
  const all = finestHermitianEigenvalues(finest);
  const allMin = all[all.length - 1];
  const beyondLeading = (): Estimate => {
    const coarse = coarserHermitianEigenvalues(finest);
    const coarseMin = coarse ? coarse[coarse.length - 1] : NaN;
    const error = Number.isFinite(coarseMin) ? Math.max(Math.abs(allMin - coarseMin), leadErr) : Math.max(Math.abs(allMin), leadErr);
    return { value: allMin, error };
  };
  if (allMin < minEig.value && allMin < -(leadErr + tol)) minEig = beyondLeading();
  const negative = minEig.value < -(minEig.error + tol);
  const grid = inspectGrid(ctx, cont.report.class === 'continuous');
  const certificate = grid.certificate;
  // Eigenvalues known only to within a sizeable part of ‖T‖ cannot show that none is negative.
  const vague = minEig.error > 1e-2 * normT;
  const positive: boolean | null = negative || certificate ? false : vague ? null : true;
  let evidence: string | null = null;
  if (positive === null) {
    evidence = `the eigenvalues are known only to within ${fmt(minEig.error, 2)} (‖T‖ = ${fmt(normT, 4)}), too coarse to exclude a negative one`;
  } else if (!positive) {
    const parts: string[] = [];
    if (negative) parts.push(`its most negative eigenvalue is ${fmtEstimate(minEig.value, minEig.error)}`);
    if (certificate) parts.push(certificate.text);
    evidence = parts.join('; ');
  }
  let mercer: PositivityReport['mercer'] = null;
  let effectiveRank: EffectiveRankReport | null = null;
  if (positive === true && cont.report.class === 'continuous' && spectrum.trace) {
    mercer = mercerIdentity(ctx, spectrum.trace, tol, floor);
    effectiveRank = effectiveRankOf(finest, spectrum.trace.value, tol, floor);
    if (allMin < minEig.value) minEig = beyondLeading();
  }
  return {
    report: {
      holds: positive,
      minEigenvalue: minEig.value === Infinity ? null : minEig,
      certificate: certificate ? { t: certificate.t, s: certificate.s, kind: certificate.kind, margin: certificate.margin } : null,
      mercer,
    },
    effectiveRank,
    looksLikeCovariance: grid.covarianceShape,
    evidence,
    galerkinCount: finest.matrix.n,
  };
}

function mercerIdentity(ctx: CheckContext, trace: Estimate, tol: number, floor: number): PositivityReport['mercer'] {
  const finest = ctx.engine.finest!;
  const p = finest.matrix.discretisation.degree;
  let sum = 0;
  for (const x of finest.allRe) sum += x;
  let sumError = Math.abs(sum - subTrace(finest, p - comparisonDrop(finest)));
  if (p >= 4) {
    const seq: [number, number][] = [[subTrace(finest, p - 4), 0], [subTrace(finest, p - 2), 0], [sum, 0]];
    sumError = estimateSequenceError(seq, floor, true).error;
  }
  const mismatch = Math.abs(trace.value - sum);
  return { trace, sum: { value: sum, error: sumError }, holds: mismatch <= 3 * (trace.error + sumError) + tol };
}

function effectiveRankOf(finest: NonNullable<CheckContext['engine']['finest']>, total: number, tol: number, floor: number): EffectiveRankReport | null {
  const fine = finestHermitianEigenvalues(finest);
  const coarse = coarserHermitianEigenvalues(finest);
  if (!coarse || !(total > 0)) return null;
  const noise = Math.max(tol, 100 * floor);
  let resolved = 0;
  for (let k = 0; k < fine.length; k++) {
    const c = k < coarse.length ? coarse[k] : 0;
    const ok = Math.abs(fine[k] - c) <= 1e-3 * Math.abs(fine[k]) || (Math.abs(fine[k]) <= noise && Math.abs(c) <= noise);
    if (!ok) break;
    resolved = k + 1;
  }
  const count = (fraction: number): number | null => {
    let cum = 0;
    for (let k = 0; k < resolved; k++) {
      cum += fine[k];
      if (cum >= fraction * total * (1 - 1e-12)) return k + 1;
    }
    return null;
  };
  return { p90: count(0.9), p99: count(0.99), p999: count(0.999), resolvedModes: resolved };
}

export function positivityFindings(ctx: { readonly name: string }, f: PositivityFacts, hermitian: boolean): Finding[] {
  const out: Finding[] = [];
  const figures = {
    minEigenvalue: f.report.minEigenvalue?.value ?? null, error: f.report.minEigenvalue?.error ?? null,
    t: f.report.certificate?.t ?? null, s: f.report.certificate?.s ?? null,
  };
  if (hermitian && f.report.holds === false && f.evidence) {
    out.push({
      name: f.looksLikeCovariance ? 'covariance-not-positive' : 'not-positive',
      args: { name: ctx.name, evidence: f.evidence }, figures, covers: ['positive'],
    });
  }
  const m = f.report.mercer;
  if (m && !m.holds) {
    out.push({
      name: 'mercer-mismatch',
      args: { name: ctx.name, trace: fmtEstimate(m.trace.value, m.trace.error), sum: fmtEstimate(m.sum.value, m.sum.error), count: f.galerkinCount },
      figures: { trace: m.trace.value, sum: m.sum.value }, covers: [],
    });
  }
  return out;
}

export function positiveClaim(ctx: CheckContext, f: PositivityFacts): ClaimVerdict {
  if (f.report.holds === true) return holds;
  if (f.report.holds === null) return undecided(f.evidence ?? 'no spectrum');
  return {
    outcome: 'fails', diagnostic: 'positive-claim-failed', args: { name: ctx.name, evidence: f.evidence ?? 'a negative eigenvalue' },
    figures: { minEigenvalue: f.report.minEigenvalue?.value ?? null, error: f.report.minEigenvalue?.error ?? null },
  };
}
