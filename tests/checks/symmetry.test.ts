/**
 * The Hermitian check: symbolic recognition of kernels that are Hermitian by construction, the measured defect and
 * worst point of kernels that are not, and the tolerance and severity settings.
 */
import { describe, expect, it } from 'vitest';
import { bindFile, isHermitianByConstruction, parse } from '@kernwright/core';
import { analyse } from './helpers';

function byConstruction(body: string, prelude = ''): boolean {
  const model = bindFile(parse(`domain [0, 1]\n${prelude}kernel k(t, s) = ${body}\n`));
  const ir = model.kernels[0].ir;
  if (!ir) throw new Error(`does not bind: ${body}`);
  return isHermitianByConstruction(ir);
}

describe('Hermitian by construction (no sampling)', () => {
  const hermitian = [
    'exp(-abs(t - s))',
    'exp(-(t - s)^2)',
    'min(t, s)',
    'min(t, s) * (1 - max(t, s))',
    't < s ? t * (1 - s) : s * (1 - t)',
    'exp(i * t) * conj(exp(i * s))',
    'exp(i * t) * exp(-i * s) + 2 * t * s',
    'exp(i * 4 * (t - s)) * exp(-abs(t - s) / 0.6)',
    't < s ? i : -i',
    't * s + t + s',
    '(1 + t * s)^3',
    'cos(t - s) + cosh(s - t)',
    'sin(5 * (t - s)) / (t - s)',
    'i * (t - s)',
    'sign(t - s) * (t - s)',
    'abs(t - s)^(-0.5)',
    '-log(abs(s - t))',
    'g(t - s, 0.3)',
  ];
  for (const body of hermitian) {
    it(body, () => expect(byConstruction(body, 'fn g(x, w) = exp(-x^2 / w^2)\n')).toBe(true));
  }
  const notProven = ['t * s^2', 'exp(t - 2 * s)', 't - s', 'i * t * s', 't < s ? 1 : 0', 'exp(i * (t + s))', 'log(t - s + 2) * i'];
  for (const body of notProven) {
    it(`not ${body}`, () => expect(byConstruction(body)).toBe(false));
  }
});

describe('the measured defect', () => {
  it('t·s² on [0, 1]: ‖K − Kᵀ‖/‖K‖ = 1/(2√2) and the worst point carries both values', () => {
    // By hand: ∫∫ (t s² − s t²)² = 1/15 − 2/16 + 1/15 = 1/120 and ∫∫ (t s²)² = 1/15, so the ratio is (1/8)^½.
    const r = analyse('kernel k(t, s) = t * s^2');
    const h = r.kernel('k').hermitian!;
    expect(h.holds).toBe(false);
    expect(h.method).toBe('numeric');
    expect(h.defect).toBeCloseTo(1 / (2 * Math.SQRT2), 12);
    const w = h.worst!;
    expect(w.value.re).toBeCloseTo(w.t * w.s ** 2, 14);
    expect(w.mirrored.re).toBeCloseTo(w.s * w.t ** 2, 14);
    // |t s² − s t²| = t s |s − t| is largest at the far corner of the grid: t s |s − t| ≤ 4/27 (s = 1, t = 1/3, or mirrored).
    expect(Math.abs(w.value.re - w.mirrored.re)).toBeGreaterThan(0.14);
    const d = r.diagnostics('k').find((x) => x.code === 'KW501')!;
    expect(d.severity).toBe('info');
    expect(d.figures).toMatchObject({ defect: h.defect, t: w.t, s: w.s });
    expect(d.fixes?.[0].kind).toBe('symmetrize');
  });

  it('a complex kernel that is not Hermitian: compares with conj K(s, t)', () => {
    const r = analyse('kernel k(t, s) = exp(i * (t + s))');
    const h = r.kernel('k').hermitian!;
    expect(h.holds).toBe(false);
    const w = h.worst!;
    // K(t, s) = e^{i(t+s)} and conj K(s, t) = e^{−i(t+s)} differ by 2|sin(t + s)|.
    expect(Math.hypot(w.value.re - w.mirrored.re, w.value.im - w.mirrored.im)).toBeCloseTo(2 * Math.abs(Math.sin(w.t + w.s)), 12);
    expect(w.mirrored.im).toBeCloseTo(-Math.sin(w.t + w.s), 12);
    expect(r.diagnostics('k').find((x) => x.code === 'KW501')!.message).toContain('is not Hermitian');
  });

  it('recognises numerically a symmetric kernel that the symbolic test cannot prove', () => {
    // sinh x − eˣ = −cosh x, so this is exp(−|t − s|) written in a form whose mirror image looks different.
    const r = analyse('kernel k(t, s) = cosh(t - s) + sinh(t - s) - exp(t - s) + exp(-abs(t - s))');
    expect(r.kernel('k').hermitian).toMatchObject({ holds: true, method: 'numeric' });
    expect(r.kernel('k').hermitian!.defect).toBeLessThan(1e-13);
    expect(r.codes('k')).not.toContain('KW501');
  });
});

