/**
 * The safety net shared by the language server and the command line: the analysis runs in a worker thread with a
 * fixed memory limit, the worker reports the start of every kernel, and a watchdog on the main thread stops a
 * worker whose current kernel runs far past its budget. The engine bounds every loop and counts its budget in work,
 * so the net is for faults that slip through those limits; when it fires, the front end restarts the worker and
 * runs the file again with that kernel marked as stopped (the core then reports KW406 or KW407 for it).
 */
import * as os from 'node:os';
import type { StopReason } from '@kernwright/core';

/**
 * Memory limit of an analysis worker's JavaScript heap, in MB: room for the largest discretisation (a few hundred
 * MB at the resolution cap) on a developer machine with a few GB, and far below what would make it swap.
 */
export const analysisMemoryLimitMb = 1024;

/** Node's `resourceLimits` for an analysis worker. */
export const workerResourceLimits = {
  maxOldGenerationSizeMb: analysisMemoryLimitMb,
  maxYoungGenerationSizeMb: 64,
} as const;

/**
 * How long one kernel may take (wall clock, from its start) before the watchdog stops it: well beyond the engine's
 * own wall-clock net (4·budget + 1 s), so that only a kernel that is really stuck is stopped, and stretched by the
 * machine's load (runnable threads per core, up to 8×), since a kernel on an overloaded machine gets only a share of
 * a core. KERNWRIGHT_KERNEL_TIME_LIMIT_MS overrides it exactly (tests of the net use a short limit).
 */
export function kernelTimeLimitMs(
  budgetMs: number,
  env: NodeJS.ProcessEnv = process.env,
  load: number = os.loadavg()[0],
  cores: number = typeof os.availableParallelism === 'function' ? os.availableParallelism() : os.cpus().length,
): number {
  const override = Number(env.KERNWRIGHT_KERNEL_TIME_LIMIT_MS);
  if (Number.isFinite(override) && override > 0) return override;
  const stretch = Math.max(1, Math.min(8, load / Math.max(1, cores)));
  return (5000 + 4 * (4 * budgetMs + 1000)) * stretch;
}

/** Whether a worker's 'error' event says it ran out of its heap limit. */
export function isOutOfMemory(error: unknown): boolean {
  return typeof error === 'object' && error !== null && (error as { code?: unknown }).code === 'ERR_WORKER_OUT_OF_MEMORY';
}

export interface WatchedKernel {
  readonly name: string;
  readonly hash: string;
  readonly startedAt: number;
}

/**
 * Watches the kernel a worker is analysing: `started` at each kernel (it restarts the clock), `ended` when the job
 * finishes. `onExpire` runs once when a kernel passes its limit; the owner then terminates the worker.
 */
export class KernelWatch {
  private timer: ReturnType<typeof setTimeout> | null = null;
  private kernel: WatchedKernel | null = null;

  constructor(private readonly onExpire: (kernel: WatchedKernel, elapsedMs: number) => void) {}

  /** The kernel under analysis, or null between kernels' jobs. */
  get current(): WatchedKernel | null {
    return this.kernel;
  }

  started(name: string, hash: string, limitMs: number): void {
    this.clear();
    const kernel = { name, hash, startedAt: performance.now() };
    this.kernel = kernel;
    this.timer = setTimeout(() => {
      this.timer = null;
      if (this.kernel === kernel) this.onExpire(kernel, performance.now() - kernel.startedAt);
    }, limitMs);
  }

  ended(): void {
    this.clear();
    this.kernel = null;
  }

  private clear(): void {
    if (this.timer) clearTimeout(this.timer);
    this.timer = null;
  }
}

/** Most kernels a front end remembers as stopped (oldest forgotten first), so the set stays bounded. */
export const stoppedMemory = 256;

/** Remembers stopped kernels by definition hash, bounded, oldest first out. */
export class StoppedKernels {
  private readonly map = new Map<string, StopReason>();

  add(hash: string, reason: StopReason): void {
    this.map.delete(hash);
    this.map.set(hash, reason);
    if (this.map.size > stoppedMemory) this.map.delete(this.map.keys().next().value as string);
  }

  /** A copy, structured-clone safe, for a job message. */
  snapshot(): Map<string, StopReason> {
    return new Map(this.map);
  }

  clear(): void {
    this.map.clear();
  }

  get size(): number {
    return this.map.size;
  }
}

/**
 * Test hooks inside a worker, honoured only when KERNWRIGHT_TEST_HOOKS=1 (or the older KERNWRIGHT_LSP_TEST_HOOKS=1):
 * a kernel named `hang_for_test` never finishes, and one named `grow_for_test` allocates until the heap limit stops
 * it. They stand for the faults the net exists for, which the engine itself must never have.
 */
export function runKernelTestHook(name: string, env: NodeJS.ProcessEnv = process.env): void {
  if (env.KERNWRIGHT_TEST_HOOKS !== '1' && env.KERNWRIGHT_LSP_TEST_HOOKS !== '1') return;
  if (name === 'hang_for_test') {
    for (;;) {
      // spins until the watchdog terminates the worker
    }
  }
  if (name === 'grow_for_test') {
    const keep: number[][] = [];
    for (;;) keep.push(new Array<number>(1 << 20).fill(keep.length + 0.5));
  }
}
