/**
 * A worker thread of `kernwright check` (bundled as server/dist/checkWorker.js): it receives one file's text at a
 * time, analyses it with the core and posts back the diagnostics and kernel reports (plain data, structured-clone
 * safe). It never prints; a failure of the analysis comes back as a message for the main thread to report.
 */
import { parentPort, workerData } from 'node:worker_threads';
import { analyzeText, type AnalysisOptions, type Diagnostic, type KernelReport } from '@kernwright/core';
import { installMathjsSimplifier } from '../mathjsSimplifier';

export interface CheckJob {
  readonly index: number;
  readonly text: string;
  readonly options: Partial<AnalysisOptions>;
}

export type CheckJobResult =
  | { readonly index: number; readonly ok: true; readonly diagnostics: readonly Diagnostic[]; readonly kernels: readonly KernelReport[] }
  | { readonly index: number; readonly ok: false; readonly message: string };

/** Analyses one job; never throws. */
export function runCheckJob(job: CheckJob): CheckJobResult {
  try {
    const analysis = analyzeText(job.text, job.options);
    return { index: job.index, ok: true, diagnostics: analysis.diagnostics, kernels: analysis.kernels };
  } catch (error) {
    return { index: job.index, ok: false, message: error instanceof Error ? error.message : String(error) };
  }
}

/** Marks the threads started by parallel.ts, so that importing this file elsewhere never answers a stranger's port. */
export const checkWorkerRole = 'kernwright-check';

const port = parentPort;
if (port && (workerData as { role?: string } | null)?.role === checkWorkerRole) {
  // As in the main thread (main.ts), so that the fixes a worker reports are the same.
  installMathjsSimplifier();
  port.on('message', (job: CheckJob) => port.postMessage(runCheckJob(job)));
}
