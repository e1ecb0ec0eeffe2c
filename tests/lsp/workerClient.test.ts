/**
 * The worker client's safety net with a stand-in worker (fakeAnalysisWorker.mjs): a kernel stuck past its time
 * limit is stopped, the worker replaced and the job run again with that kernel skipped; deaths a kernel explains
 * do not count toward "a job that kills two workers fails", other deaths do; a cancelled job on a stuck worker is
 * dropped; the stopped set goes with every later job until the cache is cleared.
 */
import path from 'node:path';
import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import { WorkerClient, type JobOutcome, type StoppedKernel } from '../../server/src/lsp/workerClient';

const script = path.join(__dirname, 'fakeAnalysisWorker.mjs');
let saved: string | undefined;
beforeAll(() => {
  saved = process.env.KERNWRIGHT_KERNEL_TIME_LIMIT_MS;
  process.env.KERNWRIGHT_KERNEL_TIME_LIMIT_MS = '300';
});
afterAll(() => {
  if (saved === undefined) delete process.env.KERNWRIGHT_KERNEL_TIME_LIMIT_MS;
  else process.env.KERNWRIGHT_KERNEL_TIME_LIMIT_MS = saved;
});

let clients: WorkerClient[] = [];
afterEach(() => {
  for (const c of clients) c.dispose();
  clients = [];
});

function client(): { worker: WorkerClient; restarts: { reason: string; stopped?: StoppedKernel }[] } {
  const restarts: { reason: string; stopped?: StoppedKernel }[] = [];
  const worker = new WorkerClient({ script, onRestart: (reason, stopped) => restarts.push({ reason, stopped }) });
  clients.push(worker);
  return { worker, restarts };
}

const lines = (o: JobOutcome) => (o.kind === 'done' ? o.diagnostics as unknown as string[] : o.kind);

describe('worker client safety net', () => {
  it('stops a stuck kernel, runs the job again without it, and keeps the other kernels', async () => {
    const { worker, restarts } = client();
    const outcome = await worker.analyze('kernel a h1\nkernel hang h2\nkernel b h3', {}).outcome;
    expect(lines(outcome)).toEqual(['analysed a', 'analysed b', 'stopped hang:time']);
    expect(restarts).toHaveLength(1);
    expect(restarts[0].stopped?.name).toBe('hang');
    expect(restarts[0].stopped?.reason.kind).toBe('time');
  });

  it('does not count deaths a kernel explains: a job with two stuck kernels still finishes', async () => {
    const { worker, restarts } = client();
    const outcome = await worker.analyze('kernel hang h1\nkernel ok h2\nkernel hang h3', {}).outcome;
    expect(lines(outcome)).toEqual(['analysed ok', 'stopped hang:time', 'stopped hang:time']);
    expect(worker.restartCount).toBe(2);
    expect(restarts.every((r) => r.stopped)).toBe(true);
  });

  it('fails a job that kills two workers for no reason a kernel explains', async () => {
    const { worker, restarts } = client();
    const outcome = await worker.analyze('kernel exit h1', {}).outcome;
    expect(outcome.kind).toBe('failed');
    expect(restarts).toHaveLength(2);
    expect(restarts.some((r) => r.stopped)).toBe(false);
  });

  it('runs the jobs queued behind a stuck one, drops a cancelled stuck job, and skips the kernel in later jobs', async () => {
    const { worker, restarts } = client();
    // Were the cancelled job run again, its second kernel would end the new worker (a second restart).
    const stuck = worker.analyze('kernel hang h9\nkernel exit h7', {});
    const queued = worker.analyze('kernel c h4', {});
    stuck.cancel();
    expect(await stuck.outcome).toEqual({ kind: 'cancelled' });
    expect(lines(await queued.outcome)).toEqual(['analysed c']);
    expect(restarts).toHaveLength(1);
    // The same definition in a later job is skipped at once, without another restart.
    expect(lines(await worker.analyze('kernel hang h9\nkernel d h5', {}).outcome)).toEqual(['analysed d', 'stopped hang:time']);
    expect(restarts).toHaveLength(1);
    // Clearing the cache forgets it: it is tried (and stopped) again.
    worker.clearCache();
    expect(lines(await worker.analyze('kernel hang h9', {}).outcome)).toEqual(['stopped hang:time']);
    expect(restarts).toHaveLength(2);
  });
});
