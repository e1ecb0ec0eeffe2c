/**
 * The language server's safety net, through the real server over stdio: a kernel that never finishes or that
 * allocates without end (test-only kernels, honoured with KERNWRIGHT_TEST_HOOKS=1) is stopped, reported on its name
 * (KW406 / KW407), and every other kernel and document is still analysed; the next edit skips the stopped kernel
 * instead of stalling the worker again. A didChange without a usable version is ignored with a logged error.
 */
import { readFileSync } from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildBundles } from './build';
import { TestClient, find } from './lspClient';

let c: TestClient;
beforeAll(async () => {
  buildBundles();
  c = await TestClient.start({ env: { KERNWRIGHT_TEST_HOOKS: '1', KERNWRIGHT_KERNEL_TIME_LIMIT_MS: '1500', KERNWRIGHT_NO_WARMUP: '1' } });
});
afterAll(async () => {
  await c?.stop();
});

interface Reported {
  name: string;
  spectrum: { eigenvalues: { re: number; im: number; error: number }[] } | null;
}

async function kernels(uri: string, client = c): Promise<Reported[]> {
  const data = await client.request<{ kernels: { report: Reported }[] } | null>('kernwright/kernelData', { uri });
  return (data?.kernels ?? []).map((k) => k.report);
}

/** The leading eigenvalue of `name` in `uri`, or null when it has no spectrum. */
async function leading(uri: string, name: string, client = c): Promise<number | null> {
  const k = (await kernels(uri, client)).find((r) => r.name === name);
  return k?.spectrum?.eigenvalues[0]?.re ?? null;
}

type Diag = { code?: unknown; message: unknown; range: { start: { line: number; character: number } } };
const withCode = (ds: Diag[], code: string) => ds.filter((d) => String(d.code) === code);

/** Restarts caused by a stopped kernel, as logged (window/logMessage). */
const stopLogs = () => c.logs.filter((l) => l.includes('was stopped; the analysis worker was restarted'));
/** Pop-up notices about the worker. */
const notices = () => c.messages.filter((m) => m.message.includes('analysis worker'));

async function stillAlive(client = c): Promise<void> {
  const uri = client.uriOf(`alive-${Math.random().toString(36).slice(2)}.kw`);
  const text = 'domain [0, 1]\nconst a = 2\nkernel k(t, s) = a * min(t, s)\n';
  await client.open(uri, text);
  const hover = await client.request<{ contents: { value: string } } | null>('textDocument/hover', { textDocument: { uri }, position: { line: 1, character: 6 } });
  expect(hover?.contents.value).toContain('const a = 2');
  await client.close(uri);
}

// The Green's function of −u'' on [0, 1] with u(0) = u(1) = 0: eigenvalues 1/(n²π²), the largest 1/π² ≈ 0.10132
// (common practice; e.g. Courant & Hilbert, Methods of Mathematical Physics I, 1953, ch. V §15).
const green = 'kernel good(t, s) = min(t, s) - t*s\n';
const greenTop = 1 / Math.PI ** 2;

describe('a kernel that never finishes', () => {
  it('is stopped and reported; the file’s other kernels and the other open documents are analysed', async () => {
    const stuck = c.uriOf('stuck.kw');
    const text = `domain [0, 1]\n${green}kernel hang_for_test(t, s) = t*s\nkernel after(t, s) = 2*t*s\n`;
    // Rank one: 2·t·s has the single eigenvalue 2∫₀¹ t² dt = 2/3 (common practice). (A kernel with the very
    // definition of hang_for_test would share its hash, and its fate.)
    await c.open(stuck, text);
    const other = c.uriOf('waiting.kw');
    await c.open(other, `domain [0, 1]\n${green}`);

    const diagnostics = await c.settled(stuck, 60_000) as Diag[];
    const stopped = withCode(diagnostics, 'KW406');
    expect(stopped).toHaveLength(1);
    expect(String(stopped[0].message)).toContain('hang_for_test');
    expect(stopped[0].range.start).toEqual(find(text, 'hang_for_test'));
    expect(await leading(stuck, 'good')).toBeCloseTo(greenTop, 6);
    expect(await leading(stuck, 'after')).toBeCloseTo(2 / 3, 8);
    expect(await leading(stuck, 'hang_for_test')).toBeNull();

    await c.settled(other, 60_000);
    expect(await leading(other, 'good')).toBeCloseTo(greenTop, 6);

    expect(stopLogs()).toHaveLength(1);
    expect(stopLogs()[0]).toContain('hang_for_test');
    expect(notices()).toHaveLength(0);
  }, 120_000);

  it('is skipped on the next edit instead of stalling the worker again, and retried once its definition changes', async () => {
    const stuck = c.uriOf('stuck.kw');
    const edited = `${c.text(stuck)}# an edit elsewhere\n`;
    await c.replace(stuck, edited);
    const again = await c.settled(stuck, 60_000) as Diag[];
    expect(withCode(again, 'KW406')).toHaveLength(1);
    expect(await leading(stuck, 'good')).toBeCloseTo(greenTop, 6);
    expect(stopLogs()).toHaveLength(1);

    // A new definition is a new kernel: it is analysed (and here stopped) again.
    await c.replace(stuck, edited.replace('hang_for_test(t, s) = t*s', 'hang_for_test(t, s) = t*s + 1'));
    const retried = await c.settled(stuck, 60_000) as Diag[];
    expect(withCode(retried, 'KW406')).toHaveLength(1);
    expect(stopLogs()).toHaveLength(2);
    await c.close(stuck);
    await c.close(c.uriOf('waiting.kw'));
    await stillAlive();
  }, 120_000);
});

