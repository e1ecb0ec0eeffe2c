/**
 * Weakly singular kernels on [0, 1]. No closed form for their eigenvalues is known to us, so the eigenvalues are
 * checked against a reference computed here by the same Galerkin method at a much finer discretisation and much
 * finer singular quadrature (N = 338, 30 grading levels, 20 points per graded panel), which agrees with a still
 * finer quadrature (34 levels, 24 points) to 1e-13; the Hilbert–Schmidt norms are checked against closed forms.
 * (Book sections and problem numbers are cited from memory.)
 */
import { describe, expect, it } from 'vitest';
import { analyseKernel, honest } from './helpers';

// Reference eigenvalues (see the header).
const logReference = [
  -1.53115965657289, -0.783002554187288, -0.429967918920491, -0.306479175903218,
  -0.233235219156652, -0.190170099520239, -0.159370275155234, -0.137811269947114,
];
const halfPowerReference = [
  2.68291835722487, 1.19659623944771, 0.922185941712752, 0.768647213505212,
  0.677153871825171, 0.609620806075116, 0.560522435582530, 0.520583408422269,
];

describe('log|t − s| on [0, 1]', () => {
  const k = analyseKernel('domain [0, 1]\nkernel logk(t, s) = log(abs(t - s))', { timeBudgetMs: 20_000 });
  const sp = k.spectrum!;
  it('reaches 1e-7 relative to the norm on the eight leading eigenvalues, with honest estimates', () => {
    sp.eigenvalues.forEach((e, i) => {
      const err = Math.abs(e.re - logReference[i]);
      expect(err).toBeLessThan(1e-7 * sp.norm!.value);
      expect(honest(e.error, err, 1e-12 * sp.norm!.value, 300)).toBe(true);
    });
  });
  it('has Hilbert–Schmidt norm² ∫∫ log²|t − s| = 2∫₀¹(1 − u) log²u du = 2(2 − 1/4) = 7/2 (common practice)', () => {
    expect(Math.abs(sp.hsNorm!.value ** 2 - 3.5)).toBeLessThan(1e-7);
  });
  it('has no trace (the diagonal is −∞) and a norm bracket containing |λ₁|', () => {
    expect(sp.trace).toBeNull();
    expect(sp.norm!.lower).toBeLessThanOrEqual(-logReference[0]);
    expect(sp.norm!.upper).toBeGreaterThanOrEqual(-logReference[0]);
  });
});

describe('|t − s|^(−1/2) on [0, 1]', () => {
  const sp = analyseKernel('domain [0, 1]\nkernel half(t, s) = abs(t - s)^(-0.5)', { timeBudgetMs: 20_000 }).spectrum!;
  it('reaches 1e-5 relative to the norm, with honest estimates', () => {
    sp.eigenvalues.forEach((e, i) => {
      const err = Math.abs(e.re - halfPowerReference[i]);
      expect(err).toBeLessThan(1e-5 * sp.norm!.value);
      expect(honest(e.error, err, 1e-9 * sp.norm!.value, 1000)).toBe(true);
    });
  });
  it('is not Hilbert–Schmidt (∫∫ 1/|t − s| diverges), so the HS norm is null', () => {
    expect(sp.hsNorm).toBeNull();
  });
  it('is bounded by Schur’s test: sup_t ∫|t − s|^(−1/2) ds = 2√2 at t = 1/2 (common practice)', () => {
    expect(sp.norm!.upper).toBeLessThanOrEqual(2 * Math.SQRT2 * (1 + 1e-6));
    expect(sp.norm!.upper).toBeGreaterThanOrEqual(halfPowerReference[0]);
  });
});

describe('|t − s|^(−1/4) on [0, 1]', () => {
  const sp = analyseKernel('domain [0, 1]\nkernel quarter(t, s) = abs(t - s)^(-0.25)', { timeBudgetMs: 20_000 }).spectrum!;
  it('is Hilbert–Schmidt with ∫∫|t − s|^(−1/2) = 2∫₀¹(1 − u)u^(−1/2) du = 8/3 (common practice)', () => {
    expect(Math.abs(sp.hsNorm!.value ** 2 - 8 / 3)).toBeLessThan(1e-7);
  });
  it('has trace null (the diagonal is infinite)', () => {
    expect(sp.trace).toBeNull();
  });
});

describe('non-integrable 1/|t − s|', () => {
  it('gets no spectrum', async () => {
    const { analyzeText } = await import('@kernwright/core');
    const r = analyzeText('domain [0, 1]\nkernel bad(t, s) = 1/abs(t - s)');
    expect(r.kernels[0].spectrum).toBeNull();
    expect(r.diagnostics.some((d) => /not integrable|unbounded|not bounded/i.test(d.message))).toBe(true);
  });
});
