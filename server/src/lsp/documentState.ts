/**
 * What the server knows about one open document: its text, the quick analysis of that text (syntax and names), the
 * latest complete numerical analysis (possibly of an older version), and the diagnostics published now. The
 * editing features read a `FileAnalysis` view that joins the current tree with every kernel result still valid
 * (same name, same resolved hash).
 */
import { analyzeText, LineIndex, type Diagnostic, type FileAnalysis, type KernelReport, type NumericsState } from '@kernwright/core';
import type { JobHandle } from './workerClient';

export interface NumericResult {
  readonly version: number;
  /** The quick analysis of the text that was analysed numerically (for carrying findings forward). */
  readonly analysis: FileAnalysis;
  readonly diagnostics: readonly Diagnostic[];
  readonly kernels: readonly KernelReport[];
  readonly elapsedMs: number;
}

export class DocumentState {
  version = 0;
  text = '';
  /** Line index of the text that `quick` analysed. */
  index = new LineIndex('');
  /** Syntax and name analysis of the text (no numerics); for large files it may lag one pause behind `text`. */
  quick: FileAnalysis = analyzeText('', { numerics: false });
  numeric: NumericResult | null = null;
  /** The core diagnostics published for `version`. */
  diagnostics: readonly Diagnostic[] = [];
  job: JobHandle | null = null;
  timer: NodeJS.Timeout | null = null;
  /** The numerical stage is skipped for this text (switched off or the file is too large). */
  numericsSkipped = false;

  constructor(readonly uri: string) {}

  get pending(): boolean {
    return this.timer !== null || this.job !== null;
  }

  numericsState(): NumericsState {
    if (this.numericsSkipped) return 'off';
    return this.numeric?.version === this.version ? 'ready' : 'pending';
  }

  /** The kernel reports for the current text: the numerical one where still valid, otherwise the quick one. */
  kernels(): KernelReport[] {
    const done = this.numeric?.kernels ?? [];
    return this.quick.kernels.map((k) => {
      const r = k.hash ? done.find((d) => d.name === k.name && d.hash === k.hash) : undefined;
      return r ? { ...r, nameRange: k.nameRange, range: k.range } : k;
    });
  }

  /** The analysis the editing features work on. */
  view(): FileAnalysis {
    return { source: this.quick.source, model: this.quick.model, diagnostics: this.diagnostics, kernels: this.kernels() };
  }
}
