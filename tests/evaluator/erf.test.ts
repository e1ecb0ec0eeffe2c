/**
 * erf against an independent reference: the Maclaurin series erf(x) = 2/√π Σ (−1)ⁿ x^(2n+1) / (n! (2n+1)) summed
 * in 100-digit decimal arithmetic (mathjs BigNumber), plus mathjs's own erf and a few tabulated values.
 */
import { all, create } from 'mathjs';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { erf } from '../../src-core/semantics/evaluator/erf';

const big = create(all, { number: 'BigNumber', precision: 100 });

/** erf(x) to far more than double precision (the series converges for all x; 100 digits absorb its cancellation). */
function erfReference(x: number): number {
  const X = big.bignumber(x);
  const x2 = X.times(X);
  const tiny = big.bignumber('1e-90');
  let power = X; // (−1)ⁿ x^(2n+1) / n!
  let sum = big.bignumber(0);
  for (let n = 0; n < 2000; n++) {
    const term = power.div(2 * n + 1);
    sum = sum.plus(term);
    if (term.abs().lt(tiny)) break;
    power = power.neg().times(x2).div(n + 1);
  }
  const sqrtPi = big.bignumber(big.pi as unknown as number).sqrt();
  return sum.times(2).div(sqrtPi).toNumber();
}

/**
 * Relative error, measured against at least the smallest normal double: a subnormal result (|erf x| < 2.2e-308)
 * is only good to the absolute spacing of subnormals, 4.9e-324 (IEEE 754, common practice).
 */
function relativeError(value: number, reference: number): number {
  return Math.abs(value - reference) / Math.max(Math.abs(reference), 2.2250738585072014e-308);
}

const plainMath = create(all);
const mathjsErf = (x: number): number => plainMath.erf(x) as number;

describe('erf', () => {
  // One point per interval of Cody's method and its borders, both signs.
  const points = [0, 1e-300, 1e-9, 0.1, 0.3, 0.46875, 0.4687500000000001, 0.5, 1, 1.5, 2, 3, 3.999, 4, 4.001, 4.5, 5, 5.9, 6];
  for (const x of points) {
    for (const sx of x === 0 ? [x] : [x, -x]) {
      it(`erf(${sx}) is within 1e-15 relative of the 100-digit series`, () => {
        expect(relativeError(erf(sx), erfReference(sx))).toBeLessThanOrEqual(1e-15);
      });
    }
  }

  it('random arguments in [-6, 6] are within 1e-15 relative of the series', () => {
    fc.assert(
      fc.property(fc.double({ min: -6, max: 6, noNaN: true }), (x) => relativeError(erf(x), erfReference(x)) <= 1e-15),
      { numRuns: 300, seed: 20240611 },
    );
  });

  it('agrees with mathjs erf to 1e-15 relative', () => {
    fc.assert(
      fc.property(fc.double({ min: -10, max: 10, noNaN: true }), (x) => relativeError(erf(x), mathjsErf(x)) <= 1e-15),
      { numRuns: 500, seed: 7 },
    );
  });

  // Abramowitz & Stegun, "Handbook of Mathematical Functions" (1964), Table 7.1 (values quoted from memory, to 16
  // digits; the series test above is the authority).
  const tabulated: [number, number][] = [
    [0.5, 0.5204998778130465],
    [1, 0.8427007929497149],
    [2, 0.9953222650189527],
    [3, 0.9999779095030014],
  ];
  for (const [x, value] of tabulated) {
    it(`erf(${x}) = ${value} (A&S Table 7.1)`, () => {
      expect(relativeError(erf(x), value)).toBeLessThanOrEqual(2e-16);
    });
  }

  const special: [string, number, number][] = [
    ['erf(+∞) = 1', Infinity, 1],
    ['erf(−∞) = −1', -Infinity, -1],
    ['erf(100) = 1', 100, 1],
  ];
  for (const [name, x, value] of special) it(name, () => expect(erf(x)).toBe(value));
  it('erf(NaN) is NaN', () => expect(erf(NaN)).toBeNaN());
  it('erf(−0) is −0 (odd function)', () => expect(Object.is(erf(-0), -0)).toBe(true));
  it('erf is odd: erf(−x) = −erf(x) exactly', () => {
    fc.assert(fc.property(fc.double({ noNaN: true }), (x) => Object.is(erf(-x), -erf(x))));
  });
});
