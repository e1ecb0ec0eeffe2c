import { describe, expect, it } from 'vitest';
import { hermitianTridiagonalize } from '../../../src-core/numerics/linalg/hermitianTridiagonal';
import { tridiagonalQl, symmetricTridiagonalQl } from '../../../src-core/numerics/linalg/symmetricTridiagonalQl';
import { adjoint, cmatmul, type CMat, orthonormalityDefect, randomHermitian } from './helpers';

/** U as an n×n complex matrix (row-major) from the by-columns layout of hermitianTridiagonalize. */
function unitary(columns: Float64Array, n: number): CMat {
  const re = new Float64Array(n * n);
  const im = new Float64Array(n * n);
  for (let c = 0; c < n; c++) {
    for (let r = 0; r < n; r++) {
      re[r * n + c] = columns[c * 2 * n + r];
      im[r * n + c] = columns[c * 2 * n + n + r];
    }
  }
  return { re, im };
}

/** max |A − U T Uᴴ| and max |UᴴU − I| for the reduction of the Hermitian matrix a. */
function reductionDefects(a: CMat, n: number) {
  const { d, e, columns } = hermitianTridiagonalize(a.re, a.im, n);
  const u = unitary(columns, n);
  const t: CMat = { re: new Float64Array(n * n), im: new Float64Array(n * n) };
  for (let i = 0; i < n; i++) {
    t.re[i * n + i] = d[i];
    if (i > 0) t.re[i * n + i - 1] = t.re[(i - 1) * n + i] = e[i];
  }
  const back = cmatmul(cmatmul(u, t, n, n, n), adjoint(u, n, n), n, n, n);
  let worst = 0;
  for (let p = 0; p < n * n; p++) worst = Math.max(worst, Math.hypot(back.re[p] - a.re[p], back.im[p] - a.im[p]));
  return { reconstruction: worst, unitarity: orthonormalityDefect(u, n), e };
}

describe('hermitianTridiagonalize (complex Householder reduction, real off-diagonal by diagonal scaling)', () => {
  it.each([
    [1, 901],
    [2, 902],
    [3, 903],
    [17, 904],
    [60, 905],
  ])('gives A = U T Uᴴ with U unitary and a real non-negative subdiagonal, n = %i', (n, seed) => {
    const a = randomHermitian(n, seed);
    const r = reductionDefects(a, n);
    expect(r.reconstruction).toBeLessThan(1e-14 * n + 1e-14);
    expect(r.unitarity).toBeLessThan(1e-14 * n + 1e-15);
    expect(r.e[0]).toBe(0);
    for (let i = 1; i < n; i++) expect(r.e[i]).toBeGreaterThanOrEqual(0);
  });

  it('handles columns that need no reflector and a zero subdiagonal (two decoupled complex blocks)', () => {
    const n = 7;
    const a: CMat = { re: new Float64Array(n * n), im: new Float64Array(n * n) };
    const b1 = randomHermitian(3, 906);
    const b2 = randomHermitian(4, 907);
    for (let i = 0; i < 3; i++) for (let j = 0; j < 3; j++) {
      a.re[i * n + j] = b1.re[i * 3 + j];
      a.im[i * n + j] = b1.im[i * 3 + j];
    }
    for (let i = 0; i < 4; i++) for (let j = 0; j < 4; j++) {
      a.re[(i + 3) * n + j + 3] = b2.re[i * 4 + j];
      a.im[(i + 3) * n + j + 3] = b2.im[i * 4 + j];
    }
    const r = reductionDefects(a, n);
    expect(r.reconstruction).toBeLessThan(1e-14);
    expect(r.unitarity).toBeLessThan(1e-14);
    expect(r.e[3]).toBe(0);
  });

  it('reduces the Hermitian part of a non-Hermitian input and ignores an imaginary diagonal', () => {
    const n = 9;
    const a = randomHermitian(n, 908);
    const skew = { re: Float64Array.from(a.re), im: Float64Array.from(a.im) };
    for (let i = 0; i < n; i++) {
      skew.im[i * n + i] = 0.3 * (i + 1);
      for (let j = 0; j < i; j++) {
        skew.re[i * n + j] += 0.01 * (i - j); // antisymmetric real part: not Hermitian
        skew.re[j * n + i] -= 0.01 * (i - j);
      }
    }
    const x = hermitianTridiagonalize(a.re, a.im, n);
    const y = hermitianTridiagonalize(skew.re, skew.im, n);
    for (let i = 0; i < n; i++) {
      expect(y.d[i]).toBeCloseTo(x.d[i], 14);
      expect(y.e[i]).toBeCloseTo(x.e[i], 14);
    }
  });
});

describe('tridiagonalQl (the QL stage alone, rows of any length)', () => {
  const n = 30;
  const d0 = Float64Array.from({ length: n }, (_, i) => Math.sin(i + 1));
  const e0 = Float64Array.from({ length: n }, (_, i) => (i === 0 ? 0 : 0.5 + 0.25 * Math.cos(3 * i)));

  it('matches symmetricTridiagonalQl on the same tridiagonal matrix when started from the identity', () => {
    const full = new Float64Array(n * n);
    for (let i = 0; i < n; i++) {
      full[i * n + i] = d0[i];
      if (i > 0) full[i * n + i - 1] = full[(i - 1) * n + i] = e0[i];
    }
    const ref = symmetricTridiagonalQl(full, n);
    const eye = new Float64Array(n * n);
    for (let i = 0; i < n; i++) eye[i * n + i] = 1;
    const r = tridiagonalQl(Float64Array.from(d0), Float64Array.from(e0), eye, n, n);
    expect(r.converged).toBe(true);
    for (let k = 0; k < n; k++) {
      expect(Math.abs(r.values[k] - ref.values[k])).toBeLessThan(1e-14);
      let dot = 0;
      for (let i = 0; i < n; i++) dot += r.vectorRows[k * n + i] * ref.vectorRows[k * n + i];
      expect(Math.abs(Math.abs(dot) - 1)).toBeLessThan(1e-12);
    }
  });

  it('applies the rotations to rows of another length (values only with length 1; U Z with length 2n)', () => {
    const eye = new Float64Array(n * n);
    for (let i = 0; i < n; i++) eye[i * n + i] = 1;
    const ref = tridiagonalQl(Float64Array.from(d0), Float64Array.from(e0), eye, n, n);
    const only = tridiagonalQl(Float64Array.from(d0), Float64Array.from(e0), new Float64Array(n), n, 1);
    expect(Array.from(only.values)).toEqual(Array.from(ref.values));
    // Start from rows [I | 2I]: every row of the result is [z_k | 2 z_k].
    const wide = new Float64Array(n * 2 * n);
    for (let i = 0; i < n; i++) {
      wide[i * 2 * n + i] = 1;
      wide[i * 2 * n + n + i] = 2;
    }
    const r = tridiagonalQl(Float64Array.from(d0), Float64Array.from(e0), wide, n, 2 * n);
    for (let k = 0; k < n; k++) {
      for (let i = 0; i < n; i++) {
        expect(r.vectorRows[k * 2 * n + i]).toBe(ref.vectorRows[k * n + i]);
        expect(r.vectorRows[k * 2 * n + n + i]).toBeCloseTo(2 * ref.vectorRows[k * n + i], 14);
      }
    }
  });
});
