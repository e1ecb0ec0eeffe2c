/**
 * `kernwright check` for CI: the SARIF report of the built program validated against the SARIF 2.1.0 schema; a
 * parallel check of a tree that reports exactly what a sequential one reports; colour only on a terminal and never
 * with NO_COLOR; a progress line only when stderr is a terminal.
 */
import { spawnSync } from 'node:child_process';
import * as fs from 'node:fs';
import * as os from 'node:os';
import * as path from 'node:path';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { runCli } from '../../server/src/cli/run';
import { chooseThreads, runInWorkers } from '../../server/src/cli/parallel';
import { runCheckJob, type CheckJobResult } from '../../server/src/cli/checkWorker';
import type { CliIo } from '../../server/src/cli/io';
import { bundleCli, writeTree, type Harness, type Run } from './cliHarness';
import { expectValidSarif } from './sarifSchema';

vi.setConfig({ testTimeout: 600_000 });

let h: Harness;
let work = '';
const budget = ['--time-budget', '60000'];
const header = '# Invented test scenario; the values mean nothing beyond this test.\n';
// Smooth kernels reach the accuracy target long before the time budget, so every run computes the same figures.
const smooth = (k: number) => `${header}domain [0, 1]\nkernel g${k}(t, s) = exp(-(t - s)^2 / ${0.2 + 0.1 * k})\n  expect hermitian, positive, continuous\n`;
const typo = `${header}domain [0, 1]\nconst width = 0.3\nkernel k(t, s) = exp(-(t - s)^2 / widht)\n`;
const warn = `${header}domain [0, 1]\ndomain [0, 2]\nkernel w(t, s) = t * s\n  expect hermitian, positive, continuous\n`;

function kw(...args: string[]): Run {
  return h.run(work, [...args, ...budget]);
}

beforeAll(async () => {
  h = await bundleCli();
  work = fs.mkdtempSync(path.join(os.tmpdir(), 'kw-check-'));
  const files: Record<string, string> = { 'tree/sub dir/typo.kw': typo, 'tree/warn.kw': warn };
  for (let k = 0; k < 6; k++) files[`tree/${k % 2 ? 'b' : 'a'}/g${k}.kw`] = smooth(k);
  writeTree(work, files);
}, 300_000);

afterAll(() => {
  h?.dispose();
  if (work) fs.rmSync(work, { recursive: true, force: true });
});

describe('check --format sarif', () => {
  it('prints a valid SARIF 2.1.0 log with relative URIs and the usual exit codes', () => {
    const r = kw('check', '--format', 'sarif', 'tree');
    expect(r.status).toBe(1);
    expect(r.stderr).toBe('');
    const log = JSON.parse(r.stdout);
    expectValidSarif(log);
    const uris = log.runs[0].artifacts.map((a: { location: { uri: string } }) => a.location.uri);
    expect(uris).toEqual(['tree/a/g0.kw', 'tree/a/g2.kw', 'tree/a/g4.kw', 'tree/b/g1.kw', 'tree/b/g3.kw', 'tree/b/g5.kw', 'tree/sub%20dir/typo.kw', 'tree/warn.kw']);
    const typoResult = log.runs[0].results.find((x: { ruleId: string }) => x.ruleId === 'KW201');
    const line = typo.split('\n').findIndex((l) => l.includes('widht'));
    expect(typoResult.locations[0].physicalLocation.region).toMatchObject({ startLine: line + 1, startColumn: typo.split('\n')[line].indexOf('widht') + 1 });
    expect(typoResult.level).toBe('error');
    expect(kw('check', '--format', 'sarif', '--fail-on', 'never', 'tree').status).toBe(0);
    expect(kw('check', '--format', 'sarif', '--fail-on', 'warning', 'tree/warn.kw').status).toBe(1);
    expect(kw('check', '--format', 'sarif', 'tree/warn.kw').status).toBe(0);
    // An absolute path is still written relative to the working folder.
    const abs = JSON.parse(kw('check', '--format', 'sarif', path.join(work, 'tree', 'warn.kw')).stdout);
    expect(abs.runs[0].artifacts[0].location.uri).toBe('tree/warn.kw');
  });
});

