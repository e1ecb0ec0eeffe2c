/** Norm and rank claims, against closed forms: ‖T‖ = 1/π² for min(t, s) − t·s, ranks of separable kernels. */
import { describe, expect, it } from 'vitest';
import { eigs } from 'mathjs';
import { analyse } from './helpers';

describe('norm claims: min(t, s) − t·s has ‖T‖ = 1/π² (eigenvalues 1/(n²π²), common practice)', () => {
  const r = analyse([
    'kernel a(t, s) = min(t, s) - t * s',
    '  expect norm <= 0.1014',
    'kernel b(t, s) = min(t, s) - t * s',
    '  expect norm < 0.1013',
    'kernel c(t, s) = min(t, s) - t * s',
    '  expect norm <= 1/pi^2',
  ].join('\n'));
  it('holds above the norm', () => expect(r.problems('a')).toEqual([]));
  it('fails below it, with the norm and its error', () => {
    const d = r.diagnostics('b').find((x) => x.code === 'KW606')!;
    expect(d.severity).toBe('error');
    expect(d.figures!.norm).toBeCloseTo(1 / Math.PI ** 2, 14);
    expect(d.message).toMatch(/‖T‖ = 0\.101321183642\d* ± /);
  });
  it('cannot decide a bound equal to the norm', () => expect(r.codes('c')).toContain('KW609'));
});

describe('rank claims', () => {
  it('t·s + t²·s²: rank 2, eigenvalues of the Gram matrix [[1/3, 1/4], [1/4, 1/5]]', () => {
    const r = analyse('kernel k(t, s) = t * s + t^2 * s^2\n  expect rank = 2, rank <= 2, rank <= 5');
    expect(r.problems('k')).toEqual([]);
    const reference = (eigs([[1 / 3, 1 / 4], [1 / 4, 1 / 5]]).values as unknown as number[]).slice().sort((x, y) => y - x);
    const computed = r.kernel('k').spectrum!.eigenvalues;
    computed.forEach((e, i) => expect(Math.abs(e.re - reference[i])).toBeLessThanOrEqual(Math.max(e.error, 1e-15)));
  });
  it('dependent terms: t·s + 2·t·s has rank 1', () => {
    const r = analyse('kernel k(t, s) = t * s + 2 * t * s\n  expect rank = 1\nkernel m(t, s) = t * s + 2 * t * s\n  expect rank = 2');
    expect(r.problems('k')).toEqual([]);
    expect(r.diagnostics('m').find((x) => x.code === 'KW607')!.message).toContain('has rank 1');
  });
  it('a finite rank the expression hides: max(t, s)·min(t, s) = t·s', () => {
    const r = analyse('kernel k(t, s) = max(t, s) * min(t, s)\n  expect rank = 1');
    expect(r.problems('k')).toEqual([]);
  });
  it('exp(−(t − s)²) has infinite rank: a small claim fails, a large one cannot be confirmed', () => {
    const r = analyse('kernel k(t, s) = exp(-(t - s)^2)\n  expect rank <= 4\nkernel m(t, s) = exp(-(t - s)^2)\n  expect rank = 40');
    expect(r.diagnostics('k').find((x) => x.code === 'KW607')!.message).toContain('rank at least');
    expect(r.diagnostics('m').find((x) => x.code === 'KW609')!.message).toContain('may be infinite');
  });
});