describe('a kernel that allocates without end', () => {
  // A server of its own, with a time limit long enough that the heap limit, not the watchdog, stops the kernel;
  // its peak memory is then that of this one case.
  let m: TestClient;
  beforeAll(async () => {
    m = await TestClient.start({ env: { KERNWRIGHT_TEST_HOOKS: '1', KERNWRIGHT_KERNEL_TIME_LIMIT_MS: '120000', KERNWRIGHT_NO_WARMUP: '1' } });
  });
  afterAll(async () => {
    await m?.stop();
  });

  it('is stopped by the worker’s memory limit and reported; the server stays alive and answers', async () => {
    const pid = m.process.pid!;
    const rssMb = (field: 'VmRSS' | 'VmHWM') => {
      const found = new RegExp(`${field}:\\s+(\\d+) kB`).exec(readFileSync(`/proc/${pid}/status`, 'utf8'));
      return found ? Number(found[1]) / 1024 : 0;
    };
    let peak = rssMb('VmRSS');
    const sampler = setInterval(() => (peak = Math.max(peak, rssMb('VmRSS'))), 20);
    try {
      const uri = m.uriOf('greedy.kw');
      const text = `domain [0, 1]\n${green}kernel grow_for_test(t, s) = t + s\n`;
      await m.open(uri, text);
      const diagnostics = await m.settled(uri, 90_000) as Diag[];
      const stopped = withCode(diagnostics, 'KW407');
      expect(stopped).toHaveLength(1);
      expect(String(stopped[0].message)).toContain('grow_for_test');
      expect(stopped[0].range.start).toEqual(find(text, 'grow_for_test'));
      expect(await leading(uri, 'good', m)).toBeCloseTo(greenTop, 6);
      await stillAlive(m);
      expect(m.exited).toBe(false);
      expect(m.logs.filter((l) => l.includes('memory limit and was stopped; the analysis worker was restarted'))).toHaveLength(1);
      expect(m.messages.filter((n) => n.message.includes('analysis worker'))).toHaveLength(0);
    } finally {
      clearInterval(sampler);
    }
    const hwm = rssMb('VmHWM');
    console.log(`server peak resident memory: ${Math.round(Math.max(peak, hwm))} MB (VmHWM ${Math.round(hwm)} MB, polled VmRSS ${Math.round(peak)} MB)`);
    // The worker's heap limit is 1024 MB; the process as a whole (main thread, code, buffers) stays well under 2 GB.
    expect(hwm).toBeLessThan(2048);
  }, 120_000);
});

describe('didChange without a usable version', () => {
  it('is ignored with a logged error; the document keeps its text and version', async () => {
    const uri = c.uriOf('versionless.kw');
    const text = 'domain [0, 1]\nconst a = 2\nkernel k(t, s) = a * min(t, s)\n';
    await c.open(uri, text);
    await c.settled(uri, 60_000);
    const before = c.logs.length;
    const bad: unknown[] = [
      { textDocument: { uri }, contentChanges: [{ text: 'kernel broken(' }] },
      { textDocument: { uri, version: null }, contentChanges: [{ text: 'kernel broken(' }] },
      { textDocument: { uri, version: 2.5 }, contentChanges: [{ text: 'kernel broken(' }] },
      { textDocument: { uri, version: '3' }, contentChanges: [{ text: 'kernel broken(' }] },
      { textDocument: { uri, version: 4 } },
      null,
    ];
    for (const params of bad) await c.connection.sendNotification('textDocument/didChange', params);
    await c.until(() => c.logs.slice(before).filter((l) => l.includes('ignored a change')).length >= bad.length, 30_000, 'logged errors');
    const logged = c.logs.slice(before).filter((l) => l.includes('ignored a change'));
    expect(logged[0]).toContain(uri);
    expect(logged[0]).toContain('version');
    expect(c.logs.slice(before).some((l) => /handler|Unhandled|without valid version/i.test(l))).toBe(false);

    const state = await c.request<{ version: number; pending: boolean } | null>('kernwright/analysisState', { uri });
    expect(state?.version).toBe(1);
    const hover = await c.request<{ contents: { value: string } } | null>('textDocument/hover', { textDocument: { uri }, position: { line: 1, character: 6 } });
    expect(hover?.contents.value).toContain('const a = 2');

    // A proper change afterwards applies as usual.
    await c.replace(uri, text.replace('a = 2', 'a = 3'));
    await c.settled(uri, 60_000);
    const after = await c.request<{ contents: { value: string } } | null>('textDocument/hover', { textDocument: { uri }, position: { line: 1, character: 6 } });
    expect(after?.contents.value).toContain('const a = 3');
    await c.close(uri);
  }, 60_000);
});