describe('tolerance and severity settings', () => {
  // exp(−|t − s|) + 10⁻⁷ t: the defect is about 10⁻⁷·‖t − s‖/‖K‖, far above 10⁻⁹ and far below 10⁻⁵.
  const body = 'kernel k(t, s) = exp(-abs(t - s)) + 1e-7 * t';
  it('decides with the hermitianTolerance setting', () => {
    const strict = analyse(body).kernel('k').hermitian!;
    expect(strict.holds).toBe(false);
    expect(strict.defect).toBeGreaterThan(1e-8);
    expect(strict.defect).toBeLessThan(1e-6);
    expect(analyse(body, { hermitianTolerance: 1e-5 }).kernel('k').hermitian!.holds).toBe(true);
  });
  it('sets or silences the severity of the finding', () => {
    expect(analyse(body, { severities: { 'not-hermitian': 'warning' } }).diagnostics('k').find((d) => d.code === 'KW501')?.severity).toBe('warning');
    expect(analyse(body, { severities: { KW501: 'off' } }).codes('k')).not.toContain('KW501');
  });
  it('never relaxes a failed claim', () => {
    const r = analyse(`${body}\n  expect hermitian`, { severities: { 'hermitian-claim-failed': 'hint' } });
    expect(r.diagnostics('k').find((d) => d.code === 'KW601')?.severity).toBe('error');
  });
});

describe('the measured defect carries an error estimate that covers the closed-form value', () => {
  // ‖K − K*‖²/(½‖K‖² + ½‖K*‖²) in closed form (integrals worked by hand, common practice).
  const ea = ((Math.E ** 2 - 1) / 2) * ((1 - Math.E ** -4) / 4); // ∫∫ e^{2t − 4s}
  const eb = (1 - 1 / Math.E) ** 2; // ∫∫ e^{−t − s}
  const cases: [string, number][] = [
    ['t * s^2', Math.sqrt(1 / 8)], // ∫∫ t²s²(s − t)² = 1/120 over ∫∫ t²s⁴ = 1/15
    ['exp(t - 2 * s)', Math.sqrt(2 - (2 * eb) / ea)],
    ['s < t ? 1 : 0', Math.SQRT2], // |K − K*| = 1 off the diagonal; ½(½ + ½) below
  ];
  for (const [body, exact] of cases) {
    it(`${body}: defect ${exact.toPrecision(8)}`, () => {
      const h = analyse(`domain [0, 1]\nkernel k(t, s) = ${body}\n`).kernel('k').hermitian!;
      expect(h.method).toBe('numeric');
      expect(h.holds).toBe(false);
      expect(Math.abs(h.defect - exact)).toBeLessThanOrEqual(h.defectError);
      expect(h.defectError).toBeLessThan(0.05 * exact);
    });
  }
});
