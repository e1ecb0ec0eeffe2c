/**
 * The comparison reports (src-core/report/compareReport.ts) and the verdict (src-core/review/thresholds.ts) on
 * hand-made comparison data: markdown tables with the flips first, text lines, JSON, and which limits fail.
 */
import { describe, expect, it } from 'vitest';
import {
  compareFigure,
  compareJsonReport,
  compareVerdict,
  comparison,
  formatComparisonMarkdown,
  formatComparisonText,
  noThresholds,
  type FileComparison,
  type KernelComparison,
} from '@kernwright/core';

const kernel = (over: Partial<KernelComparison>): KernelComparison => ({
  name: 'k', oldName: null, status: 'changed', rewritten: false, oldLine: 3, newLine: 3, oldDomain: [0, 1], newDomain: [0, 1],
  domainChanged: false, flips: [], figures: [], rank: [], pointwise: null, notes: [], ...over,
});

const cov = kernel({
  name: 'cov',
  figures: [
    compareFigure('norm', { re: 2, im: 0, error: 1e-12 }, { re: 2.5, im: 0, error: 1e-12 }),
    compareFigure('trace', { re: 1, im: 0, error: 1e-12 }, { re: 1 + 1e-13, im: 0, error: 1e-12 }),
    compareFigure('eigenvalue1', { re: 2, im: 0, error: 1e-12 }, { re: 2.5, im: 0, error: 1e-12 }),
    compareFigure('eigenvalue2', { re: 0.5, im: 0, error: 1e-12 }, { re: 0.45, im: 0, error: 1e-12 }),
  ],
  pointwise: {
    domain: [0, 1], gridPoints: 97, max: { value: 0.25, error: 1e-15 }, at: { t: 0.5, s: 0.25 },
    old: { re: 1, im: 0 }, new: { re: 1.25, im: 0 }, scale: 1.25, skipped: 0, significant: true,
  },
});
const skew = kernel({ name: 'skew', flips: [{ property: 'hermitian', old: 'yes', new: 'no' }] });
const files: FileComparison[] = [
  {
    path: 'a.kw', oldPath: 'a.kw', newPath: 'a.kw', status: 'modified', oldErrors: null, newErrors: null,
    kernels: [cov, skew, kernel({ name: 'new_one', status: 'added', oldLine: null }), kernel({ name: 'b2', oldName: 'b', status: 'renamed' })],
  },
  { path: 'quiet.kw', oldPath: 'quiet.kw', newPath: 'quiet.kw', status: 'unchanged', oldErrors: null, newErrors: null, kernels: [kernel({ status: 'unchanged' })] },
];
const result = comparison(files);

