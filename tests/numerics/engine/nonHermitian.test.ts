/**
 * Non-Hermitian kernels: the norm is the largest singular value and may exceed the spectral radius; complex
 * eigenvalues are checked against mathjs `eigs` on an independent plain Nyström matrix.
 * (Book sections and problem numbers are cited from memory.)
 */
import { describe, expect, it } from 'vitest';
import { create, all, type Complex } from 'mathjs';
import { gaussLegendre, mapRule } from '../../../src-core/numerics/quadrature';
import { analyseKernel } from './helpers';

const math = create(all);

describe('Volterra integration operator K = (s < t ? 1 : 0) on [0, 1]', () => {
  // ‖V‖ = 2/π and the spectrum is {0} (P. R. Halmos, A Hilbert Space Problem Book, 2nd ed. 1982, Problem 188).
  const sp = analyseKernel('domain [0, 1]\nkernel volterra(t, s) = s < t ? 1 : 0', { timeBudgetMs: 10_000 }).spectrum!;
  it('has norm 2/π, far above its spectral radius 0', () => {
    expect(Math.abs(sp.norm!.value - 2 / Math.PI)).toBeLessThan(1e-9);
    expect(Math.abs(sp.norm!.value - 2 / Math.PI)).toBeLessThanOrEqual(sp.norm!.error + 1e-12);
    // The spectrum {0} is reported as such: no nonzero eigenvalue, with the reason.
    expect(sp.eigenvalues).toEqual([]);
    expect(sp.quasinilpotent).toBeTruthy();
  });
});

describe('complex symmetric, non-Hermitian exp(i·t·s) on [0, 2]', () => {
  it('matches the eigenvalues of a 40-point plain Nyström matrix computed by mathjs eigs', () => {
    const sp = analyseKernel('domain [0, 2]\nkernel k(t, s) = exp(i*t*s)', { timeBudgetMs: 10_000 }).spectrum!;
    // Plain Nyström with Gauss–Legendre converges exponentially for an analytic kernel (common practice).
    const n = 40;
    const r = mapRule(gaussLegendre(n), 0, 2);
    const rows: Complex[][] = [];
    for (let i = 0; i < n; i++) {
      const row: Complex[] = [];
      for (let j = 0; j < n; j++) {
        const x = r.nodes[i] * r.nodes[j];
        row.push(math.complex(Math.cos(x) * r.weights[j], Math.sin(x) * r.weights[j]));
      }
      rows.push(row);
    }
    const ev = (math.eigs(math.matrix(rows)).values as unknown as { toArray(): Complex[] }).toArray()
      .map((z) => math.complex(z)) as Complex[];
    ev.sort((a, b) => math.abs(b) as number - (math.abs(a) as number));
    expect(sp.eigenvalues.some((e) => e.im !== 0)).toBe(true);
    sp.eigenvalues.slice(0, 5).forEach((e) => {
      const nearest = Math.min(...ev.map((z) => Math.hypot(z.re - e.re, z.im - e.im)));
      expect(nearest).toBeLessThan(1e-9);
    });
  });
});
