/**
 * Runs the property checks on one analysed kernel: measures each property once per kernel definition (cached by
 * the kernel's hash and the options, like the spectral engine's result), then judges the declared claims and
 * places the findings on the current text (ranges and fixes are never cached: an edit elsewhere moves them).
 */
import type { Diagnostic } from '../diagnostics/types';
import type { KernelSymbol } from '../semantics/model';
import { compileKernel } from '../semantics/evaluator';
import type { CancellationToken } from '../util/cancellation';
import { throwIfCancelled } from '../util/cancellation';
import { forgetHashes } from '../util/hashCache';
import type {
  AnalysisOptions, BoundednessReport, ContinuityReport, EffectiveRankReport, HermitianReport, PositivityReport,
  ResolventReport, SpectrumReport,
} from '../analysis/types';
import type { SpectralResult } from '../numerics/engine/spectralEngine';
import { expandSeparable } from '../numerics/engine/separable';
import type { CheckContext } from './types';
import { measureSymmetry } from './symmetry';
import { measureBoundedness } from './boundedness';
import { measureContinuity } from './continuity';
import { measurePositivity } from './positivity';
import { measureRank, type RankFacts } from './rank';
import { judge, type KernelFacts } from './expectations';

export interface CheckResults {
  readonly hermitian: HermitianReport;
  readonly boundedness: BoundednessReport;
  readonly continuity: ContinuityReport;
  readonly positive: PositivityReport;
  readonly effectiveRank: EffectiveRankReport | null;
  readonly resolvent: readonly ResolventReport[];
  /** The spectrum to report: null when the operator turned out to be unbounded. */
  readonly spectrum: SpectrumReport | null;
  /**
   * True when the operator is unbounded, or boundedness is undecided: the engine's notes about figures not shown
   * are then dropped (KW510, a failed claim or the undecided boundedness says why).
   */
  readonly unbounded: boolean;
  readonly diagnostics: Diagnostic[];
}

interface CachedFacts {
  readonly facts: KernelFacts;
  readonly ctx: CheckContext;
}

const cacheLimit = 256;
const cache = new Map<string, CachedFacts>();

export function clearCheckCache(): void {
  cache.clear();
}

/** Drops the cached check results of the kernels with these definition hashes (whatever the options). */
export function forgetChecks(hashes: ReadonlySet<string>): void {
  forgetHashes(cache, hashes);
}

function optionsKey(o: AnalysisOptions): string {
  return `${o.eigenCount}|${o.timeBudgetMs}|${o.maxResolution}|${o.targetAccuracy}|${o.hermitianTolerance}|${o.positivityTolerance}`;
}

function measure(k: KernelSymbol, engine: SpectralResult, spectrum: SpectrumReport | null, options: AnalysisOptions, token?: CancellationToken): CachedFacts {
  const ir = k.ir!;
  const ctx: CheckContext = {
    name: k.name, ir, domain: [k.domain!.a, k.domain!.b], compiled: compileKernel(ir), engine, spectrum, options,
  };
  const symmetry = measureSymmetry(ctx);
  throwIfCancelled(token);
  const boundedness = measureBoundedness(ctx);
  throwIfCancelled(token);
  const continuity = measureContinuity(ctx, boundedness);
  throwIfCancelled(token);
  const positivity = measurePositivity(ctx, symmetry, continuity, boundedness);
  throwIfCancelled(token);
  let rank: RankFacts | null | undefined;
  const terms = expandSeparable(ir.root);
  const facts: KernelFacts = {
    symmetry, boundedness, continuity, positivity,
    rank: () => (rank === undefined ? (rank = boundedness.report.class === 'unbounded' ? null : measureRank(ctx)) : rank),
    separable: terms !== null && terms.length > 0,
  };
  return { facts, ctx };
}

/**
 * The checks of one kernel whose spectral analysis ran (`engine` is the engine's result, `spectrum` the spectrum
 * after the separable cross-check). `text` is the file's text, for fixes.
 */
export function runChecks(
  k: KernelSymbol, text: string, engine: SpectralResult, spectrum: SpectrumReport | null, options: AnalysisOptions,
  token?: CancellationToken,
): CheckResults | null {
  if (!k.ir || !k.domain || !k.hash) return null;
  const key = `${k.hash}|${optionsKey(options)}`;
  let entry = cache.get(key);
  if (!entry || entry.ctx.engine !== engine) {
    entry = measure(k, engine, spectrum, options, token);
    cache.set(key, entry);
    if (cache.size > cacheLimit) cache.delete(cache.keys().next().value as string);
  } else {
    cache.delete(key);
    cache.set(key, entry);
  }
  const { facts } = entry;
  const ctx: CheckContext = { ...entry.ctx, name: k.name, options };
  const judged = judge(ctx, k, facts, text);
  const unbounded = facts.boundedness.report.class === 'unbounded';
  return {
    hermitian: facts.symmetry.report,
    boundedness: facts.boundedness.report,
    continuity: facts.continuity.report,
    positive: facts.positivity.report,
    effectiveRank: facts.positivity.effectiveRank,
    resolvent: judged.resolvent,
    // No figures for an operator that may be unbounded either: a norm of its finite sections would mean nothing.
    spectrum: unbounded || facts.boundedness.dropSpectrum ? null : spectrum,
    unbounded: unbounded || facts.boundedness.dropSpectrum,
    diagnostics: judged.diagnostics,
  };
}

export type { CheckContext, Finding, ClaimVerdict } from './types';
export { isHermitianByConstruction } from './symbolicHermitian';
export type { KernelFacts } from './expectations';
