/**
 * The resolvent check, for each declared `resolvent μ`: is μ in the resolvent set of T (μI − T boundedly
 * invertible), how far is it from the spectrum, how large is ‖(μ − T)⁻¹‖, and does the Neumann series
 * (μ − T)⁻¹ = Σ T^k / μ^(k+1) converge?
 *
 * The spectrum is known as: 0 (always in the spectrum of a compact operator on an infinite-dimensional space, so
 * μ = 0 is never in the resolvent set), the leading eigenvalues with their errors, and for a Hermitian kernel all
 * eigenvalues of the Galerkin matrix, each with an error from the nested coarser discretisation (galerkin.ts).
 * Eigenvalues that do not agree between the two discretisations to 10⁻³ are unresolved; they lie in a disk
 * |λ| ≤ R around 0, and μ inside that disk cannot be decided. (For a non-Hermitian kernel R is the modulus of the
 * last leading eigenvalue plus its error, unless the list is shorter than asked for: a kernel of finite rank.)
 *  - dist(μ, σ(T)) is the smallest distance to a resolved eigenvalue or to 0, with that eigenvalue's error; when μ
 *    lies within the error of an eigenvalue, membership is undecided (a warning on the claim);
 *  - for Hermitian T, ‖(μ − T)⁻¹‖ = 1 / dist(μ, σ(T)) (the spectral theorem; for non-normal T it is only a lower
 *    bound and is not reported);
 *  - the Neumann series converges exactly when |μ| exceeds the spectral radius max |λ|.
 * When the eigenvalues leave μ undecided, an enclosure of the whole spectrum may still decide it (see `enclosure`):
 * {0} for a quasinilpotent (Volterra-type) operator, [0, ‖T‖] for a positive one, ℝ for a Hermitian one, the disk
 * |λ| ≤ ‖T‖ for any.
 * Finding: KW540 (the figures, info, on the claim). Claim: `resolvent μ` (KW608).
 */
import type { ComplexFigure, Estimate, PositivityReport, ResolventReport } from '../analysis/types';
import { roundingFloor } from '../numerics/engine/errorEstimate';
import type { BoundednessFacts } from './boundedness';
import type { ClaimVerdict, CheckContext } from './types';
import { coarserHermitianEigenvalues, finestHermitianEigenvalues } from './galerkin';
import { fmt, fmtComplex, fmtEstimate } from './sampling';
import { positivityReportOf } from './positivity';

interface Candidate { readonly re: number; readonly im: number; readonly error: number; readonly label: string }

export interface ResolventFacts {
  readonly report: ResolventReport;
  /** The sentence shown on the claim (KW540 or the failure), or the reason it cannot be decided. */
  readonly summary: string;
}

/** Known eigenvalues with errors, and the radius of the disk around 0 that holds the unresolved ones. */
function knownSpectrum(ctx: CheckContext, hermitian: boolean): { candidates: Candidate[]; radius: number } {
  const spectrum = ctx.spectrum!;
  const finest = ctx.engine.finest;
  const lead = spectrum.eigenvalues;
  const candidates: Candidate[] = lead.map((e, k) => ({ re: e.re, im: e.im, error: e.error, label: `λ${k + 1} = ${fmtComplex(e.re, e.im, 8)}` }));
  const finiteRank = lead.length < ctx.options.eigenCount;
  if (hermitian && finest) {
    const fine = finestHermitianEigenvalues(finest);
    const coarse = coarserHermitianEigenvalues(finest);
    const floor = 100 * roundingFloor(finest.sigmaMax, finest.matrix.n);
    let radius = 0;
    for (const x of fine) {
      if (candidates.some((c) => Math.abs(c.re - x) <= Math.max(c.error, floor))) continue;
      let err = Infinity;
      if (coarse) for (const y of coarse) err = Math.min(err, Math.abs(x - y));
      if (Math.abs(x) <= floor && (finiteRank || err <= floor)) continue; // an exact zero (finite rank)
      if (err <= 1e-3 * Math.abs(x)) candidates.push({ re: x, im: 0, error: Math.max(err, floor), label: `the eigenvalue ${fmt(x, 8)}` });
      else radius = Math.max(radius, Math.abs(x) + err);
    }
    return { candidates, radius: finiteRank ? 0 : radius };
  }
  const last = lead[lead.length - 1];
  return { candidates, radius: finiteRank || !last ? 0 : Math.hypot(last.re, last.im) + last.error };
}

