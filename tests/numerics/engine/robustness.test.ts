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

describe('scaled analysis of extreme kernels (figures scaled back by a power of two)', () => {
  // exp(−|t − s|) on [0, 1]: trace ∫ K(t, t) dt = 1 (common practice); ‖K‖_HS² = 2∫₀¹(1 − u)e^(−2u) du
  // = (1 + e^(−2))/2 (closed form, common practice).
  const hs = Math.sqrt((1 + Math.exp(-2)) / 2);
  for (const c of [1e250, 1e-250, 1e300, 1e-300]) {
    it(`${c}·exp(−|t − s|): finite trace and Hilbert–Schmidt norm that cover the closed forms`, () => {
      const s = analyse(`${c} * exp(-abs(t - s))`).kernels[0].spectrum!;
      expect(Math.abs(s.trace!.value - c)).toBeLessThanOrEqual(s.trace!.error + c * 1e-15);
      expect(Math.abs(s.hsNorm!.value - c * hs)).toBeLessThanOrEqual(s.hsNorm!.error + c * 1e-15);
    });
  }

  // A subnormal kernel without a constant factor: its errors carry the absolute floor of subnormal rounding, so
  // they cover the value (here only known to a few digits), and the ladder stops once at that floor.
  it('exp(−740)·e^(t s) in one expression: errors cover λ₁ to the few digits it has', () => {
    const k = analyse('exp(t * s - 740)').kernels[0];
    const l1 = k.spectrum!.eigenvalues[0];
    // λ₁ = 5.66749e-322 by mpmath Gauss–Legendre Nyström at 24 and 32 points (tests/reference/scripts/scale.py).
    expect(Math.abs(l1.re - 5.667491409978441e-322)).toBeLessThanOrEqual(l1.error + 2 ** -1074);
    expect(l1.error).toBeGreaterThan(0);
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

describe('caps on loci, with a diagnostic when one is hit', () => {
  // floor(100·t) on [0, 1]: K(t, s) = f(t)·1 has rank one, and its only nonzero eigenvalue is ∫₀¹ f(t) dt
  // (common practice for a rank-one kernel f(t)g(s): λ = ∫ f g) = Σ_{k=0}^{99} k/100 = 49.5. floor jumps along 99
  // lines, more than the 64 followed one by one.
  it('floor(100·t): KW404 on the floor, and λ₁ = 49.5 within its error', () => {
    const text = 'domain [0, 1]\nkernel k(t, s) = floor(100*t)\n';
    const r = analyzeText(text);
    const cap = r.diagnostics.find((d) => d.code === 'KW404');
    expect(cap).toBeDefined();
    expect(text.slice(cap!.range.start, cap!.range.end)).toBe('floor(100*t)');
    expect(cap!.figures).toMatchObject({ lines: 99, cap: 64 });
    const l1 = r.kernels[0].spectrum!.eigenvalues[0];
    expect(Math.abs(l1.re - 49.5)).toBeLessThanOrEqual(l1.error);
  });

  // The analysis is cached by the kernel's definition, across documents: the second document, where the same
  // kernel sits further down, must get the range of its own floor (a fuzz run found the first one's range there).
  it('the same kernel in two documents: each KW404 lies on its own floor', () => {
    const first = 'domain [0, 1]\nkernel k(t, s) = floor(100*t)\n';
    const second = '# a comment that moves the kernel\n\ndomain [0, 1]\nkernel k(t, s) = floor(100*t)\n';
    for (const text of [first, second]) {
      const cap = analyzeText(text).diagnostics.find((d) => d.code === 'KW404');
      expect(text.slice(cap!.range.start, cap!.range.end)).toBe('floor(100*t)');
    }
  });

  // Four floors with about 250 distinct axis-parallel jump lines together: more panels than the resolution cap
  // (384 unknowns) allows even at degree 1, so the mesh follows none of them (KW405) and refines uniformly. The trace
  // ∫₀¹ K(t, t) dt is a sum of ∫₀¹ floor(c·t) dt = (Σ_{k<⌊c⌋} k/c) + ⌊c⌋(1 − ⌊c⌋/c), computed here by that sum.
  it('about 250 jump lines: KW405, no level beyond the resolution cap, and the trace right within its error', () => {
    const cs = [64.5, 63.7, 62.9, 61.1];
    const text = `domain [0, 1]\nkernel k(t, s) = floor(${cs[0]}*t) + floor(${cs[1]}*s) + floor(${cs[2]}*t) + floor(${cs[3]}*s)\n`;
    const r = analyzeText(text);
    const cap = r.diagnostics.find((d) => d.code === 'KW405');
    expect(cap).toBeDefined();
    expect(cap!.figures).toMatchObject({ followed: 0 });
    const spectrum = r.kernels[0].spectrum!;
    const n = Number(/N = (\d+)/.exec(spectrum.method)?.[1]);
    expect(n).toBeLessThanOrEqual(384);
    const floorIntegral = (c: number) => {
      const m = Math.floor(c);
      let sum = 0;
      for (let k = 0; k < m; k++) sum += k / c;
      return sum + m * (1 - m / c);
    };
    const trace = cs.reduce((acc, c) => acc + floorIntegral(c), 0);
    expect(spectrum.trace).not.toBeNull();
    expect(Math.abs(spectrum.trace!.value - trace)).toBeLessThanOrEqual(spectrum.trace!.error);
  });
});

describe('a domain so wide that the Galerkin entries overflow', () => {
  // Found by the fuzz run (fuzz/found/crash-cli-1102): the solvers met infinite entries and threw.
  it('(t <= 1e-12 ? .25 : i) on [-1e300, 1e300]: no spectrum, said why, no internal error', () => {
    const r = analyzeText('domain [-1e300, 1e300]\nkernel k(t, s) = (t <= 1e-12 ? .25 : i)\n');
    expect(r.kernels[0].spectrum).toBeNull();
    expect(r.diagnostics.find((d) => d.code === 'KW402')?.message).toMatch(/too large for double precision/);
  });

  // K(t, s) = s on [−L, L]: ‖K − K*‖² = ∫∫ (s − t)² = ∫∫ (s² + t²) = 2 ∫∫ s² (the cross term vanishes by
  // symmetry), so the relative defect is √2 whatever L (derived here, common practice). Found by the fuzz run
  // (crash-cli-1671): the quadrature weights' product overflowed and the defect printed as NaN.
  it('s on [-1e300, 1e300] gets the Hermitian defect √2', () => {
    const r = analyzeText('domain [-1e300, 1e300]\nkernel k(t, s) = s\n');
    const h = r.kernels[0].hermitian!;
    expect(h.holds).toBe(false);
    expect(Math.abs(h.defect - Math.SQRT2)).toBeLessThanOrEqual(Math.max(h.defectError, 1e-12));
  });
});

describe('figures beyond the double range', () => {
  // K = 1e308 on [−1, 1]: rank one, λ₁ = 1e308 · 2 = 2e308 (common practice: a constant c on [a, b] has
  // λ₁ = c(b − a)), which no double holds. Found by the fuzz run: the rank check handed the overflowing
  // Galerkin entries to the SVD, which threw.
  it('1e308 on [-1, 1]: no spectrum, said why, no internal error', () => {
    const r = analyzeText('domain [-1, 1]\nkernel k(t, s) = 1e308\n');
    expect(r.kernels[0].spectrum).toBeNull();
    expect(r.diagnostics.find((d) => d.code === 'KW402')?.message).toMatch(/beyond the double range/);
    expect(r.diagnostics.some((d) => /NaN|Infinity|∞/.test(d.message))).toBe(false);
  });
});
