/**
 * Reference cases for Volterra-type kernels (K = 0 on one side of the diagonal), the zero kernel, and resolvent
 * claims decided from spectral enclosures. Kernels are invented test inputs; reference values are closed forms with
 * their source, or the numpy Nyström values in tests/reference/data/volterra.json (tests/reference/scripts/volterra.py:
 * trapezoidal Nyström on T*T and on TT* with Richardson extrapolation; the two independent discretisations agree to
 * the `error` stored beside each value, about 1e-13).
 *
 * Facts used (from memory):
 *  - A Volterra operator with a square-integrable kernel on a finite interval is quasinilpotent: spectrum {0}, no
 *    nonzero eigenvalue (F. G. Tricomi, Integral Equations, 1957, ch. I; common practice).
 *  - The integration operator (Vf)(t) = ∫_0^t f on L²[0, 1] has norm 2/π, its singular values being 2/((2n − 1)π)
 *    (P. R. Halmos, A Hilbert Space Problem Book, 1967, Problem 188 in the 1982 edition). On an interval of length L
 *    the norm is 2L/π (the unitary change of variable t = a + L·x scales the operator by L).
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { analyzeText, type FileAnalysis, type KernelReport } from '@kernwright/core';

interface RefCase { readonly norm: number; readonly error: number; readonly expression: string }
const data = JSON.parse(readFileSync(join(__dirname, 'data', 'volterra.json'), 'utf8')) as { cases: Record<string, RefCase> };

const text = `# Invented test kernels: Volterra-type operators, the zero kernel, resolvent claims.
kernel integ(t, s) on [0, 1] = t > s ? 1 : 0
kernel upper(t, s) on [2, 5] = s > t ? 1 : 0
kernel shifted(t, s) on [0, 1] = s > t + 0.5 ? 1 : 0
kernel phase(t, s) on [0, 1] = t > s ? exp(i * (t - s)) : 0
kernel vcos(t, s) on [0, 1] = t > s ? cos(t - s) : 0
  expect resolvent 0.01, resolvent 0.5 + 0.2 * i
kernel vcos0(t, s) on [0, 1] = t > s ? cos(t - s) : 0
  expect resolvent 0
kernel vsq(t, s) on [0, 1] = s < t ? (t - s)^2 + 1 : 0
kernel vexp(t, s) on [0, 1] = (t >= s) * exp(t - s)
kernel heav(t, s) on [0, 1] = (1 + sign(t - s)) / 2
kernel vramp(t, s) on [0, 2] = max(t - s, 0)
kernel zero(t, s) on [0, 1] = 0
  expect positive, hermitian, continuous, resolvent 1
kernel zero0(t, s) on [0, 1] = 0
  expect resolvent 0
kernel riesz(t, s) on [0, 1] = abs(t - s)^(-0.3)
  expect resolvent -0.0001, resolvent 0.00001 * i
kernel ou(t, s) on [0, 1] = exp(-abs(t - s))
  expect resolvent -0.000001
`;

let analysis: FileAnalysis;
const kernel = (name: string): KernelReport => analysis.kernels.find((k) => k.name === name)!;
const onClaims = (name: string) => {
  const k = kernel(name);
  return analysis.diagnostics.filter((d) => d.range.start >= k.range.start && d.range.end <= k.range.end);
};

/** Every number in a report, at any depth (JSON.stringify would turn NaN into null). */
function numbersIn(x: unknown, out: number[] = []): number[] {
  if (typeof x === 'number') out.push(x);
  else if (Array.isArray(x)) for (const v of x) numbersIn(v, out);
  else if (x && typeof x === 'object') for (const v of Object.values(x)) numbersIn(v, out);
  return out;
}

beforeAll(() => {
  analysis = analyzeText(text);
});

/** Volterra cases: name, reference norm and its error, Hilbert–Schmidt norm when known in closed form. */
const volterra: { name: string; norm: number; refError: number; hs: number | null; source: string; continuous?: boolean }[] = [
  { name: 'integ', norm: 2 / Math.PI, refError: 0, hs: Math.SQRT1_2, source: 'Halmos, Problem 188: 2/π; HS² = area of the triangle = 1/2' },
  { name: 'upper', norm: 6 / Math.PI, refError: 0, hs: 3 * Math.SQRT1_2, source: 'adjoint of the integration operator on an interval of length 3: 2·3/π; HS² = 9/2' },
  { name: 'shifted', norm: 1 / Math.PI, refError: 0, hs: 0.5 * Math.SQRT1_2, source: '(Tf)(t) = ∫_{t+1/2}^1 f: the integration operator on an interval of length 1/2 between isometries, 2·(1/2)/π; HS² = 1/8' },
  { name: 'phase', norm: 2 / Math.PI, refError: 0, hs: Math.SQRT1_2, source: 'e^{i t} V e^{−i s}: unitarily equivalent to the integration operator, 2/π' },
  { name: 'vcos', norm: data.cases.vcos.norm, refError: data.cases.vcos.error, hs: null, source: 'numpy Nyström (volterra.json)' },
  { name: 'vsq', norm: data.cases.vsq.norm, refError: data.cases.vsq.error, hs: null, source: 'numpy Nyström (volterra.json)' },
  { name: 'vexp', norm: data.cases.vexp.norm, refError: data.cases.vexp.error, hs: null, source: 'numpy Nyström (volterra.json)' },
  { name: 'heav', norm: 2 / Math.PI, refError: 0, hs: Math.SQRT1_2, source: 'the integration operator written with sign: 2/π' },
  { name: 'vramp', norm: data.cases.vramp.norm, refError: data.cases.vramp.error, hs: Math.sqrt(4 / 3), source: 'numpy Nyström (volterra.json); HS² = ∫₀²∫₀ᵗ (t − s)² ds dt = 4/3', continuous: true },
];

