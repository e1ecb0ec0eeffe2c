/**
 * Convergence at the promised rates. Galerkin eigenvalues of a self-adjoint operator converge like the square of
 * the best approximation error of the eigenfunction (K. Atkinson, The Numerical Solution of Integral Equations of
 * the Second Kind, 1997, §3.7; common practice), so with the panels aligned to the kink, polynomial degree p on
 * smooth eigenfunctions gives faster-than-geometric decay in p; the plain Nyström method on the kinked kernel
 * min(t, s) only reaches O(n⁻²).
 * (Book sections and problem numbers are cited from memory.)
 */
import { describe, expect, it } from 'vitest';
import { parse, bindFile } from '@kernwright/core';
import { compileKernel } from '../../../src-core/semantics/evaluator';
import { findLoci } from '../../../src-core/numerics/engine/loci';
import { assembleGalerkin } from '../../../src-core/numerics/engine/assemble';
import { solveLevel } from '../../../src-core/numerics/engine/solveLevel';
import { gaussLegendre, mapRule } from '../../../src-core/numerics/quadrature';
import { symmetricEigen } from '../../../src-core/numerics/linalg';

const exactWiener = 1 / (0.25 * Math.PI * Math.PI); // λ₁ of min(t, s) on [0, 1]

function galerkinLambda1(body: string, degree: number): number {
  const ir = bindFile(parse(`domain [0, 1]\nkernel k(t, s) = ${body}`)).kernels[0].ir!;
  const loci = findLoci(ir, [0, 1]).loci.filter((l) => l.line.ct !== 0 && l.line.cs !== 0);
  const m = assembleGalerkin(compileKernel(ir), { breakpoints: [0, 1], degree, order: degree + 8, singularLevels: 0, gradedPoints: 0 }, loci);
  return solveLevel(m, 1).pairs[0].re;
}

describe('convergence', () => {
  it('Galerkin on min(t, s): error of λ₁ falls by at least 10× per 2 degrees until rounding', () => {
    let previous = Infinity;
    for (const p of [2, 4, 6, 8]) {
      const err = Math.abs(galerkinLambda1('min(t, s)', p) - exactWiener);
      if (previous > 1e-13) expect(err).toBeLessThan(previous / 10);
      previous = err;
    }
    expect(previous).toBeLessThan(1e-12);
  });

  it('plain Gauss–Legendre Nyström on min(t, s) converges only like n⁻² (doubling n divides the error by about 4)', () => {
    const errs = [50, 100, 200].map((n) => {
      const r = mapRule(gaussLegendre(n), 0, 1);
      const a = new Float64Array(n * n);
      for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) {
        a[i * n + j] = Math.sqrt(r.weights[i] * r.weights[j]) * Math.min(r.nodes[i], r.nodes[j]);
      }
      return Math.abs(symmetricEigen(a, n).values[0] - exactWiener);
    });
    for (let k = 1; k < errs.length; k++) {
      const ratio = errs[k - 1] / errs[k];
      expect(ratio).toBeGreaterThan(3);
      expect(ratio).toBeLessThan(5);
    }
  });
});
