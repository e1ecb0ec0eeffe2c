/**
 * The language server through stdio, as an editor uses it (the bundled server/dist/server.js, built first):
 *
 * 1. Edits on the examples and on a generated file of 50 kernels, one kernel changed per edit (a new factor each
 *    time, so that kernel is recomputed and the others come from the cache), each edit waited for: time from the
 *    change to the first-stage diagnostics (syntax and names) and to the complete numerical diagnostics.
 * 2. Hover latency on kernel names once the figures are cached.
 * 3. Hover and completion latency while a long numerical analysis runs (the caches cleared, 50 kernels): requests
 *    must not wait behind it.
 * 4. The server's peak memory (VmHWM of the process, worker thread included).
 * 5. The first edits after opening a file and pausing, on fresh servers with and without the worker's idle-time
 *    warm-up, side by side.
 *
 * Targets: first stage p95 < 20 ms; complete numerical diagnostics for the examples p95 < 300 ms; hover < 20 ms once
 * cached; requests during an analysis as fast as without one. Figures are printed, not asserted (the machine may be
 * loaded); the debounce pause (150 ms by default) is part of “change → numerical” and is also shown subtracted.
 */
import { execFileSync } from 'node:child_process';
import { readFileSync, readdirSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { TestClient, find, root } from '../tests/lsp/lspClient';

const debounceMs = 150;

function quantile(xs: number[], q: number): number {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.min(s.length - 1, Math.max(0, Math.ceil(q * s.length) - 1))];
}

function summary(label: string, xs: number[]): string {
  return `${label.padEnd(46)} n=${String(xs.length).padStart(4)}  median ${quantile(xs, 0.5).toFixed(1).padStart(7)} ms  p95 ${quantile(xs, 0.95).toFixed(1).padStart(7)} ms  max ${Math.max(...xs).toFixed(1).padStart(7)} ms`;
}

/** A file of 50 kernels of varied shapes (smooth, kinked, oscillating, separable), with claims. */
export function fiftyKernels(): string {
  const lines = ['# Generated for the benchmark: fifty kernels on one domain.', 'domain [0, 1]', 'const ell = 0.3', 'fn bump(x, w) = exp(-x^2 / w^2)', ''];
  for (let k = 0; k < 50; k++) {
    const c = (1 + k / 10).toFixed(1);
    const body = [
      `exp(-abs(t - s) / (ell * ${c}))`,
      `bump(t - s, ${c} * ell)`,
      `min(t, s) - ${c} * t * s / ${c}`,
      `cos(${c} * (t - s)) * exp(-(t - s)^2)`,
      `1 + ${c} * t * s`,
    ][k % 5];
    lines.push(`kernel k${k}(t, s) = ${body}`, `  expect hermitian, ${k % 5 === 3 ? 'continuous' : 'positive'}`, '');
  }
  return lines.join('\n');
}

/** The text with kernel `name`'s body multiplied by `factor` (written as the last factor of the body). */
function scaleKernel(text: string, name: string, factor: string): string {
  const start = text.indexOf(`kernel ${name}(`);
  const lineEnd = text.indexOf('\n', start);
  const line = text.slice(start, lineEnd === -1 ? undefined : lineEnd);
  const eq = line.indexOf(' = ');
  const on = line.indexOf(' on [');
  const bodyStart = eq > on && on >= 0 ? line.indexOf(' = ', line.indexOf(']', on)) : eq;
  const body = line.slice(bodyStart + 3).replace(/ \* 0\.\d+$/u, '');
  return text.slice(0, start) + line.slice(0, bodyStart + 3) + body + ` * ${factor}` + text.slice(start + line.length);
}

