/** Kernel figures as editor text: every number with its error, properties read defensively, hovers, carry-forward. */
import { describe, expect, it } from 'vitest';
import {
  analyzeText, carryForward, hoverAt, kernelFiguresText, kernelLensTitle, lambda, propertyMarks, type KernelReport,
} from '@kernwright/core';
import { quick, withCursor } from './cursor';

const report: KernelReport = {
  name: 'k', nameRange: { start: 0, end: 1 }, range: { start: 0, end: 10 }, domain: [0, 1], complex: false, hash: 'h',
  spectrum: {
    eigenvalues: [{ re: 0.101321183642338, im: 0, error: 2.4e-9 }, { re: 0.0253302959, im: 0, error: 3e-9 }],
    eigenfunctions: null,
    norm: { value: 0.101321183642338, error: 2.4e-9, lower: 0.1013211812, upper: 0.1013211861 },
    hsNorm: { value: 0.1054, error: 1e-6 },
    trace: { value: 0.1666666, error: 1e-7 },
    method: 'Galerkin (N = 48)',
    converged: true,
    elapsedMs: 12,
  },
  hermitian: null, boundedness: null, continuity: null, positive: null, effectiveRank: null, resolvent: [],
};

const judged: KernelReport = {
  ...report,
  hermitian: { holds: true, defect: 0, defectError: 0, method: 'symbolic', worst: null },
  positive: { holds: false, minEigenvalue: { value: -0.25, error: 3e-10 }, certificate: null, mercer: null },
  continuity: { class: 'jump', where: 'the diagonal t = s', jump: { value: 1, error: 2e-12 }, jumps: ['the diagonal t = s'], kinks: [] },
  boundedness: { class: 'bounded', exponent: 0.75, where: 'the diagonal t = s' },
  effectiveRank: { p90: 3, p99: null, p999: null, resolvedModes: 8 },
  resolvent: [{ mu: { re: 0.5, im: 0 }, inResolventSet: true, distance: { value: 0.3987, error: 1e-9 }, resolventNorm: { value: 2.508, error: 6e-9 }, neumannConverges: true }],
};

describe('figures', () => {
  it('prints λ with subscripts', () => {
    expect([1, 2, 10, 12].map(lambda)).toEqual(['λ₁', 'λ₂', 'λ₁₀', 'λ₁₂']);
  });
  it('puts the norm and λ₁ with errors in the lens, digits following the error', () => {
    expect(kernelLensTitle(report)).toBe('‖T‖ = 0.1013211836 ± 2.4e-9 · λ₁ = 0.1013211836 ± 2.4e-9');
    expect(kernelLensTitle({ ...report, spectrum: null })).toBe('no spectrum');
    expect(kernelLensTitle({ ...report, spectrum: { ...report.spectrum!, converged: false } })).toContain('target accuracy not reached');
  });
  it('lists every figure with its error', () => {
    const text = kernelFiguresText(report);
    for (const line of text.split('\n').filter((l) => /\d\.\d/u.test(l) && !/method|time/u.test(l))) expect(line).toContain('±');
    expect(text).toContain('λ₂   0.0253302959 ± 3e-9');
  });
  it('marks each property with the figure behind it', () => {
    expect(propertyMarks(report)).toEqual([]);
    expect(propertyMarks(judged)).toEqual([
      { name: 'Hermitian', holds: true, figure: 'by construction' },
      { name: 'positive', holds: false, figure: 'λ_min = -0.25 ± 3e-10' },
      { name: 'continuous', holds: false, figure: 'jumps across the diagonal t = s by 1 ± 2e-12' },
      { name: 'bounded', holds: true, figure: 'not Hilbert–Schmidt: |K| ~ d^(−0.75) toward the diagonal t = s' },
    ]);
    expect(kernelLensTitle(judged)).toContain('Hermitian ✓ positive ✗ continuous ✗ bounded ✓');
    const text = kernelFiguresText(judged);
    expect(text).toContain('effective rank     3 (90 %), > 8 (99 %), > 8 (99.9 %) of the trace');
    expect(text).toContain('resolvent μ = 0.5: in the resolvent set, dist(μ, σ) = 0.3987 ± 1e-9, ‖(μ − T)⁻¹‖ = 2.508 ± 6e-9');
  });
});

