// Citations of books and papers in this file (authors, years, sections) are given from memory.
import { describe, expect, it } from 'vitest';
import { eigs } from 'mathjs';
import { matmul, symmetricEigen, transpose } from '../../../src-core/numerics/linalg';
import { mathjsValues, maxAbs, randomSymmetric, toMathjs } from './helpers';

/** tridiag(−1, 2, −1), n×n. */
function toeplitz(n: number): Float64Array {
  const a = new Float64Array(n * n);
  for (let i = 0; i < n; i++) {
    a[i * n + i] = 2;
    if (i > 0) a[i * n + i - 1] = -1;
    if (i < n - 1) a[i * n + i + 1] = -1;
  }
  return a;
}

/** max |VᵀV − I| for n×n V (columns). */
function orthoDefect(v: Float64Array, n: number): number {
  const g = matmul(transpose(v, n), v, n, n, n);
  for (let i = 0; i < n; i++) g[i * n + i] -= 1;
  return maxAbs(g);
}

/** max |A − V diag(λ) Vᵀ|. */
function reconstructionError(a: Float64Array, values: Float64Array, v: Float64Array, n: number): number {
  const vl = new Float64Array(n * n);
  for (let i = 0; i < n; i++) for (let k = 0; k < n; k++) vl[i * n + k] = v[i * n + k] * values[k];
  const r = matmul(vl, transpose(v, n), n, n, n);
  let worst = 0;
  for (let p = 0; p < n * n; p++) worst = Math.max(worst, Math.abs(r[p] - a[p]));
  return worst;
}

describe('symmetricEigen', () => {
  // Eigenvalues of tridiag(−1, 2, −1): 2 − 2cos(kπ/(n+1)), k = 1..n, eigenvectors sin(jkπ/(n+1)) (e.g. Golub &
  // Van Loan, Matrix Computations, 4th ed., §4.8.2; Strang, Introduction to Applied Mathematics, §1.5).
  it.each([5, 50, 200])('matches the closed form of the tridiagonal Toeplitz matrix, n = %i', (n) => {
    const { values, vectors } = symmetricEigen(toeplitz(n), n);
    const norm = 4;
    for (let k = 0; k < n; k++) {
      const exact = 2 - 2 * Math.cos(((n - k) * Math.PI) / (n + 1));
      expect(Math.abs(values[k] - exact)).toBeLessThanOrEqual(1e-13 * norm);
    }
    // Eigenvector of the largest value (k = n): sqrt(2/(n+1)) sin(j n π/(n+1)), up to sign.
    let dot = 0;
    for (let j = 0; j < n; j++) dot += vectors[j * n] * Math.sqrt(2 / (n + 1)) * Math.sin(((j + 1) * n * Math.PI) / (n + 1));
    expect(Math.abs(Math.abs(dot) - 1)).toBeLessThan(1e-10);
  });

  it.each([
    [1, 11],
    [7, 12],
    [40, 13],
    [120, 14],
  ])('reconstructs a random symmetric matrix of order %i with orthonormal vectors (seed %i)', (n, seed) => {
    const a = randomSymmetric(n, seed);
    const { values, vectors } = symmetricEigen(a, n);
    expect(orthoDefect(vectors, n)).toBeLessThan(1e-12);
    expect(reconstructionError(a, values, vectors, n)).toBeLessThan(1e-12 * Math.max(1, n / 10));
    for (let k = 1; k < n; k++) expect(values[k]).toBeLessThanOrEqual(values[k - 1]);
  });

  it.each([21, 22, 23])('agrees with mathjs eigs on a 6×6 case (seed %i)', (seed) => {
    const n = 6;
    const a = randomSymmetric(n, seed);
    const ours = symmetricEigen(a, n);
    const ref = eigs(toMathjs(a, null, n) as number[][]);
    const refValues = mathjsValues(ref.values).re.sort((x, y) => y - x);
    for (let k = 0; k < n; k++) expect(Math.abs(ours.values[k] - refValues[k])).toBeLessThan(1e-12);
    expect(ref.eigenvectors).toHaveLength(n);
    // The eigenvalues of a random matrix are simple: each vector must agree with mathjs's up to sign.
    for (const { value, vector } of ref.eigenvectors) {
      const k = ours.values.findIndex((x) => Math.abs(x - (value as number)) < 1e-10);
      const ref = (Array.isArray(vector) ? vector : (vector as { toArray(): number[] }).toArray()) as number[];
      const refNorm = Math.hypot(...ref);
      let dot = 0;
      for (let i = 0; i < n; i++) dot += ours.vectors[i * n + k] * ref[i];
      expect(Math.abs(Math.abs(dot) / refNorm - 1)).toBeLessThan(1e-10);
    }
  });

  it('uses the symmetric part of a slightly asymmetric input', () => {
    const n = 3;
    const a = Float64Array.from([2, 1 + 1e-9, 0, 1 - 1e-9, 2, 0, 0, 0, 5]);
    const { values } = symmetricEigen(a, n);
    expect(Array.from(values)).toEqual([5, 3, 1].map((x) => expect.closeTo(x, 12)));
  });

  it('fixes each eigenvector sign so its largest entry is positive', () => {
    const n = 30;
    const { vectors } = symmetricEigen(randomSymmetric(n, 31), n);
    for (let k = 0; k < n; k++) {
      let big = 0;
      for (let i = 0; i < n; i++) if (Math.abs(vectors[i * n + k]) > Math.abs(big)) big = vectors[i * n + k];
      expect(big).toBeGreaterThan(0);
    }
  });

  it.each([
    ['a wrong length', () => symmetricEigen(new Float64Array(8), 3), /9 entries.*got 8/],
    ['n = 0', () => symmetricEigen(new Float64Array(0), 0), /n must be a positive integer, got 0/],
    ['a NaN entry', () => symmetricEigen(Float64Array.from([1, 0, 0, NaN]), 2), /a\[1, 1\] is NaN/],
  ])('rejects %s with a precise message', (_name, call, message) => {
    expect(call).toThrow(message);
  });
});
