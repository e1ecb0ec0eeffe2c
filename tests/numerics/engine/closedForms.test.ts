/**
 * The spectral engine against published closed forms. Each case names its source beside it; the formulas are
 * standard, the section numbers are cited from memory.
 */
import { describe, expect, it } from 'vitest';
import { analyseKernel, bisect, honest } from './helpers';

const PI = Math.PI;

describe('Wiener covariance min(t, s) on [0, 1]', () => {
  // Karhunen–Loève expansion of Brownian motion: λ_k = 1/((k − 1/2)² π²), φ_k(t) = √2 sin((k − 1/2)πt), trace 1/2,
  // ∫∫ min² = 1/6 (e.g. R. G. Ghanem & P. D. Spanos, Stochastic Finite Elements: A Spectral Approach, 1991, §2.3.3;
  // any text on the Karhunen–Loève expansion of Brownian motion).
  const k = analyseKernel('domain [0, 1]\nkernel wiener(t, s) = min(t, s)');
  const sp = k.spectrum!;
  it('gives the eight leading eigenvalues to 1e-10 relative to the norm, with honest error estimates', () => {
    expect(sp.eigenvalues).toHaveLength(8);
    sp.eigenvalues.forEach((e, i) => {
      const exact = 1 / ((i + 0.5) ** 2 * PI * PI);
      const err = Math.abs(e.re - exact);
      expect(err).toBeLessThan(1e-10 * sp.norm!.value);
      expect(e.im).toBe(0);
      expect(honest(e.error, err, 1e-14 * sp.norm!.value)).toBe(true);
    });
  });
  it('gives trace 1/2 and Hilbert–Schmidt norm 1/√6', () => {
    expect(Math.abs(sp.trace!.value - 0.5)).toBeLessThanOrEqual(sp.trace!.error + 1e-15);
    expect(Math.abs(sp.hsNorm!.value - 1 / Math.sqrt(6))).toBeLessThan(1e-12);
    expect(Math.abs(sp.hsNorm!.value - 1 / Math.sqrt(6))).toBeLessThanOrEqual(sp.hsNorm!.error + 1e-15);
  });
  it('brackets the norm 4/π² between lower and upper', () => {
    const exact = 4 / (PI * PI);
    expect(sp.norm!.lower).toBeLessThanOrEqual(exact);
    expect(sp.norm!.upper).toBeGreaterThanOrEqual(exact);
    expect(Math.abs(sp.norm!.value - exact)).toBeLessThanOrEqual(sp.norm!.error);
  });
  it('samples the eigenfunctions √2 sin((k − 1/2)πt)', () => {
    const f = sp.eigenfunctions!;
    for (let k2 = 0; k2 < 4; k2++) {
      const exact = f.grid.map((t) => Math.SQRT2 * Math.sin((k2 + 0.5) * PI * t));
      // Eigenfunctions are defined up to sign: align by the sign of their inner product.
      const sign = Math.sign(exact.reduce((acc, v, j) => acc + v * f.re[k2][j], 0));
      f.grid.forEach((_, j) => expect(Math.abs(sign * f.re[k2][j] - exact[j])).toBeLessThan(1e-8));
    }
  });
});

describe('Brownian bridge min(t, s) − t s on [0, 1] (Green’s function of −u″ with Dirichlet ends)', () => {
  // λ_k = 1/(kπ)² (e.g. R. Courant & D. Hilbert, Methods of Mathematical Physics I, 1953, ch. V §14; common
  // practice); trace ∫(t − t²) = 1/6; ∫∫ G² = Σ λ_k² = 1/90 (ζ(4) = π⁴/90).
  const sp = analyseKernel('domain [0, 1]\nkernel bridge(t, s) = min(t, s) - t*s').spectrum!;
  it('eigenvalues 1/(kπ)²', () => {
    sp.eigenvalues.forEach((e, i) => {
      const exact = 1 / ((i + 1) ** 2 * PI * PI);
      const err = Math.abs(e.re - exact);
      expect(err).toBeLessThan(1e-10 * sp.norm!.value);
      expect(honest(e.error, err, 1e-14 * sp.norm!.value)).toBe(true);
    });
  });
  it('trace 1/6 and Hilbert–Schmidt norm² 1/90', () => {
    expect(Math.abs(sp.trace!.value - 1 / 6)).toBeLessThan(1e-13);
    expect(Math.abs(sp.hsNorm!.value ** 2 - 1 / 90)).toBeLessThan(1e-12);
  });
});

describe('exponential covariance exp(−|t − s|/b) on [−a, a]', () => {
  // Ghanem & Spanos (1991), §2.3.3: with c = 1/b, λ = 2c/(ω² + c²), where ω solves c − ω tan(ωa) = 0 (even
  // eigenfunctions) or ω + c tan(ωa) = 0 (odd ones). Roots found here by bisection on each branch of tan.
  function exactEigenvalues(a: number, b: number, count: number): number[] {
    const c = 1 / b;
    const out: number[] = [];
    for (let n = 0; out.length < 3 * count && n < 50; n++) {
      const lo = (n * PI) / a;
      const mid = ((n + 0.5) * PI) / a;
      const hi = ((n + 1) * PI) / a;
      const eps = 1e-13;
      // even: c − ω tan(ωa) = 0 on (nπ/a, (n+½)π/a)
      out.push(bisect((w) => c - w * Math.tan(w * a), lo + eps, mid - eps));
      // odd: ω + c tan(ωa) = 0 on ((n+½)π/a, (n+1)π/a)
      out.push(bisect((w) => w + c * Math.tan(w * a), mid + eps, hi - eps));
    }
    return out.map((w) => (2 * c) / (w * w + c * c)).sort((x, y) => y - x).slice(0, count);
  }
  for (const [a, b] of [[1, 1], [0.5, 0.2], [2, 3]] as const) {
    it(`a = ${a}, b = ${b}: eight eigenvalues to 1e-10 with honest estimates`, () => {
      const sp = analyseKernel(`kernel expcov(t, s) on [${-a}, ${a}] = exp(-abs(t - s)/${b})`).spectrum!;
      const exact = exactEigenvalues(a, b, 8);
      sp.eigenvalues.forEach((e, i) => {
        const err = Math.abs(e.re - exact[i]);
        expect(err).toBeLessThan(1e-10 * sp.norm!.value);
        expect(honest(e.error, err, 1e-14 * sp.norm!.value)).toBe(true);
      });
    });
  }
});
