/**
 * The main thread's side of the analysis worker: submits jobs, cancels them through a shared flag, and keeps the
 * worker alive. The worker runs under a heap limit and reports the start of every kernel; a watchdog stops a worker
 * whose current kernel runs far past its budget. When the worker dies, a new one is started at once and the jobs it
 * held are submitted again. A death that a kernel explains (the watchdog fired, or the heap ran out during that
 * kernel) marks the kernel as stopped, so the next attempt skips it and the core reports it (KW406/KW407); such
 * deaths always make progress and are not counted. Any other death is counted: a job that kills two workers fails.
 * The owner is told of every restart and decides what to show the user.
 */
import { Worker } from 'node:worker_threads';
import { defaultAnalysisOptions, type AnalysisOptions, type Diagnostic, type KernelReport, type StopReason } from '@kernwright/core';
import {
  analysisMemoryLimitMb,
  isOutOfMemory,
  kernelTimeLimitMs,
  KernelWatch,
  StoppedKernels,
  workerResourceLimits,
  type WatchedKernel,
} from '../safetyNet';
import type { FromWorker, ToWorker } from './workerProtocol';

export type JobOutcome =
  | { readonly kind: 'done'; readonly diagnostics: readonly Diagnostic[]; readonly kernels: readonly KernelReport[]; readonly elapsedMs: number }
  | { readonly kind: 'cancelled' }
  | { readonly kind: 'failed'; readonly message: string };

export interface JobHandle {
  readonly outcome: Promise<JobOutcome>;
  cancel(): void;
}

interface PendingJob {
  readonly id: number;
  readonly text: string;
  readonly options: Partial<AnalysisOptions>;
  readonly cancelBuffer: SharedArrayBuffer;
  readonly resolve: (o: JobOutcome) => void;
  /** Worker deaths while this job was held that no kernel explains; the second one fails the job. */
  deaths: number;
}

/** The kernel whose analysis a restart abandoned, when a kernel explains it. */
export interface StoppedKernel {
  readonly name: string;
  readonly reason: StopReason;
}

export interface WorkerClientOptions {
  /** Path of the bundled worker script. */
  readonly script: string;
  /** Called after the worker died (or was stopped) and was replaced; `stopped` names the kernel that caused it. */
  readonly onRestart?: (reason: string, stopped?: StoppedKernel) => void;
}

/** One running worker, its watchdog, and the jobs posted to it and not answered yet (cancelled ones included). */
interface Running {
  readonly worker: Worker;
  readonly watch: KernelWatch;
  readonly posted: Map<number, PendingJob>;
  /** The job whose kernel the watch times. */
  watchedJob: number | null;
}

export class WorkerClient {
  private running: Running | null = null;
  private readonly pending = new Map<number, PendingJob>();
  private readonly stopped = new StoppedKernels();
  private nextId = 1;
  private disposed = false;
  private restarts = 0;

  constructor(private readonly options: WorkerClientOptions) {}

  /** How often the worker had to be replaced. */
  get restartCount(): number {
    return this.restarts;
  }

  analyze(text: string, options: Partial<AnalysisOptions>): JobHandle {
    const cancelBuffer = new SharedArrayBuffer(4);
    const flag = new Int32Array(cancelBuffer);
    let resolve!: (o: JobOutcome) => void;
    const outcome = new Promise<JobOutcome>((r) => (resolve = r));
    const job: PendingJob = { id: this.nextId++, text, options, cancelBuffer, resolve, deaths: 0 };
    this.pending.set(job.id, job);
    this.send(job);
    return {
      outcome,
      cancel: () => {
        Atomics.store(flag, 0, 1);
        if (this.pending.delete(job.id)) resolve({ kind: 'cancelled' });
      },
    };
  }

  /** Starts the worker now rather than at the first job (it then loads while the user opens files). */
  start(): void {
    if (!this.disposed) this.ensureWorker();
  }

  /** Drops the worker's kernel cache and the record of stopped kernels (they are tried again). */
  clearCache(): void {
    this.forgetStopped();
    this.post({ type: 'clear-cache' });
  }

  /** Tries every stopped kernel again on its next analysis (e.g. after the settings changed its budget). */
  forgetStopped(): void {
    this.stopped.clear();
  }

  /** Test hook: makes the worker exit (honoured only with KERNWRIGHT_LSP_TEST_HOOKS=1 in the environment). */
  crashForTest(): void {
    this.post({ type: 'crash-for-test' });
  }