describe('hover text', () => {
  const hover = (marked: string, numerics = false) => {
    const { text, offset } = withCursor(marked);
    return hoverAt(numerics ? analyzeText(text) : quick(text), offset, { numerics: numerics ? 'ready' : 'pending' })?.markdown ?? null;
  };
  it('describes constants, helpers, keywords and built-ins', () => {
    expect(hover('const a$0 = 2 * 3  # m\nkernel k(t, s) = a')).toMatch(/const a = 2 \* 3[\s\S]*Value: `6`[\s\S]*Note: m[\s\S]*Used 1 time\./u);
    expect(hover('fn f$0(x) = x^2\nkernel k(t, s) = f(t)')).toContain('fn f(x) = x ^ 2');
    expect(hover('dom$0ain [0, 1]')).toContain('default interval');
    expect(hover('kernel k(t, s) = mi$0n(t, s)')).toContain('Real arguments only');
  });
  it('says the analysis is running, then shows the figures and properties', () => {
    expect(hover('domain [0, 1]\nkernel k$0(t, s) = min(t, s) - t * s')).toContain('in progress');
    const h = hover('domain [0, 1]\nkernel k$0(t, s) = min(t, s) - t * s', true)!;
    expect(h).toContain('Hermitian ✓ (by construction)');
    expect(h).toMatch(/positive ✓ \(λ\\_min = [-\d.e]+ ± [\d.e-]+\)/u);
    expect(h).toContain('continuous ✓');
    expect(h).toMatch(/\| ‖T‖ \| 0\.1013211836\d* ± /u);
    expect(h).toMatch(/\| λ₂ \| 0\.02533029591\d* ± /u);
  });
  it('shows the property marks of a kernel without a spectrum', () => {
    const h = hover('domain [0, 1]\nkernel w$0ire(t, s) = 1 / abs(t - s)', true)!;
    expect(h).toMatch(/bounded ✗ \(\\\|K\\\| ~ d\^\(−1\) toward the diagonal t = s\)/u);
    expect(h).toContain('No spectrum');
  });
  it('reports whether a claim holds', () => {
    expect(hover('domain [0, 1]\nkernel k(t, s) = sqrt(t - s)\n  expect herm$0itian', true)).toContain('Not checked: the kernel has no spectrum');
    expect(hover('domain [0, 1]\nkernel k(t, s) = exp(-t) * s\n  expect herm$0itian', true)).toMatch(/✗ \*\*KW601\*\* Claimed “hermitian”/u);
    expect(hover('domain [0, 1]\nkernel k(t, s) = exp(-abs(t - s))\n  expect herm$0itian', true)).toContain('✓ Consistent with the numbers');
  });
});

describe('carry forward', () => {
  it('moves the findings of unchanged kernels and drops those of edited ones', () => {
    const before = 'domain [0, 1]\nkernel a(t, s) = sqrt(t - s)\nkernel b(t, s) = sqrt(s - t)\n';
    const full = analyzeText(before);
    expect(full.diagnostics.filter((d) => d.code === 'KW302')).toHaveLength(2);
    const after = '# new line\ndomain [0, 1]\nkernel a(t, s) = sqrt(t - s)\nkernel b(t, s) = sqrt(abs(s - t))\n';
    const moved = carryForward({ text: before, model: full.model }, full.diagnostics, { text: after, model: quick(after).model });
    expect(moved).toHaveLength(1);
    expect(after.slice(moved[0].range.start, moved[0].range.end)).toBe(before.slice(full.diagnostics.find((d) => d.code === 'KW302')!.range.start, full.diagnostics.find((d) => d.code === 'KW302')!.range.end));
    // A change of the file's domain changes every kernel's hash: nothing is carried.
    const other = after.replace('domain [0, 1]', 'domain [0, 2]');
    expect(carryForward({ text: before, model: full.model }, full.diagnostics, { text: other, model: quick(other).model })).toEqual([]);
  });
});