describe('checking in parallel', () => {
  it('reports exactly what a sequential run reports, in every format', () => {
    for (const format of ['text', 'json', 'sarif']) {
      const one = kw('check', '--format', format, '--jobs', '1', 'tree');
      const many = kw('check', '--format', format, '--jobs', '3', 'tree');
      expect(one.status).toBe(1);
      expect(many.status).toBe(one.status);
      expect(many.stderr).toBe('');
      expect(many.stdout).toBe(one.stdout);
    }
  });

  it('gets the same data from worker threads as from the main thread', async () => {
    const texts = [typo, warn, smooth(1), smooth(2), smooth(3)];
    const jobs = texts.map((text, index) => ({ index, text, options: { timeBudgetMs: 60_000 } }));
    const got: CheckJobResult[] = [];
    const unfinished = await runInWorkers(jobs, 2, path.join(h.dir, 'checkWorker.js'), (r) => got.push(r));
    expect(unfinished).toEqual([]);
    got.sort((a, b) => a.index - b.index);
    const here = jobs.map(runCheckJob);
    const strip = (r: CheckJobResult) => JSON.parse(JSON.stringify(r, (k, v) => (k === 'elapsedMs' ? 0 : v)));
    expect(got.map(strip)).toEqual(here.map(strip));
  });

  it('hands back the jobs of a worker that cannot start', async () => {
    const bad = path.join(work, 'not-a-worker.js');
    fs.writeFileSync(bad, 'throw new Error("broken worker")');
    const unfinished = await runInWorkers([{ index: 0, text: '', options: {} }, { index: 1, text: '', options: {} }], 2, bad, () => undefined);
    expect(unfinished.sort()).toEqual([0, 1]);
  });

  it('uses threads only where they pay', () => {
    expect(chooseThreads(10, undefined, true, 4, 0)).toBe(4);
    expect(chooseThreads(10, undefined, true, 4, 3.6)).toBe(1);
    expect(chooseThreads(3, undefined, true, 4, 0)).toBe(1);
    expect(chooseThreads(10, undefined, false, 4, 0)).toBe(1);
    expect(chooseThreads(100, undefined, true, 64, 0)).toBe(8);
    expect(chooseThreads(2, 6, true, 4, 0)).toBe(2);
    expect(chooseThreads(10, 3, true, 1, 9)).toBe(3);
  });
});

/** Runs the program in this process with the given terminal flags and environment. */
async function inProcess(args: string[], terminal: { stdout: boolean; stderr: boolean }, env: Record<string, string>) {
  let out = '';
  let status = '';
  const errs: string[] = [];
  const io: CliIo = { out: (t) => { out += t; }, err: (l) => errs.push(l), status: (t) => { status += t; }, terminal: { ...terminal, columns: 60 }, env };
  const code = await runCli(args, io);
  return { code, out, status, errs };
}

describe('colour and progress', () => {
  const files = () => ['--no-numerics', path.join(work, 'tree')];

  it('colours severities only on a terminal, and never with NO_COLOR', async () => {
    const tty = await inProcess(['check', ...files()], { stdout: true, stderr: false }, {});
    expect(tty.out).toContain('\x1b[31merror\x1b[0m KW201');
    expect(tty.out).toMatch(/\x1b\[31m1 error\x1b\[0m/);
    const noColor = await inProcess(['check', ...files()], { stdout: true, stderr: false }, { NO_COLOR: '1' });
    expect(noColor.out).not.toContain('\x1b[');
    expect(noColor.out.replace(/\x1b\[\d+m/g, '')).toBe(tty.out.replace(/\x1b\[\d+m/g, ''));
    const emptyNoColor = await inProcess(['check', ...files()], { stdout: true, stderr: false }, { NO_COLOR: '' });
    expect(emptyNoColor.out).toContain('\x1b[');
    const pipe = await inProcess(['check', ...files()], { stdout: false, stderr: false }, {});
    expect(pipe.out).not.toContain('\x1b[');
    const json = await inProcess(['check', '--format', 'json', ...files()], { stdout: true, stderr: false }, {});
    expect(() => JSON.parse(json.out)).not.toThrow();
  });

  it('shows a progress line on a terminal only, and clears it', async () => {
    const tty = await inProcess(['check', ...files()], { stdout: false, stderr: true }, {});
    expect(tty.status).toContain('checking 8/8: ');
    expect(tty.status.endsWith('\r\x1b[K')).toBe(true);
    for (const line of tty.status.split('\r\x1b[K')) expect(line.length).toBeLessThanOrEqual(59);
    const log = await inProcess(['check', ...files()], { stdout: false, stderr: false }, {});
    expect(log.status).toBe('');
    expect(log.out).toBe(tty.out);
    const few = await inProcess(['check', '--no-numerics', path.join(work, 'tree', 'warn.kw')], { stdout: false, stderr: true }, {});
    expect(few.status).toBe('');
  });

  it('prints no escape codes and no progress when the program writes to pipes', () => {
    const r = kw('check', '--fail-on', 'never', 'tree');
    expect(r.status).toBe(0);
    expect(r.stdout + r.stderr).not.toContain('\x1b[');
    expect(r.stderr).toBe('');
  });

  it('colours a real terminal unless NO_COLOR is set (when `script` can provide one)', () => {
    const probe = spawnSync('script', ['-qec', 'true', '/dev/null'], { encoding: 'utf8' });
    if (probe.status !== 0) return; // no util-linux `script` here: the in-process tests above cover the logic
    const command = `${JSON.stringify(process.execPath)} ${JSON.stringify(h.cli)} check --no-numerics tree`;
    const tty = spawnSync('script', ['-qec', command, '/dev/null'], { cwd: work, encoding: 'utf8', env: { ...process.env, NO_COLOR: '' } });
    expect(tty.stdout).toContain('\x1b[31merror\x1b[0m');
    const plain = spawnSync('script', ['-qec', command, '/dev/null'], { cwd: work, encoding: 'utf8', env: { ...process.env, NO_COLOR: '1' } });
    expect(plain.stdout).toContain('error KW201');
    expect(plain.stdout).not.toContain('\x1b[31m');
  });
});
