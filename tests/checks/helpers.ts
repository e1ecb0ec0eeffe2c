/** Shared helpers of the check tests: analyse a small kernel file and pick out one kernel and its diagnostics. */
import { analyzeText, type AnalysisOptions, type Diagnostic, type FileAnalysis, type KernelReport } from '@kernwright/core';

export interface Analysed {
  readonly analysis: FileAnalysis;
  readonly text: string;
  kernel(name: string): KernelReport;
  /** Diagnostics whose range lies inside the named kernel's declaration (its claims included). */
  diagnostics(name: string): Diagnostic[];
  codes(name: string): string[];
  /** Codes of the errors and warnings of the named kernel. */
  problems(name: string): string[];
}

/** Analyses `body` under `domain [0, 1]` (unless it declares its own) with a time budget that gives accuracy. */
export function analyse(body: string, options: Partial<AnalysisOptions> = {}): Analysed {
  const text = body.startsWith('domain') ? body : `domain [0, 1]\n${body}`;
  const analysis = analyzeText(text, { timeBudgetMs: 5000, ...options });
  const kernel = (name: string) => {
    const k = analysis.kernels.find((q) => q.name === name);
    if (!k) throw new Error(`no kernel ${name}`);
    return k;
  };
  const diagnostics = (name: string) => {
    const k = kernel(name);
    return analysis.diagnostics.filter((d) => d.range.start >= k.range.start && d.range.end <= k.range.end);
  };
  return {
    analysis, text, kernel, diagnostics,
    codes: (name) => diagnostics(name).map((d) => d.code),
    problems: (name) => diagnostics(name).filter((d) => d.severity === 'error' || d.severity === 'warning').map((d) => d.code),
  };
}
