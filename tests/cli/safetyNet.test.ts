/**
 * The safety net of `kernwright check`, run as a user runs the bundled program: a kernel that never finishes, or
 * one that allocates without end, is stopped in its worker thread and reported as a warning naming it (KW406,
 * KW407), while the other kernels of its file and the other files get their figures. The faults are the test hooks
 * of server/src/safetyNet.ts (kernels named hang_for_test and grow_for_test), honoured only with
 * KERNWRIGHT_TEST_HOOKS=1. export and report, which analyse in their own thread, learn the stopped kernels from a
 * first run in a worker.
 *
 * Reference values: the kernels beside the faulty ones are of rank one, K(t, s) = u(t) u(s), whose one nonzero
 * eigenvalue is ‖u‖² = ∫ u² (elementary; common practice): t·s on [0, 1] gives ∫₀¹ t² dt = 1/3, and exp(t + s) on
 * [0, 1] gives ∫₀¹ e^{2t} dt = (e² − 1)/2.
 */
import * as fs from 'node:fs';
import * as os from 'node:os';
import * as path from 'node:path';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { bundleCli, writeTree, type Harness, type Run } from '../review/cliHarness';

vi.setConfig({ testTimeout: 120_000 });

let h: Harness;
let work = '';
const header = '# Invented test scenario; the values mean nothing beyond this test.\ndomain [0, 1]\n';
const productKernel = 'kernel product(t, s) = t * s\n';
const expKernel = 'kernel growth(t, s) = exp(t + s)\n';
const oneThird = 1 / 3;
const expNorm = (Math.exp(2) - 1) / 2;
// The faulty kernel's definition differs from its neighbour's: the net remembers a stopped kernel by the hash of
// its definition (domain and expression, not its name), so a neighbour with the same body would be skipped too.
const withFault = (name: string) => `${header}kernel ${name}(t, s) = t*s + 1\n${productKernel}`;

/** The watchdog's limit is short here, so that a test of a hang takes seconds. */
const hooks = { KERNWRIGHT_TEST_HOOKS: '1', KERNWRIGHT_KERNEL_TIME_LIMIT_MS: '1500' };

interface JsonDiagnostic {
  readonly code: string;
  readonly severity: string;
  readonly message: string;
  readonly range: { readonly start: { readonly line: number } };
}
interface JsonKernel {
  readonly name: string;
  readonly norm: { readonly value: number; readonly error: number } | null;
}
interface JsonFile {
  readonly path: string;
  readonly diagnostics: readonly JsonDiagnostic[];
  readonly kernels: readonly JsonKernel[];
}

function kw(args: readonly string[], env: NodeJS.ProcessEnv = hooks): Run {
  return h.run(work, args, { env: { KERNWRIGHT_TEST_HOOKS: undefined, KERNWRIGHT_KERNEL_TIME_LIMIT_MS: undefined, ...env } });
}

function jsonFiles(r: Run): JsonFile[] {
  return (JSON.parse(r.stdout) as { files: JsonFile[] }).files;
}

function kernel(file: JsonFile, name: string): JsonKernel {
  const k = file.kernels.find((x) => x.name === name);
  expect(k, name).toBeDefined();
  return k as JsonKernel;
}

/** The kernel's norm is the reference value (within its error estimate and a small relative tolerance). */
function expectNorm(file: JsonFile, name: string, expected: number): void {
  const norm = kernel(file, name).norm;
  expect(norm, name).not.toBeNull();
  expect(Math.abs((norm?.value ?? NaN) - expected)).toBeLessThanOrEqual((norm?.error ?? 0) + 1e-9 * expected);
}

function stoppedCodes(file: JsonFile): string[] {
  return file.diagnostics.filter((d) => d.code === 'KW406' || d.code === 'KW407').map((d) => d.code);
}

beforeAll(async () => {
  h = await bundleCli();
  work = fs.mkdtempSync(path.join(os.tmpdir(), 'kw-net-'));
  writeTree(work, {
    'hang.kw': withFault('hang_for_test'),
    'grow.kw': withFault('grow_for_test'),
    'tree/a.kw': `${header}${expKernel}`,
    'tree/b.kw': withFault('hang_for_test'),
    'tree/c.kw': `${header}${productKernel}`,
    'tree/d.kw': `${header}${expKernel}${productKernel}`,
  });
}, 300_000);

afterAll(() => {
  h?.dispose();
  if (work) fs.rmSync(work, { recursive: true, force: true });
});

