/**
 * The comparison of two versions of a kernel file (src-core/report/compare.ts) on the fixture pairs in
 * tests/review/fixtures/<case>/{old,new}.kw, and on small texts for the edge cases: renames, reformatting,
 * rewritten but equal definitions, domain changes, broken versions.
 */
import { describe, expect, it } from 'vitest';
import {
  analyzeText,
  compareFileVersions,
  type AnalysisOptions,
  type FileComparison,
  type KernelComparison,
} from '@kernwright/core';
import { fixture } from './cliHarness';

// Generous: on a loaded machine the engine must still reach its accuracy, so that errors are small and stable.
const analysis: Partial<AnalysisOptions> = { timeBudgetMs: 20_000 };

function compareTexts(oldText: string | null, newText: string | null): FileComparison {
  const r = compareFileVersions(
    oldText === null ? null : { path: 'old.kw', text: oldText },
    newText === null ? null : { path: 'new.kw', text: newText },
    { analysis },
  );
  if (!r.ok) throw new Error(r.message);
  return r.file;
}

function compareCase(name: string): FileComparison {
  return compareTexts(fixture(name, 'old'), fixture(name, 'new'));
}

function only(f: FileComparison): KernelComparison {
  expect(f.kernels).toHaveLength(1);
  return f.kernels[0];
}

function figure(k: KernelComparison, key: string) {
  const c = k.figures.find((f) => f.figure === key);
  if (!c) throw new Error(`no figure ${key}`);
  return c;
}

describe('compare: the fixture pairs', () => {
  it('a sign change that breaks symmetry flips Hermitian and moves the figures', () => {
    const k = only(compareCase('sign-breaks-symmetry'));
    expect(k.status).toBe('changed');
    expect(k.flips).toContainEqual({ property: 'hermitian', old: 'yes', new: 'no' });
    const norm = figure(k, 'norm');
    expect(norm.significant).toBe(true);
    expect(norm.relative!.value).toBeLessThan(0);
    // K changes most where t − s is largest in size: at the corners (0, 1) or (1, 0), or where t + s is largest.
    expect(k.pointwise!.significant).toBe(true);
    expect(k.pointwise!.max.value).toBeCloseTo(0.4, 10);
  });

  it('a longer length scale moves the spectrum: λ1 grows, the trace stays (K(t, t) = 1 either way)', () => {
    const k = only(compareCase('length-scale'));
    expect(k.status).toBe('changed');
    expect(k.flips).toEqual([]);
    const l1 = figure(k, 'eigenvalue1');
    expect(l1.significant).toBe(true);
    expect(l1.relative!.value).toBeGreaterThan(0.2);
    expect(l1.relative!.error).toBeLessThan(1e-6);
    const trace = figure(k, 'trace');
    expect(trace.significant).toBe(false);
    expect(trace.new!.re).toBeCloseTo(1, 10);
    // The combined error is honest: |Δ trace| lies within it.
    expect(Math.abs(trace.difference!.re)).toBeLessThanOrEqual(trace.difference!.error);
  });

  it('a renamed kernel is reported as renamed, the other one as unchanged', () => {
    const f = compareCase('renamed');
    expect(f.kernels.map((k) => [k.status, k.oldName, k.name])).toEqual([
      ['renamed', 'green', 'rod_green'],
      ['unchanged', null, 'plain'],
    ]);
    expect(f.kernels.every((k) => k.figures.length === 0 && k.pointwise === null)).toBe(true);
  });

  it('a reformatted file is unchanged, and the numerics never run for it', () => {
    const calls: boolean[] = [];
    const spy = (text: string, options: Partial<AnalysisOptions>) => {
      calls.push(options.numerics !== false);
      return analyzeText(text, options);
    };
    const r = compareFileVersions({ path: 'a', text: fixture('reformatted', 'old') }, { path: 'b', text: fixture('reformatted', 'new') }, { analysis }, spy);
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.file.status).toBe('unchanged');
    expect(only(r.file)).toMatchObject({ status: 'unchanged', rewritten: false, flips: [], figures: [], pointwise: null });
    expect(calls).toEqual([false, false]);
  });

  it('a kernel that becomes 1/|t − s| flips to unbounded and loses its spectrum', () => {
    const k = only(compareCase('becomes-unbounded'));
    expect(k.status).toBe('changed');
    expect(k.flips).toContainEqual({ property: 'boundedness', old: 'hilbert-schmidt', new: 'unbounded' });
    expect(k.notes.join(' ')).toMatch(/new version has no spectrum/);
    const norm = figure(k, 'norm');
    expect(norm.old).not.toBeNull();
    expect(norm.new).toBeNull();
    expect(norm.significant).toBe(true);
    // The diagonal, where 1/|t − s| is infinite, is skipped and counted.
    expect(k.pointwise!.skipped).toBeGreaterThan(0);
  });
});

