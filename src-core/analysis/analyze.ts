/**
 * The one entry point every front end calls: parse, bind, probe evaluation faults and (optionally) run the
 * spectral engine on each kernel. Pure: text in, data out.
 */
import { parse } from '../syntax/parser';
import { bindFile } from '../semantics/bind';
import type { KernelSymbol } from '../semantics/model';
import type { Diagnostic } from '../diagnostics/types';
import type { CancellationToken } from '../util/cancellation';
import { defaultAnalysisOptions, type AnalysisOptions, type FileAnalysis, type KernelReport } from './types';
import { faultDiagnostics } from './faults';
import { analyzeKernelNumerics } from './kernelAnalysis';
import { runChecks } from '../checks';
import { makeDiagnostic } from '../diagnostics/make';

/**
 * Why a front end's safety net stopped the analysis of a kernel in an earlier attempt: it ran far past its budget
 * (`elapsedMs` of wall-clock time) or past the analysis memory limit (`limitMb`).
 */
export type StopReason =
  | { readonly kind: 'time'; readonly elapsedMs: number }
  | { readonly kind: 'memory'; readonly limitMb: number };

/** What a front end that runs the analysis under a safety net (a watchdog over a worker thread) needs from it. */
export interface PipelineHooks {
  /** Called as the analysis of each kernel starts, with its name and definition hash (before any numerics). */
  readonly onKernel?: (name: string, hash: string) => void;
  /**
   * Kernels (by definition hash) that the safety net stopped before: they are not analysed again, and each gets a
   * diagnostic saying so (KW406 or KW407) in place of its figures.
   */
  readonly stopped?: ReadonlyMap<string, StopReason>;
}

function stoppedDiagnostic(k: KernelSymbol, reason: StopReason, budgetMs: number): Diagnostic {
  return reason.kind === 'time'
    ? makeDiagnostic('analysis-stopped', k.nameRange, {
        name: k.name, seconds: (reason.elapsedMs / 1000).toFixed(1), budget: budgetMs,
      }, { figures: { elapsedMs: reason.elapsedMs } })
    : makeDiagnostic('analysis-out-of-memory', k.nameRange, { name: k.name, limitMb: reason.limitMb },
        { figures: { limitMb: reason.limitMb } });
}

export function compareDiagnostics(a: Diagnostic, b: Diagnostic): number {
  return a.range.start - b.range.start || a.range.end - b.range.end || a.code.localeCompare(b.code);
}

export function analyzeText(
  text: string,
  options: Partial<AnalysisOptions> = {},
  token?: CancellationToken,
  hooks: PipelineHooks = {},
): FileAnalysis {
  const opts: AnalysisOptions = { ...defaultAnalysisOptions, ...options };
  const source = parse(text);
  const model = bindFile(source);
  const diagnostics: Diagnostic[] = [...source.diagnostics, ...model.diagnostics];
  const kernels: KernelReport[] = [];
  for (const k of model.kernels) {
    if (k.name === '') continue;
    const base = baseReport(k);
    if (!opts.numerics || !k.ir || !k.domain || token?.isCancellationRequested) {
      kernels.push(base);
      continue;
    }
    const stopped = k.hash ? hooks.stopped?.get(k.hash) : undefined;
    if (stopped) {
      diagnostics.push(stoppedDiagnostic(k, stopped, opts.timeBudgetMs));
      kernels.push(base);
      continue;
    }
    if (k.hash) hooks.onKernel?.(k.name, k.hash);
    const faults = faultDiagnostics(k);
    diagnostics.push(...faults.diagnostics);
    if (faults.blocking) {
      kernels.push(base);
      continue;
    }
    const numerics = analyzeKernelNumerics(k, opts, token);
    if (!numerics) {
      kernels.push(base);
      continue;
    }
    const checks = runChecks(k, text, numerics.result, numerics.spectrum, opts, token);
    if (!checks) {
      diagnostics.push(...numerics.diagnostics);
      kernels.push({ ...base, spectrum: numerics.spectrum });
      continue;
    }
    // An unbounded operator has no spectrum: the boundedness finding (or the failed claim) says why, and notes
    // about the engine's figures (no spectrum, accuracy, method cross-check) would only describe numbers not shown.
    diagnostics.push(...(checks.unbounded ? [] : numerics.diagnostics), ...checks.diagnostics);
    kernels.push({
      ...base,
      spectrum: checks.spectrum,
      hermitian: checks.hermitian,
      boundedness: checks.boundedness,
      continuity: checks.continuity,
      positive: checks.positive,
      effectiveRank: checks.effectiveRank,
      resolvent: checks.resolvent,
    });
  }
  diagnostics.sort(compareDiagnostics);
  return { source, model, diagnostics, kernels };
}

export function baseReport(k: KernelSymbol): KernelReport {
  return {
    name: k.name,
    nameRange: k.nameRange,
    range: k.decl.range,
    domain: k.domain ? [k.domain.a, k.domain.b] : null,
    complex: k.ir?.complex ?? false,
    hash: k.hash,
    spectrum: null,
    hermitian: null,
    boundedness: null,
    continuity: null,
    positive: null,
    effectiveRank: null,
    resolvent: [],
  };
}