  dispose(): void {
    this.disposed = true;
    for (const job of this.pending.values()) job.resolve({ kind: 'cancelled' });
    this.pending.clear();
    const running = this.running;
    this.running = null;
    running?.watch.ended();
    void running?.worker.terminate();
  }

  private send(job: PendingJob): void {
    if (this.disposed) return;
    const running = this.ensureWorker();
    running.posted.set(job.id, job);
    running.worker.postMessage({
      type: 'analyze', id: job.id, text: job.text, options: job.options, cancel: job.cancelBuffer, stopped: this.stopped.snapshot(),
    } satisfies ToWorker);
  }

  private post(message: ToWorker): void {
    if (this.disposed) return;
    this.ensureWorker().worker.postMessage(message);
  }

  private ensureWorker(): Running {
    if (this.running) return this.running;
    const worker = new Worker(this.options.script, { resourceLimits: workerResourceLimits });
    const running: Running = {
      worker,
      watch: new KernelWatch((kernel, elapsedMs) => this.kernelStuck(running, kernel, elapsedMs)),
      posted: new Map(),
      watchedJob: null,
    };
    worker.on('message', (m: FromWorker) => {
      if (this.running === running) this.receive(running, m);
    });
    worker.on('error', (error) => this.died(running, error.message, error));
    worker.on('exit', (code) => this.died(running, `exit code ${code}`));
    worker.unref();
    this.running = running;
    return running;
  }

  private receive(running: Running, m: FromWorker): void {
    if (m.type === 'ready') return;
    if (m.type === 'kernel') {
      const budget = running.posted.get(m.id)?.options.timeBudgetMs ?? defaultAnalysisOptions.timeBudgetMs;
      running.watchedJob = m.id;
      running.watch.started(m.name, m.hash, kernelTimeLimitMs(budget));
      return;
    }
    running.posted.delete(m.id);
    if (running.watchedJob === m.id) {
      running.watch.ended();
      running.watchedJob = null;
    }
    const job = this.pending.get(m.id);
    if (!job) return; // cancelled meanwhile
    this.pending.delete(m.id);
    if (m.type === 'done') job.resolve({ kind: 'done', diagnostics: m.diagnostics, kernels: m.kernels, elapsedMs: m.elapsedMs });
    else if (m.type === 'cancelled') job.resolve({ kind: 'cancelled' });
    else job.resolve({ kind: 'failed', message: m.message });
  }

  /** The watchdog fired: the worker is stuck in one kernel. */
  private kernelStuck(running: Running, kernel: WatchedKernel, elapsedMs: number): void {
    if (this.running !== running || this.disposed) return;
    const reason: StopReason = { kind: 'time', elapsedMs };
    this.stopped.add(kernel.hash, reason);
    this.replace(running, `the analysis of kernel “${kernel.name}” ran ${(elapsedMs / 1000).toFixed(1)} s and was stopped`, { name: kernel.name, reason });
    void running.worker.terminate();
  }

  private died(running: Running, reason: string, error?: unknown): void {
    if (this.running !== running || this.disposed) return; // an old worker, already replaced, or shutting down
    const kernel = running.watch.current;
    if (kernel && error !== undefined && isOutOfMemory(error)) {
      const stop: StopReason = { kind: 'memory', limitMb: analysisMemoryLimitMb };
      this.stopped.add(kernel.hash, stop);
      this.replace(running, `the analysis of kernel “${kernel.name}” needed more than the ${analysisMemoryLimitMb} MB memory limit and was stopped`, { name: kernel.name, reason: stop });
      return;
    }
    this.replace(running, reason);
  }

  /**
   * Replaces a dead or stuck worker and submits its pending jobs again (jobs cancelled meanwhile are dropped). A
   * death no kernel explains counts against every job it held.
   */
  private replace(running: Running, reason: string, stopped?: StoppedKernel): void {
    running.watch.ended();
    this.running = null;
    this.restarts++;
    if (!stopped) {
      for (const job of [...this.pending.values()]) {
        if (++job.deaths >= 2) {
          this.pending.delete(job.id);
          job.resolve({ kind: 'failed', message: `the analysis worker stopped twice on this file (${reason})` });
        }
      }
    }
    this.options.onRestart?.(reason, stopped);
    this.ensureWorker();
    for (const job of this.pending.values()) this.send(job);
  }
}
