/**
 * Facts of self-adjoint compact operators (common practice; e.g. E. Kreyszig, Introductory Functional Analysis
 * with Applications, 1978, §9.1–9.2 and §8.6), checked as properties over random Hermitian kernels: the spectrum is
 * real and lies in [−‖T‖, ‖T‖], ‖T‖ equals the spectral radius (so ‖T‖ or −‖T‖ is an eigenvalue), and eigenfunctions
 * of distinct eigenvalues are orthogonal.
 * (Book sections and problem numbers are cited from memory.)
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { analyzeText } from '@kernwright/core';

const coef = fc.double({ min: -2, max: 2, noNaN: true }).map((x) => Math.round(x * 1000) / 1000);
const positive = fc.double({ min: 0.2, max: 3, noNaN: true }).map((x) => Math.round(x * 1000) / 1000);

/** Random real symmetric or complex Hermitian kernels built from pieces that are Hermitian by construction. */
const hermitianKernel = fc.oneof(
  // Σ c_j f_j(t) f_j(s): a separable real symmetric kernel
  fc.tuple(coef, coef, coef).map(([a, b, c]) => `${a}*t*s + ${b}*cos(t)*cos(s) + ${c}*exp(t)*exp(s)`),
  // c1 exp(−(t − s)²/ℓ) + c2 (t s): smooth, not separable
  fc.tuple(coef, positive, coef).map(([a, l, b]) => `${a}*exp(-(t - s)^2/${l}) + ${b}*t*s`),
  // a kinked one: c1 exp(−|t − s|/ℓ) + c2 min(t, s)
  fc.tuple(coef, positive, coef).map(([a, l, b]) => `${a}*exp(-abs(t - s)/${l}) + ${b}*min(t, s)`),
  // complex Hermitian: c1 exp(i k (t − s)) exp(−|t − s|) + c2 cos(t − s)
  fc.tuple(coef, positive, coef).map(([a, k, b]) => `${a}*exp(i*${k}*(t - s))*exp(-abs(t - s)) + ${b}*cos(t - s)`),
);

/** Simpson's rule on the uniform eigenfunction grid (odd number of points). */
function simpson(values: number[], h: number): number {
  let s = values[0] + values[values.length - 1];
  for (let k = 1; k < values.length - 1; k++) s += (k % 2 === 1 ? 4 : 2) * values[k];
  return (s * h) / 3;
}

describe('self-adjoint facts over random Hermitian kernels', () => {
  it('real spectrum in [−‖T‖, ‖T‖], ‖T‖ = spectral radius, orthogonal eigenfunctions', () => {
    fc.assert(
      fc.property(hermitianKernel, (body) => {
        const r = analyzeText(`domain [0, 1]\nkernel k(t, s) = ${body}`, { timeBudgetMs: 3000, gridPoints: 801 });
        const sp = r.kernels[0].spectrum;
        expect(sp).not.toBeNull();
        const norm = sp!.norm!;
        const tol = norm.error + 1e-12 * norm.value;
        for (const e of sp!.eigenvalues) {
          expect(e.im).toBe(0);
          expect(Math.abs(e.re)).toBeLessThanOrEqual(norm.value + tol + e.error);
        }
        if (norm.value > 1e-12) {
          const radius = Math.max(...sp!.eigenvalues.map((e) => Math.abs(e.re)));
          expect(Math.abs(radius - norm.value)).toBeLessThanOrEqual(tol + sp!.eigenvalues[0].error);
          expect(sp!.eigenvalues.some((e) => Math.abs(Math.abs(e.re) - norm.value) <= tol + e.error)).toBe(true);
        }
        const f = sp!.eigenfunctions!;
        const h = f.grid[1] - f.grid[0];
        const n = Math.min(4, f.re.length);
        for (let a = 0; a < n; a++) {
          for (let b = a + 1; b < n; b++) {
            const ea = sp!.eigenvalues[a].re;
            const eb = sp!.eigenvalues[b].re;
            if (Math.abs(ea - eb) < 1e-6 * norm.value) continue; // a degenerate pair may mix
            // Eigenvalues at rounding level belong to the (numerical) null space: their eigenfunctions are arbitrary
            // high-degree polynomials that Simpson's rule on this grid cannot integrate accurately.
            if (Math.min(Math.abs(ea), Math.abs(eb)) < 1e-8 * norm.value) continue;
            const re = simpson(f.re[a].map((v, j) => v * f.re[b][j] + (f.im ? f.im[a][j] * f.im[b][j] : 0)), h);
            const im = f.im ? simpson(f.re[a].map((v, j) => v * f.im![b][j] - f.im![a][j] * f.re[b][j]), h) : 0;
            expect(Math.hypot(re, im)).toBeLessThan(1e-6);
          }
        }
      }),
      { numRuns: 24, seed: 20261201 },
    );
  });
});
