/**
 * The quadrature rules of a panel pair cut by oblique loci, and the Galerkin projection that uses their row
 * structure. The structured projection (rows that share x or y summed first) must give the same sums as the plain
 * one, point by point; the rules must integrate polynomials exactly (a collapsed Gauss rule with n points per
 * direction is exact for total degree 2n − 2: A. H. Stroud, Approximate Calculation of Multiple Integrals, 1971,
 * cited from memory).
 */
import { describe, expect, it } from 'vitest';
import { parse, bindFile } from '@kernwright/core';
import { compileKernel } from '../../../src-core/semantics/evaluator';
import { findLoci, type Locus } from '../../../src-core/numerics/engine/loci';
import { pairRule } from '../../../src-core/numerics/engine/pairRule';
import { assembleGalerkin } from '../../../src-core/numerics/engine/assemble';
import { panelBasis } from '../../../src-core/numerics/quadrature';

function kernelOf(source: string) {
  const k = bindFile(parse(`domain [0, 1]\nkernel k(t, s) = ${source}`)).kernels[0];
  return { ir: k.ir!, loci: findLoci(k.ir!, [0, 1]).loci.filter((l: Locus) => l.line.ct !== 0 && l.line.cs !== 0) };
}

const options = { order: 12, singularLevels: 0, gradedPoints: 0 };

describe('unit rules of cut panel pairs', () => {
  for (const expr of ['abs(t - s)', 'abs(t - s - 0.3)', 'abs(t + s - 0.8) + abs(t - s)']) {
    it(`cover every point with row blocks whose flags match the points (${expr})`, () => {
      const { loci } = kernelOf(expr);
      const rule = pairRule(0, 1, 0, 1, loci, options);
      if (!('unit' in rule)) throw new Error('expected a cut rule');
      const { x, y, blocks } = rule.unit;
      let covered = 0;
      let structured = 0;
      for (let b = 0; b < blocks.length; b += 4) {
        const [start, rows, cols, axis] = [blocks[b], blocks[b + 1], blocks[b + 2], blocks[b + 3]];
        expect(start).toBe(covered);
        covered += rows * cols;
        if (axis !== 0) structured++;
        for (let r = 0; r < rows; r++) {
          for (let c = 0; c < cols; c++) {
            const k = start + r * cols + c;
            if (axis === 1) expect(x[k]).toBe(x[start + r * cols]);
            if (axis === 2) expect(y[k]).toBe(y[start + r * cols]);
          }
        }
      }
      expect(covered).toBe(x.length);
      expect(structured).toBeGreaterThan(0);
    });

    it(`integrates t^a s^b exactly for a + b ≤ 2n − 2 (${expr})`, () => {
      const { loci } = kernelOf(expr);
      const rule = pairRule(0, 1, 0, 1, loci, options);
      if (!('unit' in rule)) throw new Error('expected a cut rule');
      const { x, y, w } = rule.unit;
      for (const [a, b] of [[0, 0], [3, 5], [11, 11], [0, 22], [15, 7]]) {
        let sum = 0;
        for (let k = 0; k < w.length; k++) sum += w[k] * x[k] ** a * y[k] ** b;
        expect(Math.abs(sum - 1 / ((a + 1) * (b + 1)))).toBeLessThan(1e-14);
      }
    });
  }
});

describe('Galerkin projection with row-structured rules', () => {
  for (const expr of ['exp(-abs(t - s - 0.3))', 'exp(i * 3 * (t - s)) * exp(-abs(t - s))', 'min(t, s)']) {
    it(`equals the plain point-by-point sum over the same rule (${expr})`, () => {
      const { ir, loci } = kernelOf(expr);
      const kernel = compileKernel(ir);
      const degree = 6;
      const q = degree + 1;
      const m = assembleGalerkin(kernel, { breakpoints: [0, 1], degree, order: degree + 8, singularLevels: 0, gradedPoints: 0 }, loci);
      const rule = pairRule(0, 1, 0, 1, loci, { order: degree + 8, singularLevels: 0, gradedPoints: 0 });
      if (!('unit' in rule)) throw new Error('expected a cut rule');
      const { x, y, w } = rule.unit;
      const bx = panelBasis(x, 0, 1, degree);
      const by = panelBasis(y, 0, 1, degree);
      const kr = new Float64Array(w.length);
      const ki = new Float64Array(w.length);
      kernel.evaluateColumns([x, y], kr, kernel.complex ? ki : null);
      for (let i = 0; i < q; i++) {
        for (let j = 0; j < q; j++) {
          let sr = 0;
          let si = 0;
          for (let k = 0; k < w.length; k++) {
            sr += w[k] * kr[k] * bx[k * q + i] * by[k * q + j];
            si += w[k] * ki[k] * bx[k * q + i] * by[k * q + j];
          }
          expect(Math.abs(m.re[i * q + j] - sr)).toBeLessThan(1e-14);
          if (m.im) expect(Math.abs(m.im[i * q + j] - si)).toBeLessThan(1e-14);
        }
      }
    });
  }
});
