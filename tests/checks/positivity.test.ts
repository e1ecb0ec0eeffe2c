/**
 * Positive semidefiniteness: the most negative eigenvalue against an independent computation, point certificates
 * checked on the kernel itself, Mercer's trace identity and the effective rank against closed forms, the tolerance
 * setting, and the Mercer note from hand-made facts.
 */
import { describe, expect, it } from 'vitest';
import { eigs } from 'mathjs';
import { positivityFindings, type PositivityFacts } from '../../src-core/checks/positivity';
import { analyse } from './helpers';

/** Eigenvalues of a real square matrix by mathjs, as numbers (imaginary parts must vanish). */
function realEigenvalues(m: number[][]): number[] {
  const values = eigs(m).values as unknown as (number | { re: number; im: number })[] | { toArray(): (number | { re: number; im: number })[] };
  const list = Array.isArray(values) ? values : values.toArray();
  return list.map((v) => {
    if (typeof v === 'number') return v;
    expect(Math.abs(v.im)).toBeLessThan(1e-12);
    return v.re;
  }).sort((a, b) => a - b);
}

describe('an indefinite continuous kernel: cos 3(t − s) − 1/2 on [0, 1]', () => {
  // K = Σ_j d_j f_j(t) f_j(s) with f = (cos 3t, sin 3t, 1), d = (1, 1, −1/2): the nonzero eigenvalues are those of
  // D·G with the Gram matrix G_ij = ∫ f_i f_j (degenerate kernels: K. Atkinson, The Numerical Solution of Integral
  // Equations of the Second Kind, 1997, §2.1). The integrals in closed form:
  const s6 = Math.sin(6);
  const G = [
    [0.5 + s6 / 12, (1 - Math.cos(6)) / 12, Math.sin(3) / 3],
    [(1 - Math.cos(6)) / 12, 0.5 - s6 / 12, (1 - Math.cos(3)) / 3],
    [Math.sin(3) / 3, (1 - Math.cos(3)) / 3, 1],
  ];
  const d = [1, 1, -0.5];
  const reference = realEigenvalues(G.map((row, i) => row.map((x) => d[i] * x)));
  const r = analyse('kernel k(t, s) = cos(3 * (t - s)) - 0.5');
  const p = r.kernel('k').positive!;

  it('has exactly one negative eigenvalue (Sylvester’s law of inertia), found with its error', () => {
    expect(reference.filter((x) => x < 0)).toHaveLength(1);
    expect(p.holds).toBe(false);
    expect(Math.abs(p.minEigenvalue!.value - reference[0])).toBeLessThanOrEqual(Math.max(p.minEigenvalue!.error, 1e-13));
  });

  it('gives a 2 × 2 minor that proves it, which the kernel itself confirms', () => {
    const c = p.certificate!;
    expect(c.kind).toBe('minor');
    const K = (t: number, s: number) => Math.cos(3 * (t - s)) - 0.5;
    const excess = K(c.t, c.s) ** 2 - K(c.t, c.t) * K(c.s, c.s);
    expect(excess).toBeCloseTo(c.margin, 10);
    expect(excess).toBeGreaterThan(1.9);
  });

  it('is information, not a warning: negative values make it no covariance look-alike', () => {
    expect(r.diagnostics('k').find((x) => x.code === 'KW531')?.severity).toBe('info');
  });
});

describe('diagonal certificate', () => {
  it('K(t, t) < 0 somewhere proves a continuous kernel not positive', () => {
    const r = analyse('kernel k(t, s) = t * s - 0.25');
    const c = r.kernel('k').positive!.certificate!;
    expect(c.kind).toBe('diagonal');
    expect(c.t).toBe(c.s);
    expect(c.t * c.t - 0.25).toBeLessThan(0);
    expect(c.margin).toBeCloseTo(0.25 - c.t * c.t, 12);
  });
});

describe('covariance look-alikes', () => {
  it('a box (non-negative, largest on the diagonal) that is not positive gets a warning', () => {
    const r = analyse('kernel box(t, s) = abs(t - s) < 0.3 ? 1 : 0');
    const d = r.diagnostics('box').find((x) => x.code === 'KW530')!;
    expect(d.severity).toBe('warning');
    expect(r.kernel('box').positive!.minEigenvalue!.value).toBeLessThan(-0.05);
  });
  it('a difference of Gaussians (negative values) is only information', () => {
    const r = analyse('domain [-5, 5]\nkernel hat(t, s) = 1.2 * exp(-(t - s)^2 / 0.5) - 0.6 * exp(-(t - s)^2 / 4.5)');
    expect(r.codes('hat')).toContain('KW531');
    expect(r.codes('hat')).not.toContain('KW530');
  });
});

