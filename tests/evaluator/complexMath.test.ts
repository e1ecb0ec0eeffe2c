/**
 * The complex helpers against exact values and identities of the elementary functions (common practice), where
 * mathjs is not precise enough to be the judge: near zeros, far out where its textbook formulas overflow, and on
 * branch cuts. (Away from those places crossCheck.test.ts compares them with mathjs operation by operation.)
 */
// Citations of books and papers in this file (authors, years, sections) are given from memory.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  catan, ccos, ccosh, cdiv, cexp, clog, complexOut, cpow, csign, csin, csinh, csqrt, ctan, ctanh,
} from '../../src-core/semantics/evaluator/complexMath';

type Pair = [number, number];
const call = (f: (...a: number[]) => void, ...args: number[]): Pair => {
  f(...args);
  return [complexOut[0], complexOut[1]];
};
const mul = ([a, b]: Pair, [c, d]: Pair): Pair => [a * c - b * d, a * d + b * c];
const div = ([a, b]: Pair, [c, d]: Pair): Pair => {
  const m = c * c + d * d;
  return [(a * c + b * d) / m, (b * c - a * d) / m];
};
/** |x − y| ≤ rel · max(|x|, |y|) in modulus. */
const near = (x: Pair, y: Pair, rel: number): boolean =>
  Math.hypot(x[0] - y[0], x[1] - y[1]) <= rel * Math.max(Math.hypot(...x), Math.hypot(...y));

/** Parts of magnitude 1e-3 to 3, or exactly 0: far from overflow and subnormals, where the identities' own
 * conditioning (e.g. exp(log z) loses |log |z||·ε) stays below the tolerances. */
const moderate = fc.oneof(
  { weight: 5, arbitrary: fc.double({ min: 1e-3, max: 3, noNaN: true }).chain((x) => fc.constantFrom(x, -x)) },
  { weight: 1, arbitrary: fc.constant(0) },
);

describe('exact values', () => {
  const pi = Math.PI;
  const cases: [string, Pair, Pair][] = [
    ['(1+i)^2 = 2i', call(cpow, 1, 1, 2, 0), [0, 2]],
    ['(1+i)^8 = 16', call(cpow, 1, 1, 8, 0), [16, 0]],
    ['(1+i)^-2 = -i/2', call(cpow, 1, 1, -2, 0), [0, -0.5]],
    ['(1+2i)^5 = 41 - 38i', call(cpow, 1, 2, 5, 0), [41, -38]],
    ['z^0 = 1, also 0^0', call(cpow, 0, 0, 0, 0), [1, 0]],
    ['0^(1+i) = 0', call(cpow, 0, 0, 1, 1), [0, 0]],
    ['0^(-1/2) = ∞ (real base and exponent: Math.pow)', call(cpow, 0, 0, -0.5, 0), [Infinity, 0]],
    ['4^(1/2) = 2', call(cpow, 4, 0, 0.5, 0), [2, 0]],
    ['sqrt(-4) = 2i (upper side of the cut)', call(csqrt, -4, 0), [0, 2]],
    ['sqrt(-4 - 0i) = 2i (−0 read as +0)', call(csqrt, -4, -0), [0, 2]],
    ['sqrt(2i) = 1 + i', call(csqrt, 0, 2), [1, 1]],
    ['sqrt(-2i) = 1 - i', call(csqrt, 0, -2), [1, -1]],
    ['log(-1) = iπ', call(clog, -1, 0), [0, pi]],
    ['log(-1 - 0i) = iπ (−0 read as +0)', call(clog, -1, -0), [0, pi]],
    ['log(i) = iπ/2', call(clog, 0, 1), [0, pi / 2]],
    ['log(0) = −∞', call(clog, 0, 0), [-Infinity, 0]],
    ['exp(iπ) = −1 (to rounding of π)', call(cexp, 0, pi), [-1, Math.sin(pi)]],
    ['atan(2i) has real part π/2 (cut, upper side)', call(catan, 0, 2), [pi / 2, Math.log(3) / 2]],
    ['atan(-2i) has real part π/2 as mathjs', call(catan, 0, -2), [pi / 2, -Math.log(3) / 2]],
    ['atan(i) = i∞', call(catan, 0, 1), [0, Infinity]],
    ['atan(1e300 + 1e300i) = π/2 + i/(2e300)', call(catan, 1e300, 1e300), [pi / 2, 0.5e-300]],
    ['tanh(1000 + i) = 1 (mathjs: NaN)', call(ctanh, 1000, 1), [1, 0]],
    ['tan(1 + 400i) = i (mathjs: NaN)', call(ctan, 1, 400), [0, 1]],
    ['(1e300 + 1e300i)/(1e300 + 1e300i) = 1 (Smith, no overflow)', call(cdiv, 1e300, 1e300, 1e300, 1e300), [1, 0]],
    ['(1e-300 + 2e-300i)/(1e-300) = 1 + 2i', call(cdiv, 1e-300, 2e-300, 1e-300, 0), [1, 2]],
    ['1/(0 + 0i) = ∞ + 0i', call(cdiv, 1, 0, 0, 0), [Infinity, 0]],
    ['sign(3 + 4i) = 0.6 + 0.8i', call(csign, 3, 4), [0.6, 0.8]],
    ['sign(−∞ + 0i) = −1', call(csign, -Infinity, 0), [-1, 0]],
    ['sign(1e308 + 1e308i) = (1 + i)/√2 (no overflow)', call(csign, 1e308, 1e308), [Math.SQRT1_2, Math.SQRT1_2]],
    ['sign(5e-324 + 5e-324i) = (1 + i)/√2 (subnormals scaled)', call(csign, 5e-324, 5e-324), [Math.SQRT1_2, Math.SQRT1_2]],
    ['atan(−0.99i) = −i·atanh(0.99) (no cancellation near the cut; Math.atanh)', call(catan, 0, -0.99), [0, -Math.atanh(0.99)]],
  ];
  for (const [name, actual, expected] of cases) {
    it(name, () => {
      for (const k of [0, 1]) {
        if (Number.isFinite(expected[k])) expect(Math.abs(actual[k] - expected[k])).toBeLessThanOrEqual(4e-16 * Math.max(1, Math.abs(expected[k])) + 1e-316);
        else expect(actual[k]).toBe(expected[k]);
      }
    });
  }
});

