/**
 * Property tests on random IR trees over every operator and every builtin, real and complex (randomIr.ts):
 *
 * 1. The four entries (interpret, evaluate, evaluateColumns, evaluateGrid) agree bit for bit, at any doubles
 *    including NaN, ±∞, ±0 and extremes.
 * 2. Operation by operation, every node's compiled value equals mathjs applied to the same children's values
 *    (1e-12 relative to the modulus, plus 1e-15 absolute: mathjs's complex atan and log lose relative accuracy
 *    near their zeros), with the same NaN/∞ status. On the complex path this is checked where the inputs are
 *    finite: complex infinities have no single representation (complex.js turns NaN − i into ∞ + ∞i).
 * 3. Whole trees: the value from each compiled entry equals mathjs's `evaluate` of the equivalent expression
 *    (toMathjs), with the same status. Real path: 1e-12 relative (both do the same IEEE operations; only erf
 *    differs, by an ulp). Complex path: where every intermediate value is finite in both evaluators, within 1e-9
 *    of the largest intermediate modulus (the formulas differ, and cancellation can magnify an ulp).
 * mathjs semantics that differ on purpose are restated in mathjs terms in irBuilder.ts (mathjsPrelude): exact
 * comparisons and floor, NaN-propagating logic, NaN for complex arguments of real-only functions (mathjs's min and
 * max throw on Complex, its floor rounds each part), real pow of negative bases. Points for the mathjs checks are
 * kept in [1e-6, 3] in magnitude (or special values): complex.js squares the parts in abs and sign, which
 * underflows below 1e-154. Seeds are fixed so a failure reproduces.
 */
// Citations of books and papers in this file (authors, years, sections) are given from memory.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { compileKernel } from '../../src-core/semantics/evaluator';
import { entryDisagreement, runEntries, sameDouble } from './checkEntries';
import { toMathjs } from './irBuilder';
import { closeValues, mathjsEvaluate, mathjsValue, statusOf } from './mathjsReference';
import { nodeValues, oneOperation, subtreeFunctions } from './nodeValues';
import { irArb } from './randomIr';

const anyDouble = fc.oneof(
  { weight: 4, arbitrary: fc.double() },
  { weight: 1, arbitrary: fc.constantFrom(0, -0, 1, -1, 2, 0.5, NaN, Infinity, -Infinity) },
);
const moderate = fc.oneof(
  { weight: 3, arbitrary: fc.double({ min: 1e-6, max: 3, noNaN: true }).chain((x) => fc.constantFrom(x, -x)) },
  { weight: 1, arbitrary: fc.constantFrom(0, 1, -1, 2, 0.5, -0.5) },
);

