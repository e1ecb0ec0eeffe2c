/**
 * Times of the dense solvers at the sizes the spectral engine uses (printed, not asserted: machines differ). Each
 * timed result is still checked, so the test fails if speed was bought with accuracy.
 * Targets: symmetricEigen n = 200 ≤ 50 ms, hermitianEigen n = 200 ≤ 300 ms, generalEigen complex n = 120 ≤ 400 ms.
 */
import { describe, expect, it } from 'vitest';
import { frobeniusNorm, generalEigen, hermitianEigen, symmetricEigen } from '../../../src-core/numerics/linalg';
import { symmetricTridiagonalQl } from '../../../src-core/numerics/linalg/symmetricTridiagonalQl';
import { maxResidual, orthonormalityDefect, randomHermitian, randomMatrix, randomSymmetric, zeros } from './helpers';

function time<T>(label: string, run: () => T, repeats = 3): T {
  const first = performance.now();
  let result = run();
  const cold = performance.now() - first;
  const warm: number[] = [];
  for (let r = 0; r < repeats; r++) {
    const t = performance.now();
    result = run();
    warm.push(performance.now() - t);
  }
  warm.sort((a, b) => a - b);
  console.log(`${label}: first call ${cold.toFixed(0)} ms, then median ${warm[Math.floor(repeats / 2)].toFixed(0)} ms`);
  return result;
}

describe('timings', () => {
  it('symmetricEigen, n = 200', () => {
    const n = 200;
    const a = randomSymmetric(n, 701);
    const r = time('symmetricEigen n=200', () => symmetricEigen(a, n));
    expect(maxResidual({ re: a, im: zeros(n * n) }, n, r.values, zeros(n), { re: r.vectors, im: zeros(n * n) })).toBeLessThan(1e-12 * n);
  });

  it('symmetricTridiagonalQl (the flat solver under hermitianEigen), n = 200, for comparison', () => {
    const n = 200;
    const a = randomSymmetric(n, 701);
    const r = time('symmetricTridiagonalQl n=200', () => symmetricTridiagonalQl(a, n));
    expect(r.converged).toBe(true);
    expect(Math.abs(r.values[0] - symmetricEigen(a, n).values[0])).toBeLessThan(1e-12);
  });

  it('hermitianEigen, n = 200', () => {
    const n = 200;
    const a = randomHermitian(n, 702);
    const r = time('hermitianEigen n=200', () => hermitianEigen(a.re, a.im, n));
    const v = { re: r.vectorsRe, im: r.vectorsIm };
    expect(orthonormalityDefect(v, n)).toBeLessThan(1e-12);
    expect(maxResidual(a, n, r.values, zeros(n), v)).toBeLessThan(1e-12 * n);
  });

  it('hermitianEigen, n = 200, smooth low-rank kernel (one large cluster of noise-level eigenvalues)', () => {
    const n = 200;
    const re = new Float64Array(n * n);
    const im = new Float64Array(n * n);
    for (let i = 0; i < n; i++) {
      for (let j = 0; j < n; j++) {
        const d = (i - j) / (n - 1);
        re[i * n + j] = (Math.exp(-d * d) * Math.cos(3 * d)) / n;
        im[i * n + j] = (Math.exp(-d * d) * Math.sin(3 * d)) / n;
      }
    }
    const r = time('hermitianEigen n=200 low-rank kernel', () => hermitianEigen(re, im, n));
    expect(orthonormalityDefect({ re: r.vectorsRe, im: r.vectorsIm }, n)).toBeLessThan(1e-12);
  });

  it('generalEigen (complex), n = 120', () => {
    const n = 120;
    const a = { re: randomMatrix(n, n, 703), im: randomMatrix(n, n, 704) };
    const r = time('generalEigen complex n=120', () => generalEigen(a.re, a.im, n));
    expect(r.converged).toBe(true);
    const v = { re: r.vectorsRe, im: r.vectorsIm };
    expect(maxResidual(a, n, r.valuesRe, r.valuesIm, v)).toBeLessThan(1e-10 * frobeniusNorm(a.re, a.im));
  });
});