/**
 * Spectral enclosures that decide μ without resolving eigenvalues: σ(T) = {0} for a quasinilpotent (Volterra-type)
 * operator; σ(T) ⊂ [0, ‖T‖] for a positive one, so dist(μ, σ(T)) = |μ| for μ < 0, as 0 ∈ σ(T); σ(T) ⊂ ℝ for a
 * Hermitian one, so dist(μ, σ(T)) ≥ |Im μ|; and σ(T) inside the disk |λ| ≤ ‖T‖ for every bounded operator (the
 * spectral radius is at most the norm). (Common practice; e.g. E. Kreyszig, Introductory Functional Analysis with
 * Applications, 1978, §7.3 and §9.2, from memory.) Null when none of them applies.
 */
function enclosure(ctx: CheckContext, mu: ComplexFigure, hermitian: boolean, positive: PositivityReport | undefined): ResolventFacts | null {
  const spectrum = ctx.spectrum!;
  const muText = fmtComplex(mu.re, mu.im, 8);
  const modulus = Math.hypot(mu.re, mu.im);
  const n = spectrum.norm;
  const inSet = (distance: Estimate | null, resolventNorm: Estimate | null, neumann: boolean | null, why: string): ResolventFacts => {
    const d = distance ? `dist(μ, σ(T)) = ${fmtEstimate(distance.value, distance.error)}` : '';
    const r = resolventNorm ? `; ‖(μ − T)⁻¹‖ = ${fmtEstimate(resolventNorm.value, resolventNorm.error)}` : '';
    const neu = neumann === true ? '; the Neumann series converges' : neumann === false ? '; the Neumann series diverges' : '';
    return {
      report: { mu, inResolventSet: true, distance, resolventNorm, neumannConverges: neumann },
      summary: `μ = ${muText} is in the resolvent set of “${ctx.name}”: ${why}${d ? `, so ${d}` : ''}${r}${neu}.`,
    };
  };
  if (spectrum.quasinilpotent) {
    return inSet({ value: modulus, error: 0 }, null, true, spectrum.quasinilpotent.reason);
  }
  if (hermitian && positive?.holds === true && mu.im === 0 && mu.re < 0) {
    // The positivity check's verdict is the premise: σ(T) ⊂ [0, ‖T‖] and 0 ∈ σ(T), so the nearest point is 0.
    const d = -mu.re;
    return inSet({ value: d, error: 0 }, { value: 1 / d, error: 0 }, null,
      'T is positive, so σ(T) ⊂ [0, ‖T‖], and 0 ∈ σ(T) (T is compact)');
  }
  if (hermitian && mu.im !== 0) {
    return inSet(null, null, null, `T is Hermitian, so σ(T) ⊂ ℝ and dist(μ, σ(T)) ≥ |Im μ| = ${fmt(Math.abs(mu.im), 6)} (‖(μ − T)⁻¹‖ ≤ ${fmt(1 / Math.abs(mu.im), 6)})`);
  }
  const upper = n ? Math.min(n.value + n.error, n.upper) : Infinity;
  if (modulus > upper) {
    return inSet(null, null, true, `|μ| = ${fmt(modulus, 6)} exceeds ‖T‖ ≤ ${fmt(upper, 6)}, which bounds the spectral radius`);
  }
  return null;
}

export function measureResolvent(
  ctx: CheckContext, mu: ComplexFigure, hermitian: boolean, bounded: BoundednessFacts, positive?: PositivityReport,
): ResolventFacts {
  const generic = measureFromEigenvalues(ctx, mu, hermitian, bounded);
  if (generic.report.inResolventSet !== null && !(ctx.spectrum?.quasinilpotent && generic.report.inResolventSet)) return generic;
  if (!ctx.spectrum || bounded.report.class === 'unbounded' || (mu.re === 0 && mu.im === 0)) return generic;
  return enclosure(ctx, mu, hermitian, positive ?? positivityReportOf(ctx.engine)) ?? generic;
}