for (const complex of [false, true]) {
  const path = complex ? 'complex path' : 'real path';

  describe(`compiled entries and interpret agree bit for bit (${path})`, () => {
    it('random trees up to depth 6 at any doubles', () => {
      fc.assert(
        fc.property(irArb(complex, 6), anyDouble, anyDouble, (fn, t, s) => entryDisagreement(runEntries(fn, [t, s])) === ''),
        { numRuns: 1500, seed: complex ? 101 : 100 },
      );
    });

    it('a random grid and the same points as columns match evaluate point by point', () => {
      const coords = fc.array(anyDouble, { minLength: 1, maxLength: 6 });
      fc.assert(
        fc.property(irArb(complex, 5), coords, coords, (fn, tList, sList) => {
          const kernel = compileKernel(fn);
          const ts = Float64Array.from(tList);
          const ss = Float64Array.from(sList);
          const n = ts.length * ss.length;
          const gridRe = new Float64Array(n);
          const gridIm = new Float64Array(n);
          kernel.evaluateGrid(ts, ss, gridRe, complex ? gridIm : null);
          const colT = new Float64Array(n);
          const colS = new Float64Array(n);
          for (let i = 0; i < ts.length; i++) for (let j = 0; j < ss.length; j++) [colT[i * ss.length + j], colS[i * ss.length + j]] = [ts[i], ss[j]];
          const colRe = new Float64Array(n);
          const colIm = new Float64Array(n);
          kernel.evaluateColumns([colT, colS], colRe, complex ? colIm : null);
          for (let k = 0; k < n; k++) {
            const p = kernel.evaluate([colT[k], colS[k]]);
            const im = complex ? [gridIm[k], colIm[k]] : [0, 0];
            if (![gridRe[k], colRe[k]].every((x) => sameDouble(x, p.re)) || !im.every((x) => sameDouble(x, p.im))) return false;
          }
          return true;
        }),
        { numRuns: 300, seed: complex ? 111 : 110 },
      );
    });
  });

  describe(`each operation agrees with mathjs on the same inputs (${path})`, () => {
    it('every node of random trees up to depth 4', () => {
      let checked = 0;
      fc.assert(
        fc.property(irArb(complex, 4), moderate, moderate, (fn, t, s) => {
          const values = nodeValues(fn, t, s);
          for (const v of values.values()) {
            const one = oneOperation(v.node, complex);
            if (!one) continue;
            const kids = v.children.map((c) => values.get(c)!);
            if (complex && !kids.every((k) => Number.isFinite(k.re) && Number.isFinite(k.im))) continue;
            const expression = toMathjs(one.fn, one.vars);
            const ref = mathjsEvaluate(expression, Object.fromEntries(kids.map((k, i) => [`a${i}`, k])), complex);
            checked++;
            if (!closeValues(v, ref, complex, 1e-12, 1e-15)) {
              const inputs = kids.map((k) => `${k.re}${k.realTyped ? '' : ` + ${k.im}i`}`).join(', ');
              throw new Error(`${expression} at (${inputs}): evaluator ${v.re} + ${v.im}i, mathjs ${ref.re} + ${ref.im}i`);
            }
          }
          return true;
        }),
        { numRuns: 1500, seed: complex ? 201 : 200 },
      );
      expect(checked).toBeGreaterThan(3000);
    });
  });

  describe(`whole trees agree with mathjs evaluate (${path})`, () => {
    it('random trees up to depth 4, all three compiled entries', () => {
      let compared = 0;
      fc.assert(
        fc.property(irArb(complex, 4), moderate, moderate, (fn, t, s) => {
          const values = nodeValues(fn, t, s);
          let scale = 0;
          let allFinite = true;
          for (const v of values.values()) {
            if (Number.isFinite(v.re) && Number.isFinite(v.im)) scale = Math.max(scale, Math.hypot(v.re, v.im));
            else allFinite = false;
          }
          if (complex && !allFinite) return true;
          // complex.js overflows in its textbook formulas (tan(1e6 i) has a NaN part): compare only where mathjs's
          // own intermediate values are finite too.
          if (complex) {
            for (const sub of subtreeFunctions(fn).values()) {
              if (statusOf(mathjsValue(sub, t, s).value, true) !== 'finite') return true;
            }
          }
          const { value: ref, expression } = mathjsValue(fn, t, s);
          const entries = runEntries(fn, [t, s]);
          const rel = complex ? 0 : 1e-12;
          const abs = complex ? 1e-9 * scale : 0;
          for (const [name, v] of [['evaluate', entries.point], ['evaluateColumns', entries.columns], ['evaluateGrid', entries.grid!]] as const) {
            if (!closeValues(v, ref, complex, rel, abs)) {
              throw new Error(`${name}: ${expression} at t = ${t}, s = ${s}: evaluator ${v.re} + ${v.im}i (${statusOf(v, complex)}), mathjs ${ref.re} + ${ref.im}i`);
            }
          }
          compared++;
          return true;
        }),
        { numRuns: 1500, seed: complex ? 301 : 300 },
      );
      expect(compared).toBeGreaterThan(complex ? 900 : 1400);
    });
  });
}
