/**
 * A worker thread of `kernwright check` (bundled as server/dist/checkWorker.js): it receives one file's text at a
 * time, analyses it with the core and posts back the diagnostics and kernel reports (plain data, structured-clone
 * safe). It never prints; a failure of the analysis comes back as a message for the main thread to report.
 *
 * As each kernel's analysis starts, the worker tells the main thread (a `kernel` message), whose watchdog stops the
 * worker if that kernel runs far past its limit (parallel.ts). A job carries the kernels stopped in earlier attempts
 * at the same file; the core reports those (KW406, KW407) instead of analysing them again.
 */
import { parentPort, workerData } from 'node:worker_threads';
import { analyzeText, type AnalysisOptions, type Diagnostic, type KernelReport, type StopReason } from '@kernwright/core';
import { installMathjsSimplifier } from '../mathjsSimplifier';
import { runKernelTestHook } from '../safetyNet';

export interface CheckJob {
  readonly index: number;
  readonly text: string;
  readonly options: Partial<AnalysisOptions>;
  /** Kernels (by definition hash) that the safety net stopped in an earlier attempt at this file. */
  readonly stopped?: ReadonlyMap<string, StopReason>;
}

export type CheckJobResult =
  | { readonly index: number; readonly ok: true; readonly diagnostics: readonly Diagnostic[]; readonly kernels: readonly KernelReport[] }
  | { readonly index: number; readonly ok: false; readonly message: string };

/** Posted by a worker as the analysis of a kernel of job `index` starts. */
export interface KernelStarted {
  readonly kind: 'kernel';
  readonly index: number;
  readonly name: string;
  readonly hash: string;
}

export type CheckWorkerMessage = KernelStarted | CheckJobResult;

export function isKernelStarted(message: CheckWorkerMessage): message is KernelStarted {
  return (message as { kind?: unknown }).kind === 'kernel';
}

/** Analyses one job, calling `onKernel` as each kernel starts; never throws. */
export function analyseJob(job: CheckJob, onKernel?: (name: string, hash: string) => void): CheckJobResult {
  try {
    const hooks = { ...(onKernel ? { onKernel } : {}), ...(job.stopped ? { stopped: job.stopped } : {}) };
    const analysis = analyzeText(job.text, job.options, undefined, hooks);
    return { index: job.index, ok: true, diagnostics: analysis.diagnostics, kernels: analysis.kernels };
  } catch (error) {
    return { index: job.index, ok: false, message: error instanceof Error ? error.message : String(error) };
  }
}

/** Analyses one job in the calling thread, without a watchdog; never throws. */
export function runCheckJob(job: CheckJob): CheckJobResult {
  return analyseJob(job);
}

/** Marks the threads started by parallel.ts, so that importing this file elsewhere never answers a stranger's port. */
export const checkWorkerRole = 'kernwright-check';

const port = parentPort;
if (port && (workerData as { role?: string } | null)?.role === checkWorkerRole) {
  // As in the main thread (main.ts), so that the fixes a worker reports are the same.
  installMathjsSimplifier();
  port.on('message', (job: CheckJob) => {
    const result = analyseJob(job, (name, hash) => {
      const started: KernelStarted = { kind: 'kernel', index: job.index, name, hash };
      port.postMessage(started);
      runKernelTestHook(name);
    });
    port.postMessage(result);
  });
}
