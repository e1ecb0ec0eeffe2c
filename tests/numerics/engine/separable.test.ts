/**
 * Separable kernels worked by hand with the degenerate-kernel method: the nonzero eigenvalues of
 * K = Σ f_j(t) g_j(s) are those of M_ij = ∫ g_i f_j (K. Atkinson, The Numerical Solution of Integral Equations of
 * the Second Kind, 1997, §2.1). The hand computations are written out beside each case.
 * (Book sections and problem numbers are cited from memory.)
 */
import { describe, expect, it } from 'vitest';
import { analyseKernel } from './helpers';

function close(actual: number, expected: number, tol: number) {
  expect(Math.abs(actual - expected)).toBeLessThan(tol);
}

describe('degenerate kernels', () => {
  it('t·s on [0, 1]: rank one, λ = ∫ s² = 1/3', () => {
    const sp = analyseKernel('domain [0, 1]\nkernel k(t, s) = t*s').spectrum!;
    expect(sp.eigenvalues).toHaveLength(1);
    close(sp.eigenvalues[0].re, 1 / 3, 1e-14);
    expect(sp.method).toMatch(/degenerate/);
  });

  it('1 + t·s on [0, 1]: M = [[1, 1/2], [1/2, 1/3]], λ = (4 ± √13)/6', () => {
    const sp = analyseKernel('domain [0, 1]\nkernel k(t, s) = 1 + t*s').spectrum!;
    expect(sp.eigenvalues).toHaveLength(2);
    close(sp.eigenvalues[0].re, (4 + Math.sqrt(13)) / 6, 1e-14);
    close(sp.eigenvalues[1].re, (4 - Math.sqrt(13)) / 6, 1e-14);
  });

  it('cos(t − s) on [0, π]: cos t cos s + sin t sin s, M = diag(π/2, π/2)', () => {
    // ∫₀^π cos² = ∫₀^π sin² = π/2 and ∫₀^π sin cos = 0.
    const sp = analyseKernel('domain [0, pi]\nkernel k(t, s) = cos(t - s)').spectrum!;
    expect(sp.eigenvalues).toHaveLength(2);
    close(sp.eigenvalues[0].re, Math.PI / 2, 1e-13);
    close(sp.eigenvalues[1].re, Math.PI / 2, 1e-13);
  });

  it('complex Hermitian exp(i·(t − s)) on [0, 1]: f = e^{it}, g = e^{−is}, λ = ∫ e^{−is} e^{is} = 1', () => {
    const k = analyseKernel('domain [0, 1]\nkernel k(t, s) = exp(i*(t - s))');
    expect(k.complex).toBe(true);
    expect(k.spectrum!.eigenvalues).toHaveLength(1);
    close(k.spectrum!.eigenvalues[0].re, 1, 1e-14);
    expect(k.spectrum!.eigenvalues[0].im).toBe(0);
  });

  it('non-Hermitian t on [0, 1] (f = t, g = 1): λ = ∫ t = 1/2 while ‖T‖ = ‖f‖‖g‖ = 1/√3 > spectral radius', () => {
    const sp = analyseKernel('domain [0, 1]\nkernel k(t, s) = t').spectrum!;
    close(sp.eigenvalues[0].re, 0.5, 1e-14);
    close(sp.norm!.value, 1 / Math.sqrt(3), 1e-12);
    expect(sp.norm!.value).toBeGreaterThan(Math.abs(sp.eigenvalues[0].re) + 0.07);
  });

  it('complex non-Hermitian exp(i·t) on [0, 1] (f = e^{it}, g = 1): λ = ∫ e^{is} ds = sin 1 + i(1 − cos 1)', () => {
    const sp = analyseKernel('domain [0, 1]\nkernel k(t, s) = exp(i*t)').spectrum!;
    close(sp.eigenvalues[0].re, Math.sin(1), 1e-14);
    close(sp.eigenvalues[0].im, 1 - Math.cos(1), 1e-14);
  });

  it('a rank-two non-symmetric real kernel t + s² on [0, 1]', () => {
    // f1 = t, g1 = 1; f2 = 1, g2 = s²: M = [[∫t, ∫1], [∫s³, ∫s²]] = [[1/2, 1], [1/4, 1/3]];
    // λ = (5/6 ± √((1/2 − 1/3)² + 4·1/4))/2 = (5/6 ± √(1/36 + 1))/2.
    const sp = analyseKernel('domain [0, 1]\nkernel k(t, s) = t + s^2').spectrum!;
    const r = Math.sqrt(1 / 36 + 1);
    close(sp.eigenvalues[0].re, (5 / 6 + r) / 2, 1e-14);
    close(sp.eigenvalues[1].re, (5 / 6 - r) / 2, 1e-14);
  });
});