describe('reference data', () => {
  it('the Nyström script reproduces the closed form 2/π of the integration operator (Halmos, Problem 188)', () => {
    expect(Math.abs(data.cases.integ.norm - 2 / Math.PI)).toBeLessThanOrEqual(data.cases.integ.error);
    expect(data.cases.integ.error).toBeLessThan(1e-12);
  });
});

describe('Volterra-type kernels: no nonzero eigenvalues, the norm with an error that covers it', () => {
  for (const c of volterra) {
    it(`${c.name}: σ(T) = {0}, ‖T‖ = ${c.norm.toPrecision(8)} (${c.source})`, () => {
      const k = kernel(c.name);
      expect(k.hermitian!.holds).toBe(false);
      expect(k.positive!.holds).toBe(false); // not self-adjoint, so not positive
      expect(k.boundedness!.class).toBe('hilbert-schmidt');
      expect(k.continuity!.class).toBe(c.continuous ? 'continuous' : 'jump');
      const s = k.spectrum!;
      expect(s.quasinilpotent).toBeDefined();
      expect(s.quasinilpotent!.reason).toContain('σ(T) = {0}');
      expect(s.eigenvalues).toEqual([]);
      expect(s.eigenfunctions).toBeNull();
      const n = s.norm!;
      expect(Math.abs(n.value - c.norm)).toBeLessThanOrEqual(n.error + c.refError);
      expect(n.error / n.value).toBeLessThan(1e-10);
      expect(n.lower).toBeLessThanOrEqual(c.norm + c.refError);
      expect(n.upper).toBeGreaterThanOrEqual(c.norm - c.refError);
      if (c.hs !== null) expect(Math.abs(s.hsNorm!.value - c.hs)).toBeLessThanOrEqual(s.hsNorm!.error);
      // The norm converged, so no accuracy note (KW401) about spurious eigenvalues.
      expect(analysis.diagnostics.some((d) => d.code === 'KW401' && d.message.includes(`“${c.name}”`))).toBe(false);
    });
  }

  // floor(t − s + 1) is 1 for t ≥ s and 0 for t < s on [0, 1]², so this is the vcos kernel in a form the
  // expression reader does not see through: its true spectrum is {0} and its norm that of vcos.
  it('a triangular kernel seen only on the grid: every eigenvalue error covers 0, the accuracy note says so', () => {
    const r = analyzeText('kernel k(t, s) on [0, 1] = floor(t - s + 1) * cos(t - s)\n');
    const s = r.kernels[0].spectrum!;
    expect(s.quasinilpotent).toBeUndefined();
    expect(s.converged).toBe(false);
    for (const e of s.eigenvalues) expect(Math.hypot(e.re, e.im)).toBeLessThanOrEqual(e.error);
    expect(r.diagnostics.some((d) => d.code === 'KW401')).toBe(true);
    expect(Math.abs(s.norm!.value - data.cases.vcos.norm)).toBeLessThanOrEqual(s.norm!.error + data.cases.vcos.error);
  });

  // The Riemann–Liouville integral of order 0.7, up to a factor: weakly singular on the diagonal only, so
  // quasinilpotent (R. Kress, Linear Integral Equations, 1989, on Abel's equation; from memory).
  it('a Volterra kernel weakly singular on the diagonal is quasinilpotent too', () => {
    const r = analyzeText('kernel k(t, s) on [0, 1] = t > s ? (t - s)^(-0.3) : 0\n');
    expect(r.kernels[0].spectrum!.quasinilpotent).toBeDefined();
    expect(r.kernels[0].spectrum!.eigenvalues).toEqual([]);
  });

  // (Tf)(t) = (1/t)∫_0^t f is Hardy's averaging operator: bounded, not compact, its spectrum is not {0} (common
  // practice; G. H. Hardy, J. E. Littlewood & G. Pólya, Inequalities, 1934, §9.8 for the norm 2 on L²(0, ∞)).
  it('a triangular kernel singular off the diagonal (Hardy’s operator) is not called quasinilpotent', () => {
    const r = analyzeText('kernel k(t, s) on [0, 1] = t > s ? 1 / t : 0\n');
    const s = r.kernels[0].spectrum;
    if (s) {
      expect(s.quasinilpotent).toBeUndefined();
      for (const e of s.eigenvalues) expect(Math.hypot(e.re, e.im)).toBeLessThanOrEqual(e.error);
    }
  });

  it('a kernel with a comparison that does not give triangular support keeps its eigenvalues', () => {
    const r = analyzeText('kernel k(t, s) on [0, 1] = t > s ? 1 : 0.5\n');
    expect(r.kernels[0].spectrum!.quasinilpotent).toBeUndefined();
    expect(r.kernels[0].spectrum!.eigenvalues.length).toBeGreaterThan(0);
  });
});

