// Citations of books and papers in this file (authors, years, sections) are given from memory.
import { describe, expect, it } from 'vitest';
import { leadingSymmetricEigen, symmetricEigen } from '../../../src-core/numerics/linalg';
import { randomSymmetric } from './helpers';

/** y = T x for T = tridiag(−1, 2, −1). */
function toeplitzProduct(n: number) {
  return (x: Float64Array, y: Float64Array) => {
    for (let i = 0; i < n; i++) y[i] = 2 * x[i] - (i > 0 ? x[i - 1] : 0) - (i < n - 1 ? x[i + 1] : 0);
  };
}

function denseProduct(a: Float64Array, n: number) {
  return (x: Float64Array, y: Float64Array) => {
    for (let i = 0; i < n; i++) {
      let s = 0;
      for (let j = 0; j < n; j++) s += a[i * n + j] * x[j];
      y[i] = s;
    }
  };
}

describe('leadingSymmetricEigen', () => {
  // Eigenvalues of tridiag(−1, 2, −1) of order n: 2 − 2cos(jπ/(n+1)), j = 1..n (any numerical linear algebra text,
  // e.g. Golub & Van Loan, Matrix Computations, 4th ed., §4.8.2). The largest are j = n, n − 1, …; they crowd
  // towards 4 (relative gap ~2·10⁻⁶ at n = 2000), a hard case for a Krylov method.
  it('finds the 8 leading eigenvalues of the tridiagonal Toeplitz matrix of order 2000 through products', () => {
    const n = 2000;
    const k = 8;
    let products = 0;
    const product = toeplitzProduct(n);
    const t0 = performance.now();
    const r = leadingSymmetricEigen((x, y) => {
      products++;
      product(x, y);
    }, n, k);
    const ms = performance.now() - t0;
    console.log(`leadingSymmetricEigen Toeplitz n=${n} k=${k}: ${products} products, ${ms.toFixed(0)} ms`);
    expect(r.converged).toBe(true);
    for (let j = 0; j < k; j++) {
      const exact = 2 - 2 * Math.cos(((n - j) * Math.PI) / (n + 1));
      expect(Math.abs(r.values[j] - exact)).toBeLessThan(1e-12);
      expect(r.residuals[j]).toBeLessThanOrEqual(10 * 1e-10 * 4);
    }
    // Vectors: unit, mutually orthogonal, and A v = λ v measured independently.
    const v = r.vectors;
    const y = new Float64Array(n);
    for (let a = 0; a < k; a++) {
      for (let b = a; b < k; b++) {
        let dot = 0;
        for (let i = 0; i < n; i++) dot += v[i * k + a] * v[i * k + b];
        expect(Math.abs(dot - (a === b ? 1 : 0))).toBeLessThan(1e-10);
      }
      const col = Float64Array.from({ length: n }, (_, i) => v[i * k + a]);
      product(col, y);
      let res = 0;
      for (let i = 0; i < n; i++) res += (y[i] - r.values[a] * col[i]) ** 2;
      expect(Math.sqrt(res)).toBeCloseTo(r.residuals[a], 12);
    }
  });

  it('takes the largest |λ|, negative ones included, and agrees with the dense solver', () => {
    const n = 300;
    const a = randomSymmetric(n, 601);
    for (let i = 0; i < n; i++) a[i * n + i] += i % 3 === 0 ? -0.2 * i : 0; // a spread spectrum of both signs
    const k = 6;
    const r = leadingSymmetricEigen(denseProduct(a, n), n, k, { seed: 7 });
    expect(r.converged).toBe(true);
    const dense = symmetricEigen(a, n).values;
    const byModulus = Array.from(dense).sort((x, y) => Math.abs(y) - Math.abs(x));
    expect(byModulus.slice(0, k).some((x) => x < 0)).toBe(true);
    for (let j = 0; j < k; j++) expect(Math.abs(r.values[j] - byModulus[j])).toBeLessThan(1e-9);
  });

  it('finds a double leading eigenvalue twice (Q diag(5, 5, 4·0.9ʲ) Q with a Householder Q)', () => {
    // A single Krylov sequence sees one direction per eigenvalue in exact arithmetic; the second copy comes in
    // through rounding and restarts, which this checks for a well-separated double eigenvalue.
    const n = 500;
    const d = Float64Array.from({ length: n }, (_, i) => (i < 2 ? 5 : 4 * 0.9 ** (i - 2)));
    const w = Float64Array.from({ length: n }, (_, i) => Math.sin(i + 1));
    const ww = w.reduce((acc, x) => acc + x * x, 0);
    const t = new Float64Array(n);
    const product = (x: Float64Array, y: Float64Array) => {
      let s = 0;
      for (let i = 0; i < n; i++) s += w[i] * x[i];
      for (let i = 0; i < n; i++) t[i] = d[i] * (x[i] - (2 * s * w[i]) / ww);
      let s2 = 0;
      for (let i = 0; i < n; i++) s2 += w[i] * t[i];
      for (let i = 0; i < n; i++) y[i] = t[i] - (2 * s2 * w[i]) / ww;
    };
    const r = leadingSymmetricEigen(product, n, 3);
    expect(r.converged).toBe(true);
    expect(Array.from(r.values)).toEqual([5, 5, 4].map((x) => expect.closeTo(x, 12)));
    let dot = 0;
    for (let i = 0; i < n; i++) dot += r.vectors[i * 3] * r.vectors[i * 3 + 1];
    expect(Math.abs(dot)).toBeLessThan(1e-12);
  });

  it('solves small operators densely (n ≤ dim) and exactly', () => {
    const n = 20;
    const a = randomSymmetric(n, 602);
    const r = leadingSymmetricEigen(denseProduct(a, n), n, 3);
    const dense = Array.from(symmetricEigen(a, n).values).sort((x, y) => Math.abs(y) - Math.abs(x));
    for (let j = 0; j < 3; j++) expect(r.values[j]).toBeCloseTo(dense[j], 12);
    expect(r.converged).toBe(true);
  });

  it('handles an operator of low rank (invariant Krylov space)', () => {
    // A = 3 u uᵀ − 2 w wᵀ with orthonormal u, w: the Krylov space of any start vector has dimension 2.
    const n = 500;
    const u = new Float64Array(n).fill(1 / Math.sqrt(n));
    const w = Float64Array.from({ length: n }, (_, i) => (i % 2 === 0 ? 1 : -1) / Math.sqrt(n));
    const product = (x: Float64Array, y: Float64Array) => {
      let su = 0;
      let sw = 0;
      for (let i = 0; i < n; i++) {
        su += u[i] * x[i];
        sw += w[i] * x[i];
      }
      for (let i = 0; i < n; i++) y[i] = 3 * su * u[i] - 2 * sw * w[i];
    };
    const r = leadingSymmetricEigen(product, n, 3);
    expect(r.converged).toBe(true);
    expect(r.values[0]).toBeCloseTo(3, 12);
    expect(r.values[1]).toBeCloseTo(-2, 12);
    expect(Math.abs(r.values[2])).toBeLessThan(1e-12);
  });

  it('reports converged = false when the product budget is too small, and still returns its best guess', () => {
    const n = 2000;
    const r = leadingSymmetricEigen(toeplitzProduct(n), n, 4, { maxIterations: 60 });
    expect(r.converged).toBe(false);
    expect(r.values).toHaveLength(4);
    for (let j = 0; j < 4; j++) expect(r.values[j]).toBeGreaterThan(3.5);
  });

  it('is reproducible for a given seed', () => {
    const n = 400;
    const a = randomSymmetric(n, 603);
    const first = leadingSymmetricEigen(denseProduct(a, n), n, 2, { seed: 42 });
    const again = leadingSymmetricEigen(denseProduct(a, n), n, 2, { seed: 42 });
    expect(Array.from(again.values)).toEqual(Array.from(first.values));
  });

  it.each([
    ['k > n', () => leadingSymmetricEigen(() => {}, 5, 6), /k = 6 exceeds the dimension n = 5/],
    ['a zero tolerance', () => leadingSymmetricEigen(() => {}, 5, 1, { tol: 0 }), /tol must lie in \(0, 1\), got 0/],
    ['a fractional seed', () => leadingSymmetricEigen(() => {}, 100, 1, { seed: 0.5 }), /seed must be an integer, got 0.5/],
    ['a dim below k + 2', () => leadingSymmetricEigen(() => {}, 100, 5, { dim: 6 }), /dim must be an integer in \[7, 100\] \(at least min\(n, k \+ 2\)\), got 6/],
    ['a non-finite product', () => leadingSymmetricEigen((_x, y) => y.fill(NaN), 100, 1), /matvec wrote NaN to y\[0\]/],
  ])('rejects %s with a precise message', (_name, call, message) => {
    expect(call).toThrow(message);
  });
});
