/**
 * The main thread's side of the analysis worker: submits jobs, cancels them through a shared flag, and keeps the
 * worker alive. When the worker dies, a new one is started at once and the jobs it held are submitted again (once;
 * a job that kills two workers fails). The owner is told of every restart and decides what to show the user.
 */
import { Worker } from 'node:worker_threads';
import type { AnalysisOptions, Diagnostic, KernelReport } from '@kernwright/core';
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
  attempts: number;
}

export interface WorkerClientOptions {
  /** Path of the bundled worker script. */
  readonly script: string;
  /** Called after the worker died and was replaced. */
  readonly onRestart?: (reason: string) => void;
}

export class WorkerClient {
  private worker: Worker | null = null;
  private readonly pending = new Map<number, PendingJob>();
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
    const job: PendingJob = { id: this.nextId++, text, options, cancelBuffer, resolve, attempts: 0 };
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

  clearCache(): void {
    this.post({ type: 'clear-cache' });
  }

  /** Test hook: makes the worker exit (honoured only with KERNWRIGHT_LSP_TEST_HOOKS=1 in the environment). */
  crashForTest(): void {
    this.post({ type: 'crash-for-test' });
  }

  dispose(): void {
    this.disposed = true;
    for (const job of this.pending.values()) job.resolve({ kind: 'cancelled' });
    this.pending.clear();
    void this.worker?.terminate();
    this.worker = null;
  }

  private send(job: PendingJob): void {
    job.attempts++;
    this.post({ type: 'analyze', id: job.id, text: job.text, options: job.options, cancel: job.cancelBuffer });
  }

  private post(message: ToWorker): void {
    if (this.disposed) return;
    this.ensureWorker().postMessage(message);
  }

  private ensureWorker(): Worker {
    if (this.worker) return this.worker;
    const worker = new Worker(this.options.script);
    worker.on('message', (m: FromWorker) => this.receive(m));
    worker.on('error', (error) => this.died(worker, error.message));
    worker.on('exit', (code) => this.died(worker, `exit code ${code}`));
    worker.unref();
    this.worker = worker;
    return worker;
  }

  private receive(m: FromWorker): void {
    if (m.type === 'ready') return;
    const job = this.pending.get(m.id);
    if (!job) return; // cancelled meanwhile
    this.pending.delete(m.id);
    if (m.type === 'done') job.resolve({ kind: 'done', diagnostics: m.diagnostics, kernels: m.kernels, elapsedMs: m.elapsedMs });
    else if (m.type === 'cancelled') job.resolve({ kind: 'cancelled' });
    else job.resolve({ kind: 'failed', message: m.message });
  }

  private died(worker: Worker, reason: string): void {
    if (this.worker !== worker || this.disposed) return; // an old worker, already replaced, or shutting down
    this.worker = null;
    this.restarts++;
    const jobs = [...this.pending.values()];
    for (const job of jobs) {
      if (job.attempts >= 2) {
        this.pending.delete(job.id);
        job.resolve({ kind: 'failed', message: `the analysis worker stopped twice on this file (${reason})` });
      }
    }
    this.options.onRestart?.(reason);
    for (const job of this.pending.values()) this.send(job);
  }
}
