/**
 * The safety net of `kernwright compare` and `kernwright fix`, run as a user runs the bundled program: a kernel that
 * never finishes (the test hook of server/src/safetyNet.ts, a kernel named hang_for_test, honoured only with
 * KERNWRIGHT_TEST_HOOKS=1) is stopped in its worker thread; compare says that its figures are not known (never
 * that they vanished or changed) and compares the kernel beside it, and fix applies the other fixes of the file and
 * ends. The core's comparison of a version whose kernel was stopped is checked directly too, with an analyser that
 * marks the kernel as stopped.
 *
 * Reference values: K(t, s) = c·t·s on [0, 1] is of rank one, K = c u(t) u(s) with u(t) = t, and its one nonzero
 * eigenvalue is c‖u‖² = c ∫₀¹ t² dt = c/3 (elementary; common practice). The symmetric part of K is
 * (K(t, s) + K(s, t)) / 2, and an operator is Hermitian exactly when K(t, s) = conj K(s, t) (common practice).
 */
import * as fs from 'node:fs';
import * as os from 'node:os';
import * as path from 'node:path';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { analyzeText, compareFileVersions, compareVerdict, comparison, type AnalysisOptions } from '@kernwright/core';
import { bundleCli, writeTree, type Harness, type Run } from '../review/cliHarness';

vi.setConfig({ testTimeout: 120_000 });

let h: Harness;
let work = '';
const header = '# Invented test scenario; the values mean nothing beyond this test.\ndomain [0, 1]\n';
// The stuck kernel's definition differs from every other kernel's: the net remembers a stopped kernel by the hash of
// its definition, so a neighbour with the same body would be skipped too.
const oldText = `${header}kernel product(t, s) = t * s\n`;
const newText = `${header}kernel hang_for_test(t, s) = t*s + 1\nkernel product(t, s) = 2 * t * s\n`;
const bothText = `${header}kernel hang_for_test(t, s) = t*s + 2\nkernel product(t, s) = t * s\n`;
const skew = 'kernel skew(t, s) = exp(-t) * s\n  expect hermitian\n';
const fixText = `${header}kernel hang_for_test(t, s) = t*s + 1\n${skew}`;
const symmetrized = 'kernel skew(t, s) = (exp(-t) * s + exp(-s) * t) / 2\n';

/** The watchdog's limit is short here, so that a test of a hang takes seconds. */
const hooks = { KERNWRIGHT_TEST_HOOKS: '1', KERNWRIGHT_KERNEL_TIME_LIMIT_MS: '1500' };
/**
 * The analysis of a kernel that is not Hermitian, with its symmetrize fix, takes about a second of CPU, which a
 * loaded machine stretches past 1.5 s: the fix tests give the watchdog more room, so that only the stuck kernel is
 * stopped.
 */
const fixHooks = { ...hooks, KERNWRIGHT_KERNEL_TIME_LIMIT_MS: '5000' };

function kw(args: readonly string[], env: NodeJS.ProcessEnv = hooks): Run {
  return h.run(work, args, { env });
}

interface JsonFigure {
  readonly figure: string;
  readonly old: { readonly re: number; readonly error: number } | null;
  readonly new: { readonly re: number; readonly error: number } | null;
}
interface JsonKernelComparison {
  readonly name: string;
  readonly status: string;
  readonly figures: readonly JsonFigure[];
  readonly flips: readonly unknown[];
  readonly notes: readonly string[];
}

function compared(r: Run): JsonKernelComparison[] {
  return (JSON.parse(r.stdout) as { files: { kernels: JsonKernelComparison[] }[] }).files.flatMap((f) => f.kernels);
}

function byName(kernels: readonly JsonKernelComparison[], name: string): JsonKernelComparison {
  const k = kernels.find((x) => x.name === name);
  expect(k, name).toBeDefined();
  return k as JsonKernelComparison;
}

/** The figure is the reference value within its error estimate and a small relative tolerance. */
function expectFigure(f: { readonly re: number; readonly error: number } | null | undefined, expected: number): void {
  expect(f).toBeTruthy();
  expect(Math.abs((f?.re ?? NaN) - expected)).toBeLessThanOrEqual((f?.error ?? 0) + 1e-9 * expected);
}

beforeAll(async () => {
  h = await bundleCli();
  work = fs.mkdtempSync(path.join(os.tmpdir(), 'kw-net-cf-'));
  writeTree(work, { 'old.kw': oldText, 'new.kw': newText, 'both.kw': bothText, 'fix.kw': fixText, 'preview.kw': fixText });
}, 300_000);

afterAll(() => {
  h?.dispose();
  if (work) fs.rmSync(work, { recursive: true, force: true });
});

