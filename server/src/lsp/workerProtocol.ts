/**
 * Messages between the language server's main thread and its analysis worker. The worker is long-lived, so the
 * core's per-kernel cache survives from one edit to the next; each job carries a shared cancellation flag that the
 * main thread raises when a newer edit makes the job pointless.
 */
import type { AnalysisOptions, Diagnostic, KernelReport, StopReason } from '@kernwright/core';

export interface AnalyzeJob {
  readonly type: 'analyze';
  readonly id: number;
  readonly text: string;
  readonly options: Partial<AnalysisOptions>;
  /** Int32Array over a SharedArrayBuffer of one element: 0 = go on, 1 = cancelled. */
  readonly cancel: SharedArrayBuffer;
  /** Kernels (by definition hash) the safety net stopped before: the core reports them (KW406/KW407) unanalysed. */
  readonly stopped: ReadonlyMap<string, StopReason>;
}

export interface ClearCache {
  readonly type: 'clear-cache';
}

/** Ends the worker abruptly; honoured only when KERNWRIGHT_LSP_TEST_HOOKS=1 (tests of the restart path). */
export interface CrashForTest {
  readonly type: 'crash-for-test';
}

export type ToWorker = AnalyzeJob | ClearCache | CrashForTest;

export type FromWorker =
  | { readonly type: 'ready' }
  /** The analysis of a kernel of job `id` starts (the main thread's watchdog times it). */
  | { readonly type: 'kernel'; readonly id: number; readonly name: string; readonly hash: string }
  | {
      readonly type: 'done';
      readonly id: number;
      readonly diagnostics: readonly Diagnostic[];
      readonly kernels: readonly KernelReport[];
      readonly elapsedMs: number;
    }
  | { readonly type: 'cancelled'; readonly id: number }
  | { readonly type: 'failed'; readonly id: number; readonly message: string };