describe('compare: edge cases', () => {
  const header = '# Invented test scenario.\ndomain [0, 1]\n';

  it('reports a definition rewritten into an equal one as unchanged, with every figure within its error', () => {
    const k = only(compareTexts(`${header}kernel k(t, s) = 2 * exp(-(t - s)^2)\n`, `${header}kernel k(t, s) = exp(-(t - s)^2) + exp(-(s - t)^2)\n`));
    expect(k.status).toBe('unchanged');
    expect(k.rewritten).toBe(true);
    expect(k.figures.length).toBeGreaterThan(0);
    expect(k.figures.every((f) => !f.significant)).toBe(true);
    expect(k.pointwise!.significant).toBe(false);
  });

  it('compares K on the common part of two domains and says that the domain changed', () => {
    const k = only(compareTexts(`${header}kernel k(t, s) on [0, 2] = exp(-(t - s)^2)\n`, `${header}kernel k(t, s) on [1, 3] = exp(-(t - s)^2)\n`));
    expect(k.status).toBe('changed');
    expect(k.domainChanged).toBe(true);
    expect(k.pointwise!.domain).toEqual([1, 2]);
    expect(k.pointwise!.significant).toBe(false);
  });

  it('says when two domains do not overlap', () => {
    const k = only(compareTexts(`${header}kernel k(t, s) on [0, 1] = t * s\n`, `${header}kernel k(t, s) on [2, 3] = t * s\n`));
    expect(k.pointwise).toBeNull();
    expect(k.notes.join(' ')).toMatch(/do not overlap/);
  });

  it('lists added and removed kernels, and whole files added or removed', () => {
    const f = compareTexts(`${header}kernel a(t, s) = t * s\n`, `${header}kernel b(t, s) = t + s\n`);
    expect(f.kernels.map((k) => [k.name, k.status])).toEqual([['b', 'added'], ['a', 'removed']]);
    const added = compareTexts(null, `${header}kernel a(t, s) = t * s\n`);
    expect(added.status).toBe('added');
    expect(added.kernels.map((k) => k.status)).toEqual(['added']);
    const removed = compareTexts(`${header}kernel a(t, s) = t * s\n`, null);
    expect(removed.status).toBe('removed');
  });

  it('marks a kernel whose new version has errors as not comparable and names the error', () => {
    const f = compareTexts(`${header}kernel k(t, s) = t * s\n`, `${header}kernel k(t, s) = t * widht\n`);
    const k = only(f);
    expect(k.status).toBe('not-comparable');
    expect(k.notes.join(' ')).toMatch(/new version cannot be analysed: line 3: .*widht/);
    expect(f.newErrors).toMatch(/^line 3: /);
  });

  it('refuses a file neither of whose versions parses cleanly', () => {
    const r = compareFileVersions({ path: 'x.kw', text: `${header}kernel k(t, s) = 2t\n` }, { path: 'x.kw', text: `${header}kernel k(t, s) = (t\n` });
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.message).toMatch(/^cannot compare 'x\.kw': neither version parses cleanly \(old line 3: .+; new line 3: .+\)$/);
  });
});
