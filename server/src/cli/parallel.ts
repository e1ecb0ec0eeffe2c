/**
 * Checking many files on several cores: a small pool of worker threads (checkWorker.ts, bundled next to the
 * program as checkWorker.js), each analysing one file at a time and taking the next when done. Results arrive in
 * any order; the caller puts them back in file order, so the report is the same as a sequential run's.
 *
 * Parallel work pays only when there are several files to analyse numerically (a worker costs tens of
 * milliseconds to start), but a single file is analysed in a worker too when the script is there, for the safety
 * net. When the worker script is missing (running from the TypeScript sources) or a worker fails, the files it did
 * not finish are handed back for the caller to analyse in its own thread.
 */
import * as fs from 'node:fs';
import * as os from 'node:os';
import * as path from 'node:path';
import { Worker } from 'node:worker_threads';
import { defaultAnalysisOptions, type AnalysisOptions, type StopReason } from '@kernwright/core';
import {
  analysisMemoryLimitMb,
  isOutOfMemory,
  KernelWatch,
  kernelTimeLimitMs,
  StoppedKernels,
  workerResourceLimits,
} from '../safetyNet';
import {
  checkWorkerRole,
  isKernelStarted,
  runCheckJob,
  type CheckJob,
  type CheckJobResult,
  type CheckWorkerMessage,
} from './checkWorker';

/** Below this many files a pool is not worth starting. */
export const parallelThreshold = 4;
const maxThreads = 8;

/** The bundled worker script beside the program, or null when there is none. */
export function workerScript(): string | null {
  const dir = typeof __dirname === 'string' ? __dirname : null;
  if (!dir) return null;
  const file = path.join(dir, 'checkWorker.js');
  return fs.existsSync(file) ? file : null;
}

export function availableCores(): number {
  return typeof os.availableParallelism === 'function' ? os.availableParallelism() : os.cpus().length;
}

/**
 * How many threads to use: as requested, or by default one per idle core when there are enough files to pay (threads
 * on cores that other work keeps busy only compete with it; the results are the same either way, since the engine's
 * budget is counted in work, not time).
 */
export function chooseThreads(
  files: number,
  requested: number | undefined,
  numerics: boolean,
  cores = availableCores(),
  load = os.loadavg()[0],
): number {
  if (requested !== undefined) return Math.max(1, Math.min(requested, files));
  if (!numerics || files < parallelThreshold) return 1;
  const idle = Math.floor(cores - load + 0.5);
  return Math.max(1, Math.min(idle, files, maxThreads));
}

/** The kernels the safety net stopped, per job index (filled by `runInWorkers`). */
export type StoppedByJob = Map<number, StoppedKernels>;

/** How many times one file is started again after the net stopped one of its kernels, at most. */
const maxRestartsPerJob = 64;

/**
 * Runs the jobs on `threads` workers of `script`, calling `onResult` for each as it arrives. Resolves with the
 * indices of the jobs no worker finished (a worker that failed to start or died), for the caller to run itself.
 *
 * Each worker runs under the safety net (safetyNet.ts): a heap limit, and a watchdog over the kernel it is analysing.
 * When a kernel runs past its time limit, or the worker dies out of memory during a kernel, the worker is replaced
 * and the same file is analysed again with that kernel marked as stopped (the core reports KW406 or KW407 for it and
 * analyses the file's other kernels as usual). `stopped`, when given, receives the kernels stopped per job, so that
 * a caller that analyses a handed-back job itself does not run a stopped kernel again.
 */
export function runInWorkers(
  jobs: readonly CheckJob[],
  threads: number,
  script: string,
  onResult: (result: CheckJobResult) => void,
  stopped: StoppedByJob = new Map(),
): Promise<number[]> {
  return new Promise((resolve) => {
    let next = 0;
    let live = 0;
    /** Jobs to run again (with a stopped kernel), before the next new one. */
    const again: CheckJob[] = [];
    const restarts = new Map<number, number>();
    const finished = new Set<number>();
    const settle = (): void => {
      if (live > 0) return;
      resolve(jobs.map((j) => j.index).filter((i) => !finished.has(i)));
    };
    const take = (): CheckJob | undefined => again.shift() ?? (next < jobs.length ? jobs[next++] : undefined);
    const start = (): void => {
      let worker: Worker;
      try {
        worker = new Worker(script, { workerData: { role: checkWorkerRole }, resourceLimits: workerResourceLimits });
      } catch {
        return;
      }
      live++;
      let current: CheckJob | undefined;
      let done = false;
      const stop = (): void => {
        if (done) return;
        done = true;
        watch.ended();
        live--;
        void worker.terminate();
        settle();
      };
      /** The net stopped the current kernel: replace this worker and run its file again without that kernel. */
      const restart = (hash: string, reason: StopReason): void => {
        const job = current;
        if (done || !job) return;
        done = true;
        watch.ended();
        void worker.terminate();
        const kernels = stopped.get(job.index) ?? new StoppedKernels();
        kernels.add(hash, reason);
        stopped.set(job.index, kernels);
        const count = (restarts.get(job.index) ?? 0) + 1;
        restarts.set(job.index, count);
        if (count > maxRestartsPerJob) {
          finished.add(job.index);
          onResult({ index: job.index, ok: false, message: `the safety net stopped the analysis ${count} times` });
        } else {
          again.unshift({ ...job, stopped: kernels.snapshot() });
        }
        live--;
        start();
        settle();
      };
      const watch = new KernelWatch((kernel, elapsedMs) => restart(kernel.hash, { kind: 'time', elapsedMs }));
      const feed = (): void => {
        current = take();
        if (current) worker.postMessage(current);
        else stop();
      };
      worker.on('message', (message: CheckWorkerMessage) => {
        if (done) return;
        if (isKernelStarted(message)) {
          if (current && message.index === current.index) watch.started(message.name, message.hash, limitFor(current));
          return;
        }
        watch.ended();
        finished.add(message.index);
        onResult(message);
        feed();
      });
      worker.on('error', (error: unknown) => {
        const kernel = watch.current;
        if (!done && kernel && isOutOfMemory(error)) restart(kernel.hash, { kind: 'memory', limitMb: analysisMemoryLimitMb });
        // Any other failure leaves its job unfinished; the others carry on with the rest.
        else stop();
      });
      worker.on('exit', stop);
      feed();
    };
    for (let k = 0; k < Math.min(threads, jobs.length); k++) start();
    settle();
  });
}