describe('Mercer’s trace identity and the effective rank', () => {
  it('Brownian motion min(t, s): trace 1/2 = Σ λ_k, and the counts follow λ_k = 1/((k − 1/2)² π²)', () => {
    // Karhunen–Loève expansion of Brownian motion on [0, 1] (from memory; common practice).
    const lambda = (k: number) => 1 / ((k - 0.5) ** 2 * Math.PI ** 2);
    const count = (fraction: number) => {
      let cum = 0;
      for (let k = 1; ; k++) if ((cum += lambda(k)) >= fraction * 0.5) return k;
    };
    const r = analyse('kernel w(t, s) = min(t, s)');
    const p = r.kernel('w').positive!;
    expect(p.holds).toBe(true);
    expect(p.mercer!.holds).toBe(true);
    expect(p.mercer!.trace.value).toBeCloseTo(0.5, 13);
    expect(Math.abs(p.mercer!.sum.value - 0.5)).toBeLessThanOrEqual(3 * p.mercer!.sum.error);
    const e = r.kernel('w').effectiveRank!;
    expect(e.p90).toBe(count(0.9));
    expect(e.p90).toBe(2);
    // The 99 % count needs about 21 modes: reported when resolved, never smaller than the true count.
    if (e.p99 !== null) expect(e.p99).toBe(count(0.99));
    else expect(e.resolvedModes).toBeLessThan(count(0.99));
  });

  it('a finite sine series with eigenvalues 1/2, 1/4, …, 1/32: the counts 3, 5, 5', () => {
    // √2 sin(kπt) are orthonormal on [0, 1], so K = Σ c_k sin(kπt) sin(kπs) has the eigenvalues c_k / 2.
    const body = [1, 0.5, 0.25, 0.125, 0.0625].map((c, k) => `${c} * sin(${k + 1} * pi * t) * sin(${k + 1} * pi * s)`).join(' + ');
    const r = analyse(`kernel sines(t, s) = ${body}\n  expect rank = 5`);
    const k = r.kernel('sines');
    expect(k.spectrum!.eigenvalues.map((e) => e.re)).toEqual([0.5, 0.25, 0.125, 0.0625, 0.03125].map((x) => expect.closeTo(x, 12)));
    expect(k.positive!.mercer!.trace.value).toBeCloseTo(31 / 32, 12);
    expect(k.effectiveRank).toMatchObject({ p90: 3, p99: 5, p999: 5 });
    expect(r.codes('sines')).not.toContain('KW607');
  });

  it('notes a mismatch beyond the error estimates (hand-made facts)', () => {
    const facts: PositivityFacts = {
      report: {
        holds: true, minEigenvalue: { value: 0, error: 1e-15 }, certificate: null,
        mercer: { trace: { value: 0.5, error: 1e-15 }, sum: { value: 0.45, error: 1e-6 }, holds: false },
      },
      effectiveRank: null, looksLikeCovariance: true, evidence: null, galerkinCount: 24,
    };
    const findings = positivityFindings({ name: 'k' }, facts, true);
    expect(findings.map((f) => f.name)).toEqual(['mercer-mismatch']);
    expect(findings[0].args).toMatchObject({ count: 24, trace: '0.5 ± 1e-15', sum: '0.45 ± 1e-6' });
    const agreeing = { ...facts, report: { ...facts.report, mercer: { ...facts.report.mercer!, holds: true } } };
    expect(positivityFindings({ name: 'k' }, agreeing, true)).toEqual([]);
  });
});

describe('the tolerance setting', () => {
  // t·s − ε t²s² with ε = 10⁻⁶: D·G = [[1/3, −ε/4], [1/4, −ε/5]] has det −ε/240, so the negative eigenvalue is
  // about −ε/80 = −1.25·10⁻⁸, that is −3.75·10⁻⁸ ‖T‖.
  const body = 'kernel k(t, s) = t * s - 1e-6 * t^2 * s^2';
  const eps = 1e-6;
  const reference = realEigenvalues([[1 / 3, 1 / 4], [-eps / 4, -eps / 5]]);

  it('counts −3.75·10⁻⁸ ‖T‖ as negative by default (tolerance 10⁻⁸)', () => {
    const p = analyse(body).kernel('k').positive!;
    expect(p.holds).toBe(false);
    expect(Math.abs(p.minEigenvalue!.value - reference[0])).toBeLessThanOrEqual(Math.max(p.minEigenvalue!.error, 1e-16));
    // The kernel itself proves it too: |K(t, s)|² − K(t, t)K(s, s) = ε t²s²(t − s)² > 0.
    expect(p.certificate?.kind).toBe('minor');
  });
  it('and as zero with positivityTolerance 10⁻⁶', () => {
    expect(analyse(body, { positivityTolerance: 1e-6 }).kernel('k').positive!.holds).toBe(true);
  });
});

describe('kernels that are not Hermitian', () => {
  it('are not positive, and no minimum eigenvalue is reported', () => {
    const r = analyse('kernel k(t, s) = exp(t - 2 * s)\n  expect positive');
    expect(r.kernel('k').positive).toMatchObject({ holds: false, minEigenvalue: null });
    expect(r.diagnostics('k').find((d) => d.code === 'KW602')!.message).toContain('it is not Hermitian');
  });
});