function measureFromEigenvalues(ctx: CheckContext, mu: ComplexFigure, hermitian: boolean, bounded: BoundednessFacts): ResolventFacts {
  const none = (summary: string, inSet: boolean | null = null, distance: Estimate | null = null): ResolventFacts => ({
    report: { mu, inResolventSet: inSet, distance, resolventNorm: null, neumannConverges: null }, summary,
  });
  const muText = fmtComplex(mu.re, mu.im, 8);
  if (bounded.report.class === 'unbounded') return none('the operator is not bounded, so no spectrum was computed');
  if (!ctx.spectrum || ctx.spectrum.eigenvalues.length === 0 && !ctx.engine.finest) return none('there is no spectrum to compare μ with');
  const modulus = Math.hypot(mu.re, mu.im);
  if (modulus === 0) {
    return none('μ = 0 lies in the spectrum of every compact operator on an infinite-dimensional space (T has no bounded inverse)', false, { value: 0, error: 0 });
  }
  const { candidates, radius } = knownSpectrum(ctx, hermitian);
  const lead = ctx.spectrum.eigenvalues;
  const rho = lead.length > 0 ? Math.hypot(lead[0].re, lead[0].im) : 0;
  const rhoErr = lead.length > 0 ? lead[0].error : 0;
  const neumann = modulus > rho + rhoErr ? true : modulus < rho - rhoErr ? false : null;
  const neumannText = neumann === true
    ? `the Neumann series converges (|μ| = ${fmt(modulus, 6)} > spectral radius ${fmtEstimate(rho, rhoErr)})`
    : neumann === false ? `the Neumann series diverges (|μ| = ${fmt(modulus, 6)} < spectral radius ${fmtEstimate(rho, rhoErr)})`
      : 'whether the Neumann series converges is within the error of the spectral radius';
  const within = candidates.find((c) => Math.hypot(mu.re - c.re, mu.im - c.im) <= c.error);
  if (within) {
    const d = Math.hypot(mu.re - within.re, mu.im - within.im);
    return {
      report: { mu, inResolventSet: null, distance: { value: d, error: within.error }, resolventNorm: null, neumannConverges: neumann },
      summary: `μ = ${muText} lies within the error (${fmt(within.error, 2)}) of ${within.label}, so it may be an eigenvalue`,
    };
  }
  if (modulus <= radius) {
    return {
      report: { mu, inResolventSet: null, distance: null, resolventNorm: null, neumannConverges: neumann },
      summary: `|μ| = ${fmt(modulus, 6)} lies among the small eigenvalues (|λ| ≤ ${fmt(radius, 3)}) that the discretisation does not resolve`,
    };
  }
  let best: { d: number; error: number; label: string } = { d: modulus, error: radius, label: 'the accumulation point 0 of the spectrum' };
  for (const c of candidates) {
    const d = Math.hypot(mu.re - c.re, mu.im - c.im);
    if (d < best.d) best = { d, error: c.error, label: `${c.label} ± ${fmt(c.error, 2)}` };
  }
  const distance: Estimate = { value: best.d, error: best.error };
  const resolventNorm: Estimate | null = hermitian ? { value: 1 / best.d, error: best.error / (best.d * Math.max(best.d - best.error, best.d / 2)) } : null;
  const normText = resolventNorm ? `; ‖(μ − T)⁻¹‖ = ${fmtEstimate(resolventNorm.value, resolventNorm.error)}` : '';
  return {
    report: { mu, inResolventSet: true, distance, resolventNorm, neumannConverges: neumann },
    summary: `μ = ${muText} is in the resolvent set of “${ctx.name}”: dist(μ, σ(T)) = ${fmtEstimate(distance.value, distance.error)} (nearest: ${best.label})${normText}; ${neumannText}.`,
  };
}

export function resolventClaim(ctx: CheckContext, f: ResolventFacts, muText: string): ClaimVerdict {
  if (f.report.inResolventSet === true) return { outcome: 'holds' };
  if (f.report.inResolventSet === null) return { outcome: 'undecided', reason: f.summary };
  return {
    outcome: 'fails', diagnostic: 'resolvent-claim-failed', args: { mu: muText, name: ctx.name, evidence: f.summary },
    figures: { distance: f.report.distance?.value ?? null },
  };
}
