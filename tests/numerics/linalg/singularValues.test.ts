import { describe, expect, it } from 'vitest';
import { eigs } from 'mathjs';
import { frobeniusNorm, largestSingularValue, singularValues } from '../../../src-core/numerics/linalg';
import { adjoint, cmatmul, mathjsValues, randomMatrix, toMathjs } from './helpers';

/** Square roots of the eigenvalues of AᴴA (cols×cols), descending, computed by mathjs. */
function referenceFromGram(re: Float64Array, im: Float64Array, rows: number, cols: number): number[] {
  const a = { re, im };
  const g = cmatmul(adjoint(a, rows, cols), a, cols, rows, cols);
  const values = mathjsValues(eigs(toMathjs(g.re, g.im, cols)).values).re;
  return values.map((x) => Math.sqrt(Math.max(0, x))).sort((x, y) => y - x);
}

describe('singularValues', () => {
  it.each([
    [[3, -1, 0.5], 3, 3, [3, 1, 0.5]],
    [[2, -7], 2, 5, [7, 2]],
    [[2, -7, 0], 5, 3, [7, 2, 0]],
  ])('of a diagonal matrix diag(%j) (%i×%i) are the sorted |d|', (d, rows, cols, expected) => {
    const re = new Float64Array(rows * cols);
    d.forEach((x, i) => (re[i * cols + i] = x));
    const s = singularValues(re, null, rows, cols);
    expect(Array.from(s)).toEqual(expected.map((x) => expect.closeTo(x, 14)));
  });

  it('of a complex diagonal matrix are the moduli', () => {
    const n = 3;
    const re = new Float64Array(n * n);
    const im = new Float64Array(n * n);
    [
      [3, 4],
      [0, -2],
      [1, 0],
    ].forEach(([a, b], i) => {
      re[i * n + i] = a;
      im[i * n + i] = b;
    });
    expect(Array.from(singularValues(re, im, n, n))).toEqual([5, 2, 1].map((x) => expect.closeTo(x, 14)));
  });

  it.each([
    [4, 6],
    [7, 3],
  ])('of a complex rank-one u vᴴ (%i×%i) are ‖u‖‖v‖ and zeros', (rows, cols) => {
    const u = { re: randomMatrix(rows, 1, 501), im: randomMatrix(rows, 1, 502) };
    const v = { re: randomMatrix(cols, 1, 503), im: randomMatrix(cols, 1, 504) };
    const a = cmatmul(u, adjoint(v, cols, 1), rows, 1, cols);
    const s = singularValues(a.re, a.im, rows, cols);
    const nu = Math.hypot(...u.re, ...u.im);
    const nv = Math.hypot(...v.re, ...v.im);
    expect(s).toHaveLength(Math.min(rows, cols));
    expect(s[0]).toBeCloseTo(nu * nv, 13);
    for (let k = 1; k < s.length; k++) expect(Math.abs(s[k])).toBeLessThan(1e-14 * nu * nv);
  });

  it.each([
    [6, 6, 511],
    [9, 5, 512],
    [4, 8, 513],
  ])('of a random complex %i×%i matrix are the roots of the eigenvalues of AᴴA (seed %i)', (rows, cols, seed) => {
    const re = randomMatrix(rows, cols, seed);
    const im = randomMatrix(rows, cols, seed + 50);
    const s = singularValues(re, im, rows, cols);
    const ref = referenceFromGram(re, im, rows, cols);
    for (let k = 0; k < s.length; k++) expect(Math.abs(s[k] - ref[k])).toBeLessThan(1e-10);
    for (let k = 1; k < s.length; k++) expect(s[k]).toBeLessThanOrEqual(s[k - 1]);
    // Σ σ² = ‖A‖_F²
    const sum = s.reduce((acc, x) => acc + x * x, 0);
    expect(sum).toBeCloseTo(frobeniusNorm(re, im) ** 2, 11);
  });

  it('of a real random matrix match the Gram eigenvalues too', () => {
    const rows = 7;
    const cols = 4;
    const re = randomMatrix(rows, cols, 520);
    const s = singularValues(re, null, rows, cols);
    const ref = referenceFromGram(re, new Float64Array(rows * cols), rows, cols);
    for (let k = 0; k < cols; k++) expect(Math.abs(s[k] - ref[k])).toBeLessThan(1e-12);
  });

  it.each([
    ['a zero column count', () => singularValues(new Float64Array(0), null, 2, 0), /cols must be a positive integer, got 0/],
    ['a wrong length', () => singularValues(new Float64Array(5), null, 2, 3), /re must hold 2×3 = 6 entries.*got 5/],
    ['a mismatched imaginary part', () => singularValues(new Float64Array(6), new Float64Array(4), 2, 3), /im must hold 2×3 = 6 entries.*got 4/],
  ])('rejects %s with a precise message', (_name, call, message) => {
    expect(call).toThrow(message);
  });
});

// Reference: the full SVD of singularValues (ml-matrix's Golub–Kahan SVD, itself checked against mathjs above);
// the cluster case has its singular values by construction (a signed permutation times a diagonal).
describe('largestSingularValue (Lanczos on AᵀA)', () => {
  it('equals the first of all singular values for real and complex matrices above the dense cut-off', () => {
    for (const [n, seed] of [[65, 1], [120, 2], [200, 3]] as const) {
      const re = randomMatrix(n, n, 2100 + seed);
      const im = randomMatrix(n, n, 2200 + seed);
      const real = singularValues(re, null, n, n)[0];
      const complex = singularValues(re, im, n, n)[0];
      expect(Math.abs(largestSingularValue(re, null, n) - real)).toBeLessThan(1e-12 * real);
      expect(Math.abs(largestSingularValue(re, im, n) - complex)).toBeLessThan(1e-12 * complex);
    }
  });

  it('is exact to rounding when the two largest singular values coincide (a cluster Lanczos must not mis-read)', () => {
    const n = 100;
    // A = U diag(3, 3, 2.999999, 1, …) with U a permutation-with-signs: singular values known exactly.
    const re = new Float64Array(n * n);
    for (let i = 0; i < n; i++) {
      const sigma = i === 0 || i === 1 ? 3 : i === 2 ? 2.999999 : 1 / (1 + i);
      re[((i * 37) % n) * n + i] = (i % 2 === 0 ? 1 : -1) * sigma;
    }
    expect(Math.abs(largestSingularValue(re, null, n) - 3)).toBeLessThan(1e-13 * 3);
  });
});
