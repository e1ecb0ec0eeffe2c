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
 * Finding: KW540 (the figures, info, on the claim). Claim: `resolvent μ` (KW608).
 */
import type { ComplexFigure, Estimate, ResolventReport } from '../analysis/types';
import { roundingFloor } from '../numerics/engine/errorEstimate';
import type { BoundednessFacts } from './boundedness';
import type { ClaimVerdict, CheckContext } from './types';
import { coarserHermitianEigenvalues, finestHermitianEigenvalues } from './galerkin';
import { fmt, fmtComplex, fmtEstimate } from './sampling';

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

export function measureResolvent(ctx: CheckContext, mu: ComplexFigure, hermitian: boolean, bounded: BoundednessFacts): ResolventFacts {
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
