/**
 * Continuity: jumps measured across the curve the expression names (their sizes known by construction), kinks
 * confirmed or dismissed numerically, and the class Mercer's theorem cares about.
 */
import { describe, expect, it } from 'vitest';
import { analyse } from './helpers';

describe('jumps', () => {
  const r = analyse([
    'kernel flip(t, s) = t < s ? i : -i',
    'kernel step(t, s) = t < s ? t * s + 3 : t * s',
    'kernel ramp(t, s) = t < 0.25 ? s : 1 + s',
    'kernel growing(t, s) = t < s ? t : 0',
  ].join('\n'));

  it('|i − (−i)| = 2 across the diagonal', () => {
    const c = r.kernel('flip').continuity!;
    expect(c.class).toBe('jump');
    expect(c.where).toBe('the diagonal t = s');
    expect(c.jump!.value).toBeCloseTo(2, 12);
    expect(c.jump!.error).toBeLessThan(1e-10);
  });
  it('3 across the diagonal, whatever the smooth part does', () => {
    expect(r.kernel('step').continuity!.jump!.value).toBeCloseTo(3, 12);
  });
  it('1 across the line t = 1/4', () => {
    expect(r.kernel('ramp').continuity).toMatchObject({ class: 'jump', where: 'the line t = 0.25' });
    expect(r.kernel('ramp').continuity!.jump!.value).toBeCloseTo(1, 12);
  });
  it('the largest of the jumps along the curve: t jumps to 0 across t = s, largest near t = 0.9 of the points probed', () => {
    // Probed at 10 %, 30 %, …, 90 % of the diagonal: the largest jump is 0.9 (to within the step off the line).
    expect(r.kernel('growing').continuity!.jump!.value).toBeCloseTo(0.9, 6);
    const d = r.diagnostics('growing').find((x) => x.code === 'KW520')!;
    expect(d.message).toContain('measured at 5 points');
  });
});

describe('kinks and candidate places that turn out smooth', () => {
  const r = analyse([
    'kernel square(t, s) = abs(t - s)^2',
    'kernel folded(t, s) = sign(t - s) * (t - s)',
    'kernel green(t, s) = t < s ? t * (1 - s) : s * (1 - t)',
    'kernel smooth_max(t, s) = max(t, s)^2 + min(t, s)^2',
  ].join('\n'));

  it('abs(t − s)^2 is smooth: no kink', () => {
    expect(r.kernel('square').continuity).toMatchObject({ class: 'continuous', kinks: [] });
    expect(r.codes('square')).not.toContain('KW521');
  });
  it('sign(t − s)·(t − s) = |t − s| is continuous with a kink on the diagonal', () => {
    expect(r.kernel('folded').continuity).toMatchObject({ class: 'continuous', kinks: ['the diagonal t = s'] });
    // Across the diagonal the normal derivative of |t − s| goes from −√2 to √2.
    expect(r.diagnostics('folded').find((d) => d.code === 'KW521')!.figures!.slope).toBeCloseTo(2 * Math.SQRT2, 6);
  });
  it('a Green’s function written piecewise is continuous', () => {
    expect(r.kernel('green').continuity!.class).toBe('continuous');
  });
  it('max(t, s)² + min(t, s)² = t² + s² has no kink', () => {
    expect(r.kernel('smooth_max').continuity).toMatchObject({ class: 'continuous', kinks: [] });
  });
});

describe('singular kernels', () => {
  it('are neither continuous nor jumps, and say where', () => {
    const r = analyse('kernel k(t, s) = -log(abs(t - s))\n  expect continuous');
    expect(r.kernel('k').continuity).toMatchObject({ class: 'singular', where: 'the diagonal t = s' });
    expect(r.diagnostics('k').find((d) => d.code === 'KW603')!.message).toContain('is singular: |K| grows like log(1/d)');
  });
  it('a removable singularity is continuous: sin(5(t − s))/(t − s)', () => {
    const r = analyse('kernel k(t, s) = sin(5 * (t - s)) / (t - s)');
    expect(r.kernel('k').continuity!.class).toBe('continuous');
    expect(r.kernel('k').boundedness!.class).toBe('hilbert-schmidt');
    expect(r.codes('k')).not.toContain('KW301');
  });
});
