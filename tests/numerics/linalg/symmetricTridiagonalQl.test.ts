import { describe, expect, it } from 'vitest';
import { symmetricTridiagonalQl } from '../../../src-core/numerics/linalg/symmetricTridiagonalQl';
import { matmul, symmetricEigen, transpose } from '../../../src-core/numerics/linalg';
import { maxAbs, randomSymmetric } from './helpers';

/** max |A x_k − λ_k x_k| over all pairs, and max |X Xᵀ − I|, for eigenvectors stored as rows. */
function defects(a: Float64Array, n: number, values: Float64Array, rows: Float64Array) {
  const ax = matmul(a, transpose(rows, n), n, n, n); // column k = A x_k
  let residual = 0;
  for (let i = 0; i < n; i++) {
    for (let k = 0; k < n; k++) residual = Math.max(residual, Math.abs(ax[i * n + k] - values[k] * rows[k * n + i]));
  }
  const g = matmul(rows, transpose(rows, n), n, n, n);
  for (let i = 0; i < n; i++) g[i * n + i] -= 1;
  return { residual, ortho: maxAbs(g) };
}

describe('symmetricTridiagonalQl (flat tred2/tql2 used by hermitianEigen and the Lanczos solver)', () => {
  it('matches the closed form 2 − 2cos(kπ/(n+1)) of tridiag(−1, 2, −1), n = 200', () => {
    const n = 200;
    const a = new Float64Array(n * n);
    for (let i = 0; i < n; i++) {
      a[i * n + i] = 2;
      if (i > 0) a[i * n + i - 1] = -1;
      if (i < n - 1) a[i * n + i + 1] = -1;
    }
    const r = symmetricTridiagonalQl(a, n);
    expect(r.converged).toBe(true);
    for (let k = 0; k < n; k++) {
      expect(Math.abs(r.values[k] - (2 - 2 * Math.cos(((n - k) * Math.PI) / (n + 1))))).toBeLessThan(4e-13);
    }
  });

  it.each([
    [2, 801],
    [17, 802],
    [90, 803],
  ])('agrees with ml-matrix (through symmetricEigen) on a random symmetric matrix of order %i (seed %i)', (n, seed) => {
    const a = randomSymmetric(n, seed);
    const r = symmetricTridiagonalQl(a, n);
    const ref = symmetricEigen(a, n);
    for (let k = 0; k < n; k++) expect(Math.abs(r.values[k] - ref.values[k])).toBeLessThan(1e-13 * n);
    const d = defects(a, n, r.values, r.vectorRows);
    expect(d.residual).toBeLessThan(1e-13 * n);
    expect(d.ortho).toBeLessThan(1e-13 * n);
  });

  it('handles zero rows and columns (the scale = 0 branch of the reduction) and a 1×1 matrix', () => {
    const n = 5;
    const a = new Float64Array(n * n);
    a[0] = 3;
    a[2 * n + 2] = -1;
    a[2 * n + 0] = 0.5;
    a[0 * n + 2] = 0.5;
    const r = symmetricTridiagonalQl(a, n);
    const s = Math.sqrt(4 * 4 + 4 * 0.25) / 2; // eigenvalues of [[3, .5], [.5, −1]]: 1 ± √(4 + .25)
    expect(Array.from(r.values)).toEqual([1 + s, 0, 0, 0, 1 - s].map((x) => expect.closeTo(x, 14)));
    const d = defects(a, n, r.values, r.vectorRows);
    expect(d.residual).toBeLessThan(1e-14);
    expect(d.ortho).toBeLessThan(1e-14);
    expect(Array.from(symmetricTridiagonalQl(Float64Array.of(-7), 1).values)).toEqual([-7]);
  });
});
