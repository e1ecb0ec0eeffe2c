/**
 * The analysis worker (server/dist/worker.js): runs the full analysis of a file, numerics included, off the main
 * thread. Jobs run one at a time in arrival order; a job whose shared flag is raised stops at the core's next
 * cancellation check and answers `cancelled`. The core's cache of kernel results lives as long as the worker.
 * The start of every kernel is reported to the main thread, whose watchdog stops a worker stuck in one kernel.
 */
import { parentPort } from 'node:worker_threads';
import { analyzeText, CancelledError, clearCheckCache, clearSpectralCache, type CancellationToken } from '@kernwright/core';
import { installMathjsSimplifier } from '../mathjsSimplifier';
import { runKernelTestHook } from '../safetyNet';
import type { FromWorker, ToWorker } from './workerProtocol';
import { runWarmUpStep, warmUpSteps } from './warmUp';

const port = parentPort;
if (!port) throw new Error('worker.js must run as a worker thread');

// The symmetrize fix simplifies its text with mathjs, loaded on the first fix that asks (as the command line does).
installMathjsSimplifier();

function tokenOf(buffer: SharedArrayBuffer): CancellationToken {
  const flag = new Int32Array(buffer);
  return {
    get isCancellationRequested(): boolean {
      return Atomics.load(flag, 0) !== 0;
    },
  };
}

function post(message: FromWorker): void {
  port!.postMessage(message);
}

/** When the last job ended (or the worker started): warm-up steps run only after this much quiet. */
let lastActivity = performance.now();
const idleBeforeWarmUpMs = 400;
let warmUpStep = 0;

function scheduleWarmUp(): void {
  if (warmUpStep >= warmUpSteps || process.env.KERNWRIGHT_NO_WARMUP === '1') return;
  const timer = setTimeout(() => {
    if (performance.now() - lastActivity >= idleBeforeWarmUpMs) {
      try {
        runWarmUpStep(warmUpStep);
      } catch {
        // A warm-up step has no one to report to; the same fault would show in a real job.
      }
      warmUpStep++;
    }
    scheduleWarmUp();
  }, 60);
  timer.unref();
}

port.on('message', (message: ToWorker) => {
  try {
    handle(message);
  } finally {
    lastActivity = performance.now();
  }
});

function handle(message: ToWorker): void {
  if (message.type === 'clear-cache') {
    clearSpectralCache();
    clearCheckCache();
    return;
  }
  if (message.type === 'crash-for-test') {
    if (process.env.KERNWRIGHT_LSP_TEST_HOOKS === '1') process.exit(7);
    return;
  }
  const token = tokenOf(message.cancel);
  if (token.isCancellationRequested) {
    post({ type: 'cancelled', id: message.id });
    return;
  }
  const started = performance.now();
  try {
    const id = message.id;
    const result = analyzeText(message.text, { ...message.options, numerics: true }, token, {
      stopped: message.stopped,
      onKernel: (name, hash) => {
        post({ type: 'kernel', id, name, hash });
        runKernelTestHook(name);
      },
    });
    // A cancelled analysis may return early with kernels left unanalysed: never report it as complete.
    if (token.isCancellationRequested) post({ type: 'cancelled', id: message.id });
    else post({ type: 'done', id: message.id, diagnostics: result.diagnostics, kernels: result.kernels, elapsedMs: performance.now() - started });
  } catch (error) {
    if (error instanceof CancelledError || token.isCancellationRequested) post({ type: 'cancelled', id: message.id });
    else post({ type: 'failed', id: message.id, message: error instanceof Error ? error.message : String(error) });
  }
}

post({ type: 'ready' });
scheduleWarmUp();