function kernelNames(text: string): string[] {
  return [...text.matchAll(/^kernel ([\p{L}_][\p{L}\p{N}_]*)\(/gmu)].map((m) => m[1]);
}

function peakMemoryMb(pid: number): number | null {
  try {
    const status = readFileSync(`/proc/${pid}/status`, 'utf8');
    const kb = /VmHWM:\s+(\d+) kB/u.exec(status)?.[1];
    return kb ? Number(kb) / 1024 : null;
  } catch {
    return null;
  }
}

interface EditTimes {
  syntax: number[];
  numeric: number[];
  /** The worker's own time for each analysis (the rest of “change → numerical” is the pause, queueing and transport). */
  worker: number[];
}

/** Sends `edits` edits to `uri`, one kernel changed each, waiting for both stages every time. */
async function timeEdits(c: TestClient, uri: string, edits: number, times: EditTimes): Promise<void> {
  let text = c.text(uri);
  const names = kernelNames(text);
  for (let k = 0; k < edits; k++) {
    text = scaleKernel(text, names[k % names.length], `0.${String(9000 + k)}`);
    const sent = performance.now();
    const version = await c.replace(uri, text);
    const first = await c.until(() => c.publicationsAt(uri, version)[0], 60_000, 'first stage');
    times.syntax.push(first.at - sent);
    await c.settled(uri, 120_000);
    const pubs = c.publicationsAt(uri, version);
    times.numeric.push(pubs[pubs.length - 1].at - sent);
    times.worker.push((await c.request<{ elapsedMs: number }>('kernwright/analysisState', { uri })).elapsedMs);
  }
}

async function timeRequests(c: TestClient, uri: string, count: number): Promise<{ hover: number[]; completion: number[] }> {
  const text = c.text(uri);
  const names = kernelNames(text);
  const hover: number[] = [];
  const completion: number[] = [];
  for (let k = 0; k < count; k++) {
    const at = find(text, `kernel ${names[k % names.length]}(`, 8);
    let t = performance.now();
    await c.request('textDocument/hover', { textDocument: { uri }, position: at });
    hover.push(performance.now() - t);
    t = performance.now();
    await c.request('textDocument/completion', { textDocument: { uri }, position: { line: at.line, character: at.character + 12 } });
    completion.push(performance.now() - t);
  }
  return { hover, completion };
}

export async function run(): Promise<void> {
  execFileSync(process.execPath, [path.join(root, 'scripts', 'build.mjs'), 'server.js', 'worker.js'], { cwd: root, stdio: 'inherit' });
  const c = await TestClient.start({ settings: { numerics: { debounceMs } } });
  try {
    // 1. Edits on the examples: 5 files × 24 edits.
    const examples = readdirSync(path.join(root, 'examples')).filter((f) => f.endsWith('.kw')).sort();
    const onExamples: EditTimes = { syntax: [], numeric: [], worker: [] };
    const perFile: string[] = [];
    for (const file of examples) {
      const uri = await c.openFile(`examples/${file}`);
      await c.settled(uri, 120_000);
      const own: EditTimes = { syntax: [], numeric: [], worker: [] };
      await timeEdits(c, uri, 24, own);
      for (const key of ['syntax', 'numeric', 'worker'] as const) onExamples[key].push(...own[key]);
      perFile.push(summary(`  ${file}: worker time per edit`, own.worker));
    }
    const fifty = c.uriOf('bench-fifty.kw');
    await c.open(fifty, fiftyKernels());
    let t = performance.now();
    await c.settled(fifty, 600_000);
    const coldFifty = performance.now() - t;
    const onFifty: EditTimes = { syntax: [], numeric: [], worker: [] };
    await timeEdits(c, fifty, 100, onFifty);

    // 2. Hovers and completions with everything cached.
    const cached = await timeRequests(c, fifty, 100);

    // 3. The same requests while the whole 50-kernel file is recomputed from scratch.
    await c.request('kernwright/reanalyse', {});
    t = performance.now();
    const busy = { hover: [] as number[], completion: [] as number[] };
    let during = 0;
    while ((await c.request<{ pending: boolean }>('kernwright/analysisState', { uri: fifty })).pending) {
      const r = await timeRequests(c, fifty, 5);
      busy.hover.push(...r.hover);
      busy.completion.push(...r.completion);
      during++;
    }
    const recompute = performance.now() - t;

    const peak = peakMemoryMb(c.process.pid!);
    console.log(`examples: ${examples.join(', ')}; debounce ${debounceMs} ms; ${onExamples.syntax.length} + ${onFifty.syntax.length} edits; ` +
      `load average at the end ${os.loadavg().map((x) => x.toFixed(1)).join(' ')} on ${os.cpus().length} cores`);
    console.log(summary('change → first stage (examples)', onExamples.syntax));
    console.log(summary('change → numerical diagnostics (examples)', onExamples.numeric));
    console.log(summary('  … minus the debounce pause', onExamples.numeric.map((x) => x - debounceMs)));
    console.log(summary('  … of which the worker’s analysis', onExamples.worker));
    for (const line of perFile) console.log(line);
    console.log(summary('change → first stage (50 kernels)', onFifty.syntax));
    console.log(summary('change → numerical diagnostics (50 kernels)', onFifty.numeric));
    console.log(summary('  … minus the debounce pause', onFifty.numeric.map((x) => x - debounceMs)));
    console.log(summary('  … of which the worker’s analysis', onFifty.worker));
    console.log(summary('hover, figures cached', cached.hover));
    console.log(summary('completion, figures cached', cached.completion));
    console.log(summary('hover during a full recomputation', busy.hover));
    console.log(summary('completion during a full recomputation', busy.completion));
    console.log(`50-kernel file: first complete analysis ${coldFifty.toFixed(0)} ms; recomputation with cleared caches ${recompute.toFixed(0)} ms (${during} request rounds answered meanwhile)`);
    console.log(`hover during recomputation / hover cached (median ratio): ${(quantile(busy.hover, 0.5) / quantile(cached.hover, 0.5)).toFixed(2)}`);
    console.log(`server peak memory (VmHWM, worker included): ${peak === null ? 'not available' : `${peak.toFixed(0)} MB`}`);
    const verdict = (ok: boolean) => (ok ? 'met' : 'NOT met');
    console.log(`targets: first stage p95 < 20 ms ${verdict(quantile(onExamples.syntax, 0.95) < 20)} (examples), ` +
      `${verdict(quantile(onFifty.syntax, 0.95) < 20)} (50 kernels); ` +
      `numerical (examples) p95 < 300 ms ${verdict(quantile(onExamples.numeric, 0.95) < 300)}; ` +
      `hover cached p95 < 20 ms ${verdict(quantile(cached.hover, 0.95) < 20)}`);
  } finally {
    await c.stop();
  }

  // 4. First edits after opening a file and a pause, on a fresh server with and without the worker's idle-time
  //    warm-up (side by side in this run): the first analyses of each numerical path are the slow ones.
  const pauseMs = 6000;
  const firstEdits: Record<string, number[]> = {};
  for (const [label, env] of [['warm-up on', {}], ['warm-up off', { KERNWRIGHT_NO_WARMUP: '1' }]] as const) {
    const fresh = await TestClient.start({ settings: { numerics: { debounceMs } }, env });
    try {
      const uri = await fresh.openFile('examples/pollen-dispersal.kw');
      await fresh.settled(uri, 120_000);
      await new Promise((r) => setTimeout(r, pauseMs));
      const own: EditTimes = { syntax: [], numeric: [], worker: [] };
      await timeEdits(fresh, uri, 12, own);
      firstEdits[label] = own.worker;
    } finally {
      await fresh.stop();
    }
  }
  const on = firstEdits['warm-up on'];
  const off = firstEdits['warm-up off'];
  console.log(`first 12 edits of pollen-dispersal.kw after opening it and a ${pauseMs / 1000} s pause, fresh server each:`);
  console.log(summary('  worker time per edit, warm-up on', on));
  console.log(summary('  worker time per edit, warm-up off', off));
  console.log(`  warm-up off / on: median ${(quantile(off, 0.5) / quantile(on, 0.5)).toFixed(2)}, max ${(Math.max(...off) / Math.max(...on)).toFixed(2)}`);
}