describe('compare reports', () => {
  it('counts kernels by status and the flips', () => {
    expect(result.summary).toEqual({
      files: 2, flips: 1,
      kernels: { added: 1, removed: 0, renamed: 1, changed: 2, unchanged: 1, 'not-comparable': 0 },
    });
  });

  it('writes one markdown table per changed file, flips first, then the figures beyond their errors', () => {
    const md = formatComparisonMarkdown(result, compareVerdict(result, noThresholds));
    const table = md.split('\n').filter((l) => l.startsWith('| '));
    expect(table[0]).toBe('| Kernel | What | Old | New | Change |');
    expect(table[1]).toBe('| `skew` | **Hermitian flipped** | yes | **no** | flipped |');
    expect(table[2]).toMatch(/^\| `cov` \| norm \| 2 ± 1e-12 \| 2\.5 ± 1e-12 \| \+25 % ± [\d.e-]+ % \|$/);
    expect(table.some((l) => l.startsWith('| `cov` | trace'))).toBe(false);
    expect(table).toContainEqual('| `cov` | unchanged within the error estimates |  |  | trace |');
    expect(table).toContainEqual('| `b` → `b2` | renamed (same definition) |  |  |  |');
    expect(table.findIndex((l) => l.includes('λ₂'))).toBeGreaterThan(0);
    expect(table.findIndex((l) => l.includes('new_one'))).toBeGreaterThan(table.findIndex((l) => l.includes('λ₂')));
    expect(table).toContainEqual(expect.stringMatching(/^\| `cov` \| largest change of K \|  \|  \| 0\.25 ± 1e-15, 20 % of max \\\|K\\\| at t = 0\.5, s = 0\.25 \(K was 1, is 1\.25, each ± 5e-16\), on a 97 × 97 grid of \[0, 1\] \|$/));
    expect(md).toContain('#### `a.kw` (modified)');
    expect(md).not.toContain('#### `quiet.kw`');
    expect(md).toContain('Unchanged: `quiet.kw`');
    // Pipes inside cells are escaped.
    expect(md).toContain('\\|K\\|');
  });

  it('writes text with every shown figure carrying its error', () => {
    const text = formatComparisonText(result, compareVerdict(result, noThresholds));
    expect(text).toContain('  “skew”: changed (line 3)\n    Hermitian flipped: yes → no');
    expect(text).toMatch(/norm: 2 ± 1e-12 → 2\.5 ± 1e-12 \(\+25 % ± \S+ %\)/);
    expect(text).toContain('quiet.kw: unchanged (1 kernel)');
    expect(text.trimEnd().split('\n').pop()).toBe('compared 2 files, 5 kernels: 2 changed, 1 renamed, 1 added, 1 unchanged; 1 property flipped');
    for (const line of text.split('\n').filter((l) => /→ \d/.test(l))) expect(line).toMatch(/±.*→.*±/);
  });

  it('fails exactly the limits that are exceeded beyond the errors', () => {
    expect(compareVerdict(result, noThresholds)).toEqual({ failed: false, reasons: [] });
    expect(compareVerdict(result, { ...noThresholds, failOnFlip: true }).reasons).toEqual(['a.kw: “skew”: Hermitian flipped from yes to no']);
    expect(compareVerdict(result, { ...noThresholds, maxNormChange: 0.3 }).failed).toBe(false);
    expect(compareVerdict(result, { ...noThresholds, maxNormChange: 0.2 }).reasons).toEqual([expect.stringMatching(/^a\.kw: “cov”: norm changed by \+25 % ± \S+ % \(limit 20 %\)$/)]);
    expect(compareVerdict(result, { ...noThresholds, maxEigenvalueChange: 0.15 }).reasons).toHaveLength(1);
    expect(compareVerdict(result, { ...noThresholds, maxEigenvalueChange: 0.05 }).reasons).toHaveLength(2);
    expect(compareVerdict(result, { ...noThresholds, maxTraceChange: 0 }).failed).toBe(false);
  });

  it('fails when a new version has errors, and says so in every format', () => {
    const broken = comparison([{ ...files[0], newErrors: 'line 4: Unknown name “nope”.' }]);
    const verdict = compareVerdict(broken, noThresholds);
    expect(verdict.reasons).toEqual(['a.kw: the new version has errors (line 4: Unknown name “nope”.)']);
    expect(formatComparisonText(broken, verdict)).toContain('limits exceeded:\n  a.kw: the new version has errors');
    expect(formatComparisonMarkdown(broken, verdict)).toContain('**The new version has errors:** line 4');
  });

  it('gives JSON with the verdict and null for numbers that are not finite', () => {
    const odd = comparison([{ ...files[0], kernels: [kernel({ figures: [compareFigure('norm', { re: 1, im: 0, error: NaN }, { re: 2, im: 0, error: 0 })] })] }]);
    const json = JSON.parse(JSON.stringify(compareJsonReport(odd, compareVerdict(odd, noThresholds), { name: 'kernwright', version: 't' })));
    expect(json.version).toBe(1);
    expect(json.tool).toEqual({ name: 'kernwright', version: 't' });
    expect(json.files[0].kernels[0].figures[0].old.error).toBeNull();
    expect(json.verdict).toEqual({ failed: false, reasons: [] });
  });
});