/** The watchdog's limit for a kernel of this job, from the job's time budget. */
function limitFor(job: CheckJob): number {
  return kernelTimeLimitMs(job.options.timeBudgetMs ?? defaultAnalysisOptions.timeBudgetMs);
}

/**
 * The kernels of one file that the safety net stops, found by analysing the file once in a worker: for commands
 * that need the analysis in their own thread (export and report use the engine's results beyond the report data),
 * which then analyse the file with these kernels marked as stopped. The price is a second analysis of the file.
 * Empty when there is no worker script (running from the TypeScript sources), without numerics, or when the worker
 * fails for another reason.
 */
export async function stoppedKernelsOf(text: string, options: Partial<AnalysisOptions>): Promise<ReadonlyMap<string, StopReason>> {
  const script = options.numerics === false ? null : workerScript();
  if (!script) return new Map();
  const stopped: StoppedByJob = new Map();
  await runInWorkers([{ index: 0, text, options }], 1, script, () => undefined, stopped);
  return stopped.get(0)?.snapshot() ?? new Map();
}

/** Thrown by `NetAnalyses.need` for an analysis that has not run yet; the caller runs them and tries again. */
export class PendingAnalysis extends Error {
  constructor() {
    super('an analysis is still to run under the safety net');
  }
}

/**
 * Analyses under the safety net for commands whose core loop asks for analyses one at a time and synchronously
 * (`compare` asks for each version's analysis, `fix` re-analyses after every pass). The command runs its loop in
 * attempts: an attempt asks here for each analysis it needs (by text and options); one that has not run yet is
 * remembered, and the attempt either goes on with a stand-in (`peek`, to find every analysis it will need in one
 * attempt) or stops (`need` throws PendingAnalysis). `run` then analyses everything remembered at once, in workers
 * (several when that pays), and the command tries again. Each attempt gets further, since the core is
 * deterministic: an analysis asked for once is answered from then on.
 *
 * Kernels the net stops are remembered across texts by definition hash, so that a kernel that hangs is stopped once,
 * not again in every version of its file that a fix pass produces. Without the worker script (running from the
 * TypeScript sources) the analyses run in this thread, without a watchdog.
 */
export class NetAnalyses {
  private readonly results = new Map<string, CheckJobResult>();
  private readonly missing = new Map<string, { readonly text: string; readonly options: Partial<AnalysisOptions> }>();
  private readonly stopped = new StoppedKernels();

  private static key(text: string, options: Partial<AnalysisOptions>): string {
    return `${JSON.stringify(options)}\0${text}`;
  }

  /** The analysis of `text` with `options`, or null when it has not run yet (it is remembered to run). */
  peek(text: string, options: Partial<AnalysisOptions>): CheckJobResult | null {
    const key = NetAnalyses.key(text, options);
    const result = this.results.get(key);
    if (result) return result;
    this.missing.set(key, { text, options });
    return null;
  }

  /** The analysis of `text` with `options`; throws PendingAnalysis when it has not run yet. */
  need(text: string, options: Partial<AnalysisOptions>): CheckJobResult {
    const result = this.peek(text, options);
    if (!result) throw new PendingAnalysis();
    return result;
  }

  /** Whether an attempt asked for an analysis that has not run yet. */
  get pending(): boolean {
    return this.missing.size > 0;
  }

  /** How many analyses attempts asked for that have not run yet. */
  get pendingCount(): number {
    return this.missing.size;
  }

  /**
   * Runs every analysis asked for and not yet run: in workers under the net, or here without the script. `onDone`
   * is called with each text as its analysis ends (for a progress line).
   */
  async run(requestedThreads?: number, onDone?: (text: string) => void): Promise<void> {
    const wanted = [...this.missing];
    this.missing.clear();
    if (wanted.length === 0) return;
    const earlier = this.stopped.size > 0 ? this.stopped.snapshot() : undefined;
    const jobs: CheckJob[] = wanted.map(([, w], index) => ({ index, text: w.text, options: w.options, ...(earlier ? { stopped: earlier } : {}) }));
    const stoppedByJob: StoppedByJob = new Map();
    if (earlier) {
      for (const job of jobs) {
        const kernels = new StoppedKernels();
        for (const [hash, reason] of earlier) kernels.add(hash, reason);
        stoppedByJob.set(job.index, kernels);
      }
    }
    const done = (r: CheckJobResult): void => {
      this.results.set(wanted[r.index][0], r);
      onDone?.(wanted[r.index][1].text);
    };
    const script = workerScript();
    const leftOver = script
      ? await runInWorkers(jobs, chooseThreads(jobs.length, requestedThreads, true), script, done, stoppedByJob)
      : jobs.map((j) => j.index);
    for (const kernels of stoppedByJob.values()) for (const [hash, reason] of kernels.snapshot()) this.stopped.add(hash, reason);
    for (const index of leftOver) {
      const kernels = stoppedByJob.get(index);
      done(runCheckJob({ ...jobs[index], ...(kernels ? { stopped: kernels.snapshot() } : {}) }));
    }
  }
}