describe('a kernel that never finishes', () => {
  it('is stopped with a warning naming it, and the kernel beside it gets its figures', () => {
    const text = kw(['check', '--fail-on', 'warning', 'hang.kw']);
    expect(text.status).toBe(1);
    expect(text.stdout).toMatch(/^hang\.kw:3:8: warning KW406 The analysis of “hang_for_test” was stopped after/m);
    expect(text.stdout).toMatch(/^hang\.kw:4: kernel product on \[0, 1\]: norm 0\.333333/m);
    expect(text.stdout).toMatch(/checked 1 file: 0 errors, 1 warning/);
    expect(text.stderr).toBe('');

    // A warning does not fail the default --fail-on error.
    const json = kw(['check', '--format', 'json', 'hang.kw']);
    expect(json.status).toBe(0);
    const [file] = jsonFiles(json);
    const stopped = file.diagnostics.filter((d) => d.code === 'KW406');
    expect(stopped).toHaveLength(1);
    expect(stopped[0]).toMatchObject({ severity: 'warning', range: { start: { line: 2 } } });
    expect(stopped[0].message).toContain('hang_for_test');
    expect(kernel(file, 'hang_for_test').norm).toBeNull();
    expectNorm(file, 'product', oneThird);
  });

  it('leaves the other files complete on two threads, in file order, in JSON and SARIF', () => {
    const json = kw(['check', '--format', 'json', '-j', '2', 'tree']);
    expect(json.status).toBe(0);
    expect(json.stderr).toBe('');
    const files = jsonFiles(json);
    expect(files.map((f) => f.path.split(path.sep).join('/'))).toEqual(['tree/a.kw', 'tree/b.kw', 'tree/c.kw', 'tree/d.kw']);
    const [a, b, c, d] = files;
    expect(files.map(stoppedCodes)).toEqual([[], ['KW406'], [], []]);
    expectNorm(a, 'growth', expNorm);
    expectNorm(b, 'product', oneThird);
    expectNorm(c, 'product', oneThird);
    expectNorm(d, 'growth', expNorm);
    expectNorm(d, 'product', oneThird);

    const sarif = kw(['check', '--format', 'sarif', '--fail-on', 'warning', '-j', '2', 'tree']);
    expect(sarif.status).toBe(1);
    const results = (JSON.parse(sarif.stdout) as { runs: { results: { ruleId: string; level: string; message: { text: string } }[] }[] }).runs[0].results;
    const net = results.filter((r) => r.ruleId === 'KW406');
    expect(net).toHaveLength(1);
    expect(net[0].level).toBe('warning');
    expect(net[0].message.text).toContain('hang_for_test');
  });
});

describe('export and report', () => {
  it('export names the stopped kernel and exports the one beside it', () => {
    const stopped = kw(['export', 'hang.kw', '--kernel', 'hang_for_test', '--format', 'json']);
    expect(stopped.status).toBe(1);
    expect(stopped.stdout).toBe('');
    expect(stopped.stderr).toMatch(/^kernwright: nothing exported from 'hang\.kw': The analysis of “hang_for_test” was stopped after/);
    const good = kw(['export', 'hang.kw', '--kernel', 'product', '--format', 'json']);
    expect(good.status).toBe(0);
    expect(JSON.parse(good.stdout)).toMatchObject({ kernel: 'product' });
  });

  it('report shows the warning for the stopped kernel and draws the other', () => {
    const r = kw(['report', 'hang.kw', '-o', 'hang.html']);
    expect(r.status).toBe(0);
    expect(r.stdout).toMatch(/^wrote hang\.html \(2 kernels,/);
    const html = fs.readFileSync(path.join(work, 'hang.html'), 'utf8');
    expect(html).toMatch(/KW406[^<]*“hang_for_test”/);
  });
});

describe('a kernel that allocates without end', () => {
  it('is stopped at the worker memory limit with KW407 naming it', () => {
    // A long time limit here, so that the heap limit, not the watchdog's clock, stops the kernel.
    const r = kw(['check', '--format', 'json', '--fail-on', 'warning', 'grow.kw'], { ...hooks, KERNWRIGHT_KERNEL_TIME_LIMIT_MS: '100000' });
    expect(r.status).toBe(1);
    expect(r.stderr).toBe('');
    const [file] = jsonFiles(r);
    expect(stoppedCodes(file)).toEqual(['KW407']);
    const stopped = file.diagnostics.find((d) => d.code === 'KW407');
    expect(stopped?.severity).toBe('warning');
    expect(stopped?.message).toContain('grow_for_test');
    expect(kernel(file, 'grow_for_test').norm).toBeNull();
    expectNorm(file, 'product', oneThird);
  });
});

describe('without KERNWRIGHT_TEST_HOOKS', () => {
  it('analyses a kernel named hang_for_test like any other', () => {
    const r = kw(['check', '--format', 'json', '--fail-on', 'warning', 'hang.kw'], {});
    expect(r.stderr).toBe('');
    const [file] = jsonFiles(r);
    expect(stoppedCodes(file)).toEqual([]);
    // t·s + 1 on [0, 1], on the orthonormal basis 1, √12 (t − 1/2), is the matrix [[5/4, 1/(4√3)], [1/(4√3), 1/12]]
    // (trace 4/3, determinant 1/12), whose largest eigenvalue is (4 + √13)/6 (elementary; common practice).
    expectNorm(file, 'hang_for_test', (4 + Math.sqrt(13)) / 6);
    expectNorm(file, 'product', oneThird);
  });
});