describe('compare', () => {
  it('ends, reports the stopped kernel as not analysed, and compares the kernel beside it', () => {
    const json = kw(['compare', '--format', 'json', 'old.kw', 'new.kw']);
    expect(json.stderr).toBe('');
    expect(json.status).toBe(0);
    const kernels = compared(json);
    const stuck = byName(kernels, 'hang_for_test');
    expect(stuck.status).toBe('added');
    expect(stuck.figures).toEqual([]);
    expect(stuck.notes).toHaveLength(1);
    expect(stuck.notes[0]).toMatch(/^the new version was not analysed to the end \(KW406\): The analysis of “hang_for_test” was stopped/);
    const product = byName(kernels, 'product');
    expect(product.status).toBe('changed');
    const norm = product.figures.find((f) => f.figure === 'norm');
    expectFigure(norm?.old, 1 / 3);
    expectFigure(norm?.new, 2 / 3);

    // A limit on the norm fails for the kernel whose norm doubled, not for the one without figures.
    const text = kw(['compare', '--max-norm-change', '5%', 'old.kw', 'new.kw']);
    expect(text.status).toBe(1);
    expect(text.stdout).toMatch(/^ {4}the new version was not analysed to the end \(KW406\)/m);
    expect(text.stdout).toMatch(/^limits exceeded:\n {2}new\.kw: “product”: norm changed by \+100 %/m);
    expect(text.stdout).not.toMatch(/hang_for_test”: norm/);
  });

  it('says that the figures are not known when the kernel was stopped in both versions', () => {
    const json = kw(['compare', '--format', 'json', '--max-norm-change', '5%', 'both.kw', 'new.kw']);
    expect(json.stderr).toBe('');
    // “product” doubled its norm: that is the one limit exceeded.
    expect(json.status).toBe(1);
    const stuck = byName(compared(json), 'hang_for_test');
    expect(stuck.status).toBe('not-comparable');
    expect(stuck.figures).toEqual([]);
    expect(stuck.flips).toEqual([]);
    expect(stuck.notes.map((n) => n.slice(0, 46))).toEqual([
      'the old version was not analysed to the end (K',
      'the new version was not analysed to the end (K',
    ]);
    const reasons = (JSON.parse(json.stdout) as { verdict: { reasons: string[] } }).verdict.reasons;
    expect(reasons.some((r) => r.includes('hang_for_test'))).toBe(false);
  });
});

describe('the core comparison of a version whose kernel was stopped', () => {
  const options: Partial<AnalysisOptions> = { timeBudgetMs: 200 };
  const before = `${header}kernel k(t, s) = t * s\n`;
  const after = `${header}kernel k(t, s) = 2 * t * s\n`;
  const hashOf = (text: string) => analyzeText(text, { numerics: false }).kernels[0].hash!;

  it('compares no figure and fails no limit, instead of reporting the norm as vanished', () => {
    const stopped = new Map([[hashOf(after), { kind: 'time' as const, elapsedMs: 9000 }]]);
    const analyse = (text: string, o: Partial<AnalysisOptions>) => analyzeText(text, o, undefined, text === after ? { stopped } : {});
    const r = compareFileVersions({ path: 'a.kw', text: before }, { path: 'a.kw', text: after }, { analysis: options }, analyse);
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    const [k] = r.file.kernels;
    expect(k.status).toBe('not-comparable');
    expect(k.figures).toEqual([]);
    expect(k.notes).toHaveLength(1);
    expect(k.notes[0]).toMatch(/^the new version was not analysed to the end \(KW406\): .*its spectrum and properties are not known/);
    // K itself is still compared on the grid: it doubled, 2ts − ts = ts, largest at t = s = 1 (value 1).
    expect(k.pointwise?.significant).toBe(true);
    expect(k.pointwise?.max.value).toBeCloseTo(1, 9);
    const verdict = compareVerdict(comparison([r.file]), { failOnFlip: true, maxNormChange: 0.05, maxEigenvalueChange: 0.05, maxTraceChange: 0.05 });
    expect(verdict).toEqual({ failed: false, reasons: [] });

    // Without the stop, the same pair is a change of the norm from 1/3 to 2/3.
    const plain = compareFileVersions({ path: 'a.kw', text: before }, { path: 'a.kw', text: after }, { analysis: options });
    expect(plain.ok && plain.file.kernels[0].status).toBe('changed');
  });
});

describe('fix', () => {
  it('ends, applies the other fix of the file and exits 0', () => {
    const first = kw(['fix', '--only', 'symmetrize', 'fix.kw'], fixHooks);
    expect(first.stderr).toBe('');
    expect(first.status).toBe(0);
    expect(first.stdout).toBe('fix.kw: applied 1 fix in 1 pass (symmetrize ×1)\n');
    expect(fs.readFileSync(path.join(work, 'fix.kw'), 'utf8')).toBe(fixText.replace('kernel skew(t, s) = exp(-t) * s\n', symmetrized));
  });

  it('with --dry-run prints the diff and exits 1, as documented, writing nothing', () => {
    const r = kw(['fix', '--dry-run', '--only', 'symmetrize', 'preview.kw'], fixHooks);
    expect(r.stderr).toBe('');
    expect(r.status).toBe(1);
    expect(r.stdout).toContain(`-kernel skew(t, s) = exp(-t) * s\n+${symmetrized}`);
    expect(fs.readFileSync(path.join(work, 'preview.kw'), 'utf8')).toBe(fixText);
  });
});
