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

export function compareDiagnostics(a: Diagnostic, b: Diagnostic): number {
  return a.range.start - b.range.start || a.range.end - b.range.end || a.code.localeCompare(b.code);
}

export function analyzeText(
  text: string,
  options: Partial<AnalysisOptions> = {},
  token?: CancellationToken,
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
    diagnostics.push(...numerics.diagnostics);
    kernels.push({ ...base, spectrum: numerics.spectrum });
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
  };
}
