/**
 * Resolvent claims: membership in the resolvent set, the distance to the spectrum, the resolvent norm and the
 * Neumann series, against spectra known in closed form (t·s: {0, 1/3}; min(t, s): 1/((k − 1/2)² π²)).
 */
import { describe, expect, it } from 'vitest';
import { analyse } from './helpers';

describe('t·s on [0, 1]: the spectrum is {0, 1/3}', () => {
  const r = analyse([
    'kernel k(t, s) = t * s',
    '  expect resolvent 0.5, resolvent 1/3, resolvent 0, resolvent 2 * i, resolvent 1/3 + 0.001 * i, resolvent -0.1',
  ].join('\n'));
  const [half, third, zero, twoI, near, negative] = r.kernel('k').resolvent;

  it('μ = 1/2: distance 1/6, ‖(μ − T)⁻¹‖ = 6, the Neumann series converges (|μ| > 1/3)', () => {
    expect(half).toMatchObject({ mu: { re: 0.5, im: 0 }, inResolventSet: true, neumannConverges: true });
    expect(half.distance!.value).toBeCloseTo(1 / 6, 14);
    expect(half.resolventNorm!.value).toBeCloseTo(6, 12);
  });
  it('μ = 1/3 lies within the error of the eigenvalue: undecided, with a warning on the claim', () => {
    expect(third.inResolventSet).toBeNull();
    expect(third.distance!.value).toBeLessThanOrEqual(third.distance!.error);
    const d = r.diagnostics('k').filter((x) => x.code === 'KW609');
    expect(d).toHaveLength(1);
    expect(r.text.slice(d[0].range.start, d[0].range.end)).toBe('resolvent 1/3');
  });
  it('μ = 0 is never in the resolvent set of a compact operator', () => {
    expect(zero).toMatchObject({ inResolventSet: false, distance: { value: 0, error: 0 }, resolventNorm: null });
    expect(r.codes('k')).toContain('KW608');
  });
  it('μ = 2i: the nearest point of the spectrum is 0, at distance 2', () => {
    expect(twoI.inResolventSet).toBe(true);
    expect(twoI.distance!.value).toBeCloseTo(2, 14);
    expect(twoI.resolventNorm!.value).toBeCloseTo(0.5, 14);
  });
  it('μ = 1/3 + 0.001i: in the resolvent set at distance 0.001, resolvent norm 1000', () => {
    expect(near.inResolventSet).toBe(true);
    expect(near.distance!.value).toBeCloseTo(0.001, 12);
    expect(near.resolventNorm!.value).toBeCloseTo(1000, 6);
    expect(near.neumannConverges).toBe(true);
  });
  it('μ = −0.1: nearest point 0, the Neumann series diverges (|μ| < 1/3)', () => {
    expect(negative.distance!.value).toBeCloseTo(0.1, 14);
    expect(negative.neumannConverges).toBe(false);
  });
  it('shows the figures of the claims that hold, on the claim', () => {
    const infos = r.diagnostics('k').filter((x) => x.code === 'KW540');
    expect(infos).toHaveLength(4);
    expect(infos[0].message).toContain('dist(μ, σ(T)) = 0.16666666666666');
    expect(infos[0].figures).toMatchObject({ muRe: 0.5, muIm: 0, neumannConverges: true });
  });
});

describe('min(t, s) on [0, 1]: eigenvalues 1/((k − 1/2)² π²) accumulating at 0', () => {
  const lambda = (k: number) => 1 / ((k - 0.5) ** 2 * Math.PI ** 2);
  const r = analyse('kernel w(t, s) = min(t, s)\n  expect resolvent 0.2, resolvent 0.00001');
  const [point2, tiny] = r.kernel('w').resolvent;

  it('μ = 0.2 is nearest to λ₂ = 4/(9π²); the Neumann series diverges since λ₁ = 4/π² > 0.2', () => {
    expect(point2.inResolventSet).toBe(true);
    expect(point2.distance!.value).toBeCloseTo(0.2 - lambda(2), 13);
    expect(point2.resolventNorm!.value).toBeCloseTo(1 / (0.2 - lambda(2)), 10);
    expect(point2.neumannConverges).toBe(false);
  });
  it('μ = 10⁻⁵ lies among eigenvalues no discretisation of this size resolves: undecided', () => {
    expect(tiny.inResolventSet).toBeNull();
    const d = r.diagnostics('w').find((x) => x.code === 'KW609')!;
    expect(d.message).toContain('does not resolve');
  });
});

describe('a non-Hermitian kernel', () => {
  it('gets a distance but no resolvent norm (1/dist is only a lower bound without the spectral theorem)', () => {
    // exp(t − 2s) = f(t) g(s) has the single nonzero eigenvalue ∫ e^{−x} dx = 1 − 1/e.
    const r = analyse('kernel k(t, s) = exp(t - 2 * s)\n  expect resolvent 1');
    const [one] = r.kernel('k').resolvent;
    expect(one.inResolventSet).toBe(true);
    expect(one.distance!.value).toBeCloseTo(1 / Math.E, 13);
    expect(one.resolventNorm).toBeNull();
    expect(one.neumannConverges).toBe(true);
  });
});
