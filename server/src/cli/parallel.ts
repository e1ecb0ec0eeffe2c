/**
 * Checking many files on several cores: a small pool of worker threads (checkWorker.ts, bundled next to the
 * program as checkWorker.js), each analysing one file at a time and taking the next when done. Results arrive in
 * any order; the caller puts them back in file order, so the report is the same as a sequential run's.
 *
 * Parallel work pays only when there are several files to analyse numerically (a worker costs tens of
 * milliseconds to start). When the worker script is missing (running from the TypeScript sources) or a worker
 * fails, the files it did not finish are handed back for the caller to analyse in its own thread.
 */
import * as fs from 'node:fs';
import * as os from 'node:os';
import * as path from 'node:path';
import { Worker } from 'node:worker_threads';
import { checkWorkerRole, type CheckJob, type CheckJobResult } from './checkWorker';

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

/**
 * Runs the jobs on `threads` workers of `script`, calling `onResult` for each as it arrives. Resolves with the
 * indices of the jobs no worker finished (a worker that failed to start or died), for the caller to run itself.
 */
export function runInWorkers(
  jobs: readonly CheckJob[],
  threads: number,
  script: string,
  onResult: (result: CheckJobResult) => void,
): Promise<number[]> {
  return new Promise((resolve) => {
    let next = 0;
    let live = 0;
    const finished = new Set<number>();
    const settle = (): void => {
      if (live > 0) return;
      resolve(jobs.map((j) => j.index).filter((i) => !finished.has(i)));
    };
    const start = (): void => {
      let worker: Worker;
      try {
        worker = new Worker(script, { workerData: { role: checkWorkerRole } });
      } catch {
        return;
      }
      live++;
      let current: CheckJob | undefined;
      let done = false;
      const stop = (): void => {
        if (done) return;
        done = true;
        live--;
        void worker.terminate();
        settle();
      };
      const feed = (): void => {
        current = next < jobs.length ? jobs[next++] : undefined;
        if (current) worker.postMessage(current);
        else stop();
      };
      worker.on('message', (result: CheckJobResult) => {
        finished.add(result.index);
        onResult(result);
        feed();
      });
      // A worker that fails leaves its job unfinished; the others carry on with the rest.
      worker.on('error', stop);
      worker.on('exit', stop);
      feed();
    };
    for (let k = 0; k < Math.min(threads, jobs.length); k++) start();
    settle();
  });
}
