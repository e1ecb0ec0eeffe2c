import { describe, expect, it } from 'vitest';
import { frobeniusNorm, hermitianDefect, identity, matmul, transpose } from '../../../src-core/numerics/linalg';
import { randomHermitian, randomMatrix } from './helpers';

describe('dense helpers', () => {
  it('matmul multiplies a 2×3 by a 3×2 matrix', () => {
    const a = Float64Array.of(1, 2, 3, 4, 5, 6);
    const b = Float64Array.of(7, 8, 9, 10, 11, 12);
    expect(Array.from(matmul(a, b, 2, 3, 2))).toEqual([58, 64, 139, 154]);
  });

  it('matmul with the identity returns the matrix, and (AB)ᵀ = BᵀAᵀ', () => {
    const a = randomMatrix(4, 5, 1);
    const b = randomMatrix(5, 3, 2);
    expect(Array.from(matmul(identity(4), a, 4, 4, 5))).toEqual(Array.from(a));
    const left = transpose(matmul(a, b, 4, 5, 3), 4, 3);
    const right = matmul(transpose(b, 5, 3), transpose(a, 4, 5), 3, 5, 4);
    for (let p = 0; p < left.length; p++) expect(left[p]).toBeCloseTo(right[p], 14);
  });

  it('transpose of a 2×3 matrix', () => {
    expect(Array.from(transpose(Float64Array.of(1, 2, 3, 4, 5, 6), 2, 3))).toEqual([1, 4, 2, 5, 3, 6]);
  });

  it('frobeniusNorm of real and complex matrices, without overflow', () => {
    expect(frobeniusNorm(Float64Array.of(3, 4))).toBe(5);
    expect(frobeniusNorm(Float64Array.of(1, 2), Float64Array.of(2, 4))).toBe(5);
    expect(frobeniusNorm(Float64Array.of(3e200, 4e200))).toBeCloseTo(5e200, -186);
    expect(frobeniusNorm(new Float64Array(3))).toBe(0);
  });

  it('hermitianDefect is 0 for Hermitian and real symmetric matrices', () => {
    const h = randomHermitian(6, 3);
    expect(hermitianDefect(h.re, h.im, 6)).toBe(0);
    expect(hermitianDefect(h.re, null, 6)).toBe(0);
    expect(hermitianDefect(new Float64Array(4), null, 2)).toBe(0);
  });

  it.each([
    // A = [[0, 1], [0, 0]]: A − Aᵀ = [[0, 1], [−1, 0]], ‖·‖ = √2, ‖A‖ = 1
    [[0, 1, 0, 0], null, Math.SQRT2],
    // A = i·I: A − Aᴴ = 2i·I, ‖·‖ = 2√2, ‖A‖ = √2 → 2
    [[0, 0, 0, 0], [1, 0, 0, 1], 2],
    // A = [[1, 2], [3, 4]]: A − Aᵀ has ±1 off the diagonal → √2 / √30
    [[1, 2, 3, 4], null, Math.SQRT2 / Math.sqrt(30)],
  ])('hermitianDefect of %j + i·%j is %f', (re, im, expected) => {
    const d = hermitianDefect(Float64Array.from(re), im === null ? null : Float64Array.from(im), 2);
    expect(d).toBeCloseTo(expected, 15);
  });

  it.each([
    ['matmul with a short b', () => matmul(new Float64Array(6), new Float64Array(5), 2, 3, 2), /b must hold 3×2 = 6 entries, got 5/],
    ['transpose with a bad shape', () => transpose(new Float64Array(5), 2, 3), /a must hold 2×3 = 6 entries, got 5/],
    ['hermitianDefect with a bad n', () => hermitianDefect(new Float64Array(4), null, 0), /n must be a positive integer, got 0/],
    ['frobeniusNorm with unequal parts', () => frobeniusNorm(new Float64Array(2), new Float64Array(3)), /same length, got 2 and 3/],
  ])('rejects %s with a precise message', (_name, call, message) => {
    expect(call).toThrow(message);
  });
});