describe('resolvent claims decided from the spectral enclosure', () => {
  it('μ ≠ 0 on a Volterra-type kernel holds, with dist(μ, σ(T)) = |μ| and a converging Neumann series', () => {
    const k = kernel('vcos');
    expect(k.resolvent.map((r) => r.inResolventSet)).toEqual([true, true]);
    expect(k.resolvent[0].distance).toEqual({ value: 0.01, error: 0 });
    expect(k.resolvent[1].distance!.value).toBeCloseTo(Math.hypot(0.5, 0.2), 14);
    expect(k.resolvent.every((r) => r.neumannConverges === true)).toBe(true);
    expect(onClaims('vcos').filter((d) => d.code === 'KW609')).toEqual([]);
  });

  it('μ = 0 on a Volterra-type kernel fails (0 is in the spectrum of a compact operator)', () => {
    expect(kernel('vcos0').resolvent[0].inResolventSet).toBe(false);
    expect(onClaims('vcos0').some((d) => d.code === 'KW608')).toBe(true);
  });

  // |t − s|^(−α), 0 < α < 1, is a positive definite kernel (its Fourier transform is positive; common practice).
  it('μ < 0 on a kernel found positive holds, with ‖(μ − T)⁻¹‖ = 1/|μ|', () => {
    const k = kernel('riesz');
    expect(k.positive!.holds).toBe(true);
    const [neg, imag] = k.resolvent;
    expect(neg.inResolventSet).toBe(true);
    expect(Math.abs(neg.distance!.value - 1e-4)).toBeLessThanOrEqual(neg.distance!.error);
    expect(Math.abs(neg.resolventNorm!.value - 1e4)).toBeLessThanOrEqual(neg.resolventNorm!.error);
    // A Hermitian operator has real spectrum: a non-real μ is in the resolvent set however small it is.
    expect(imag.inResolventSet).toBe(true);
    expect(onClaims('riesz').filter((d) => d.code === 'KW609')).toEqual([]);
  });

  // exp(−|t − s|) is the Ornstein–Uhlenbeck covariance, positive definite (common practice).
  it('a tiny negative μ on a positive covariance holds', () => {
    const k = kernel('ou');
    expect(k.positive!.holds).toBe(true);
    expect(k.resolvent[0].inResolventSet).toBe(true);
  });

  it('a small positive μ among the unresolved eigenvalues stays undecided', () => {
    const r = analyzeText('kernel k(t, s) on [0, 1] = abs(t - s)^(-0.3)\n  expect resolvent 0.00001\n');
    expect(r.kernels[0].resolvent[0].inResolventSet).toBeNull();
    expect(r.diagnostics.some((d) => d.code === 'KW609')).toBe(true);
  });
});

describe('the zero kernel', () => {
  it('is Hermitian, positive (trivially), continuous and Hilbert–Schmidt, with norm 0 ± 0 and no NaN anywhere', () => {
    const k = kernel('zero');
    expect(k.hermitian!.holds).toBe(true);
    expect(k.positive!.holds).toBe(true);
    expect(k.positive!.minEigenvalue).toEqual({ value: 0, error: 0 });
    expect(k.continuity!.class).toBe('continuous');
    expect(k.boundedness!.class).toBe('hilbert-schmidt');
    expect(k.spectrum!.norm!.value).toBe(0);
    expect(k.spectrum!.norm!.error).toBe(0);
    expect(k.spectrum!.eigenvalues).toEqual([]);
    const claims = onClaims('zero');
    expect(claims.filter((d) => d.severity === 'error' || d.code === 'KW609')).toEqual([]);
    expect(k.resolvent[0].inResolventSet).toBe(true);
    for (const d of [...claims, ...onClaims('zero0')]) expect(d.message).not.toMatch(/NaN/);
    expect(numbersIn(k).filter((x) => Number.isNaN(x))).toEqual([]);
  });

  it('fails resolvent 0', () => {
    expect(kernel('zero0').resolvent[0].inResolventSet).toBe(false);
  });
});
