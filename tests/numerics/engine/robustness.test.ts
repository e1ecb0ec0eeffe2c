/**
 * Robustness of the numerical engine on extreme values: every input gets an answer (figures or a diagnostic),
 * never a hang or an internal error. Kernels are invented test inputs.
 */
import { describe, expect, it } from 'vitest';
import { analyzeText } from '@kernwright/core';

const analyse = (body: string) => analyzeText(`domain [0, 1]\nkernel k(t, s) = ${body}\n`);

describe('tiny kernels (subnormal products)', () => {
  // A constant kernel c on [a, b] has rank one with λ₁ = c·(b − a) and eigenfunction 1/√(b − a) (common practice).
  it('1e-300 gets λ₁ = 1e-300 with an error estimate covering it', () => {
    const r = analyse('1e-300');
    const k = r.kernels[0];
    expect(k.spectrum).not.toBeNull();
    const l1 = k.spectrum!.eigenvalues[0];
    expect(Math.abs(l1.re - 1e-300)).toBeLessThanOrEqual(Math.max(l1.error, 1e-312));
    expect(Math.abs(l1.re - 1e-300)).toBeLessThan(1e-310);
  });

  // t·s on [0, 1]: rank one, λ₁ = ∫₀¹ t² dt = 1/3 (common practice); scaled by 1e-200.
  it('1e-200·t·s gets λ₁ = 1e-200/3', () => {
    const k = analyse('1e-200*t*s').kernels[0];
    const l1 = k.spectrum!.eigenvalues[0];
    expect(Math.abs(l1.re - 1e-200 / 3)).toBeLessThan(1e-212);
  });
});

describe('huge but finite kernels', () => {
  // t·s on [0, 1]: rank one, λ₁ = 1/3 (common practice); scaled by 1e307 the entries' squares overflow.
  it('1e307·t·s gets λ₁ = 1e307/3', () => {
    const k = analyse('1e307*t*s').kernels[0];
    const l1 = k.spectrum!.eigenvalues[0];
    expect(Math.abs(l1.re - 1e307 / 3)).toBeLessThanOrEqual(Math.max(l1.error, 1e295));
  });
});

describe('floor of a huge argument', () => {
  // Every double of magnitude at least 2^52 is an integer (IEEE 754 binary64, common practice): on [0, 1],
  // s + 1e17 rounds to 1e17 or the next double, so the kernel is (numerically) the constant 1e17, rank one,
  // λ₁ = 1e17 on [0, 1].
  it('floor(s + 1e17) returns with honest figures', () => {
    const k = analyse('floor(s + 1e17)').kernels[0];
    const l1 = k.spectrum!.eigenvalues[0];
    expect(Math.abs(l1.re - 1e17)).toBeLessThanOrEqual(Math.max(l1.error, 64));
  });
});

describe('values that overflow on part of the square', () => {
  for (const body of ['exp(700*t*s)', 'exp(710*t)*s', '1e200*t*s*1e200', 'exp(400*(t+s))', '1e307*t*s', '1e154*(t+s)']) {
    it(`${body}: no internal error, figures finite or a diagnostic`, () => {
      const r = analyse(body);
      const k = r.kernels[0];
      expect(r.diagnostics.some((d) => d.severity === 'error')).toBe(false);
      if (k.spectrum) {
        for (const e of k.spectrum.eigenvalues) expect(Number.isFinite(e.re)).toBe(true);
        expect(Number.isFinite(k.spectrum.norm?.value ?? 0)).toBe(true);
      } else {
        expect(r.diagnostics.some((d) => d.code.startsWith('KW3') || d.code.startsWith('KW5'))).toBe(true);
      }
    });
  }

  // exp(400(t + s)) is finite in double precision only where t + s < ln(1.8e308)/400 ≈ 1.774 (common practice).
  it('exp(400*(t+s)) is reported as an evaluation fault with a point', () => {
    const r = analyse('exp(400*(t+s))');
    expect(r.diagnostics.some((d) => d.code === 'KW301')).toBe(true);
  });
});

describe('symmetry defect of huge kernels', () => {
  // sin(t − s) is antisymmetric: ‖K − K*‖/‖K‖ = 2 exactly (common practice), whatever the scale.
  it('1e308·sin(t − s) gets defect 2, not NaN', () => {
    const k = analyse('1e308*sin(t-s)').kernels[0];
    expect(k.hermitian).not.toBeNull();
    expect(Math.abs(k.hermitian!.defect - 2)).toBeLessThan(1e-6);
  });
});