describe('identities at random points of [-3, 3]²', () => {
  const identities: [string, (x: number, y: number) => boolean][] = [
    ['exp(log z) = z', (x, y) => near(call(cexp, ...call(clog, x, y)), [x, y], 1e-14)],
    ['sqrt(z)² = z, Re sqrt(z) ≥ 0', (x, y) => {
      const r = call(csqrt, x, y);
      return near(mul(r, r), [x, y], 1e-15) && r[0] >= 0;
    }],
    ['tan z = sin z / cos z', (x, y) => near(call(ctan, x, y), div(call(csin, x, y), call(ccos, x, y)), 1e-13)],
    ['tanh z = sinh z / cosh z', (x, y) => near(call(ctanh, x, y), div(call(csinh, x, y), call(ccosh, x, y)), 1e-13)],
    ['atan(tan z) = z for |Re z| < π/2', (x, y) => Math.abs(x / 2) >= Math.PI / 2 || near(call(catan, ...call(ctan, x / 2, y)), [x / 2, y], 1e-12)],
    ['z^3 = z·z·z', (x, y) => near(call(cpow, x, y, 3, 0), mul(mul([x, y], [x, y]), [x, y]), 1e-15)],
    ['z^(1/2) = sqrt z', (x, y) => near(call(cpow, x, y, 0.5, 0), call(csqrt, x, y), 1e-14)],
    ['(z / w)·w = z for w = (y, x + 1)', (x, y) => near(mul(call(cdiv, x, y, y, x + 1), [y, x + 1]), [x, y], 1e-15)],
    ['|sign z| = 1 for z ≠ 0 (to 2 ulps)', (x, y) => (x === 0 && y === 0) || Math.abs(Math.hypot(...call(csign, x, y)) - 1) <= 4.5e-16],
  ];
  for (const [name, holds] of identities) {
    it(name, () => {
      fc.assert(fc.property(moderate, moderate, holds), { numRuns: 2000, seed: 9 });
    });
  }
});

describe('small arguments keep their relative accuracy (Maclaurin series)', () => {
  it('atan z = z − z³/3 + z⁵/5 for |z| < 1e-3', () => {
    const small = fc.double({ min: -1e-3, max: 1e-3, noNaN: true });
    fc.assert(
      fc.property(small, small, (x, y) => {
        const z: Pair = [x, y];
        const z3 = mul(mul(z, z), z);
        const z5 = mul(mul(z3, z), z);
        const series: Pair = [x - z3[0] / 3 + z5[0] / 5, y - z3[1] / 3 + z5[1] / 5];
        return (x === 0 && y === 0) || near(call(catan, x, y), series, 1e-15);
      }),
      { numRuns: 2000, seed: 10 },
    );
  });
});
