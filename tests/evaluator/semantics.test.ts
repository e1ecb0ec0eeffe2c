/**
 * The evaluator's semantics, case by case: the value at a point, and for a fault its kind, the text of the node it
 * is reported on, the operation and the offending argument. Every case also runs through the three compiled
 * entries, which must agree with the interpreter bit for bit.
 *
 * Sources of the expected values: "IEEE" = IEEE 754 double arithmetic and the JavaScript Math functions (common
 * practice); "mathjs" = the value mathjs 15 gives for the same formula (checked live in the last block of this
 * file); "choice" = a documented choice of the evaluator (see the file headers named in the case).
 */
import { all, create } from 'mathjs';
import { describe, expect, it } from 'vitest';
import { compileFunction, type EvalFaultKind } from '../../src-core/semantics/evaluator';
import { entryDisagreement, runEntries } from './checkEntries';
import { irFromText, sliceOf } from './irBuilder';

interface Case {
  formula: string;
  at: [number, number];
  complex?: boolean;
  /** Expected value: [re, im]. */
  value: [number, number];
  source: string;
  fault?: { kind: EvalFaultKind; on: string; fn?: string; arg?: [number, number] };
}

const pi = Math.PI;

const cases: Case[] = [
  // Real path: domain faults and non-finite values.
  { formula: 'sqrt(t - 2)', at: [1, 0], value: [NaN, 0], source: 'choice (interpret.ts)', fault: { kind: 'real-domain', on: 'sqrt(t - 2)', fn: 'sqrt', arg: [-1, 0] } },
  { formula: 'log(t - s)', at: [0.5, 0.5], value: [-Infinity, 0], source: 'IEEE', fault: { kind: 'non-finite', on: 'log(t - s)', fn: 'log', arg: [0, 0] } },
  { formula: 'log(t - s)', at: [0.5, 1], value: [NaN, 0], source: 'choice', fault: { kind: 'real-domain', on: 'log(t - s)', fn: 'log', arg: [-0.5, 0] } },
  { formula: '(t - 9) ^ (1 / 3)', at: [1, 0], value: [NaN, 0], source: 'choice (mathjs predictable gives -2)', fault: { kind: 'real-domain', on: '(t - 9) ^ (1 / 3)', fn: '^', arg: [-8, 0] } },
  { formula: '(t - 9) ^ 3', at: [1, 0], value: [-512, 0], source: 'IEEE' },
  { formula: 't / (t - s)', at: [1, 1], value: [Infinity, 0], source: 'IEEE', fault: { kind: 'non-finite', on: 't / (t - s)', fn: '/', arg: [0, 0] } },
  { formula: '(t - s) / (t - s)', at: [1, 1], value: [NaN, 0], source: 'IEEE', fault: { kind: 'non-finite', on: '(t - s) / (t - s)', fn: '/', arg: [0, 0] } },
  { formula: '2 * (0 * log(t))', at: [0, 0], value: [NaN, 0], source: 'IEEE: 0·(−∞) = NaN; the fault is where the ∞ began', fault: { kind: 'non-finite', on: 'log(t)', fn: 'log', arg: [0, 0] } },
  { formula: 'exp(1000 * t)', at: [1, 0], value: [Infinity, 0], source: 'IEEE overflow', fault: { kind: 'non-finite', on: 'exp(1000 * t)', fn: 'exp', arg: [1000, 0] } },
  { formula: 'exp(-1 / abs(t - s))', at: [0.25, 0.25], value: [0, 0], source: 'IEEE: exp(−∞) = 0, so no fault' },
  { formula: 't < s ? log(t) : 0', at: [-1, -2], value: [0, 0], source: 'choice: the untaken branch is not evaluated' },
  { formula: 't < s ? log(t) : 0', at: [-2, -1], value: [NaN, 0], source: 'choice', fault: { kind: 'real-domain', on: 'log(t)', fn: 'log', arg: [-2, 0] } },
  { formula: 'sqrt(t - 2) < 1 ? 1 : 0', at: [1, 0], value: [NaN, 0], source: 'choice (logicOps.ts): NaN is no truth value', fault: { kind: 'real-domain', on: 'sqrt(t - 2)', fn: 'sqrt' } },
  { formula: '(t - s) / (t - s) ? 1 : 2', at: [1, 1], value: [NaN, 0], source: 'choice: NaN test gives NaN', fault: { kind: 'non-finite', on: '(t - s) / (t - s)', fn: '/' } },
  // Real path: ordinary values.
  { formula: 't < s ? t * (1 - s) : s * (1 - t)', at: [0.25, 0.5], value: [0.125, 0], source: 'IEEE' },
  { formula: 't < s ? t * (1 - s) : s * (1 - t)', at: [0.5, 0.25], value: [0.125, 0], source: 'IEEE' },
  { formula: 't == s', at: [0.1 + 0.2, 0.3], value: [0, 0], source: 'choice: exact comparison (mathjs: true within relTol)' },
  { formula: 't != s', at: [0.1 + 0.2, 0.3], value: [1, 0], source: 'choice: exact comparison' },
  { formula: 't <= s', at: [2, 2], value: [1, 0], source: 'IEEE' },
  { formula: 't >= s', at: [1, 2], value: [0, 0], source: 'IEEE' },
  { formula: 't and s', at: [2, 0], value: [0, 0], source: 'mathjs' },
  { formula: 't or s', at: [2, 0], value: [1, 0], source: 'mathjs' },
  { formula: 'not t', at: [0, 0], value: [1, 0], source: 'mathjs' },
  { formula: 'not (t - s)', at: [3, 1], value: [0, 0], source: 'mathjs' },
  { formula: 'sign(t)', at: [0, 0], value: [0, 0], source: 'mathjs' },
  { formula: 'sign(t - s)', at: [1, 4], value: [-1, 0], source: 'mathjs' },
  { formula: 'min(t, s, 0.5)', at: [1, 0.75], value: [0.5, 0], source: 'mathjs' },
  { formula: 'max(t, s, -3)', at: [-4, -5], value: [-3, 0], source: 'mathjs' },
  { formula: 'min(t, s)', at: [NaN, 1], value: [NaN, 0], source: 'mathjs', fault: { kind: 'non-finite', on: 't' } },
  { formula: 'floor(t)', at: [-0.5, 0], value: [-1, 0], source: 'mathjs' },
  { formula: 'erf(t)', at: [1, 0], value: [0.8427007929497149, 0], source: 'Abramowitz & Stegun (1964) Table 7.1 (from memory)' },
  { formula: 'conj(t) + re(s) + im(t)', at: [1, 2], value: [3, 0], source: 'mathjs' },
  { formula: 'let(u, t - s, u * u)', at: [3, 1], value: [4, 0], source: 'IEEE' },
  { formula: 'let(u, t - s, let(w, u * u, w + u))', at: [3, 1], value: [6, 0], source: 'IEEE' },
  { formula: 'exp(-(t - s) ^ 2 / 0.1)', at: [0.3, 0.5], value: [Math.exp(-((0.3 - 0.5) ** 2) / 0.1), 0], source: 'IEEE' },
  // Complex path.
  { formula: 'sqrt(t - 2) + 0 * i', at: [1, 0], complex: true, value: [0, 1], source: 'mathjs: sqrt(-1) = i' },
  { formula: 'log(t - 2) + 0 * i', at: [1, 0], complex: true, value: [0, pi], source: 'mathjs: log(-1) = iπ' },
  { formula: '-(t - 2) * 0 + log(-(t - 2) - 2) + 0 * i', at: [1, 0], complex: true, value: [0, pi], source: 'choice (complexMath.ts): −0 imaginary parts read as +0, as mathjs for reals' },
  { formula: '(t - 9) ^ (1 / 3) + 0 * i', at: [1, 0], complex: true, value: [1.0000000000000002, 1.7320508075688772], source: 'mathjs: principal cube root 2·e^(iπ/3)' },
  { formula: 'i ^ 2', at: [0, 0], complex: true, value: [-1, 0], source: 'exact: i² = −1 (repeated squaring)' },
  { formula: '(t + 2 * i) ^ 3', at: [1, 0], complex: true, value: [-11, -2], source: 'exact Gaussian integer (mathjs: -10.999999999999998 - 1.9999999999999964i)' },
  { formula: '(t + 2 * i) ^ (-1)', at: [1, 0], complex: true, value: [0.2, -0.4], source: 'exact: 1/(1+2i) = (1−2i)/5, to rounding' },
  { formula: '0 * t * i ^ 0.5', at: [1, 0], complex: true, value: [0, 0], source: 'IEEE' },
  { formula: '(t * i) ^ (s + i)', at: [0, 1], complex: true, value: [0, 0], source: 'mathjs: 0^w = 0 for Re w > 0' },
  { formula: 'abs(3 + 4 * i) + t', at: [0, 0], complex: true, value: [5, 0], source: 'mathjs' },
  { formula: 'sign(3 * t + 4 * i)', at: [1, 0], complex: true, value: [0.6, 0.8], source: 'mathjs' },
  { formula: 'sign(t * i)', at: [0, 0], complex: true, value: [0, 0], source: 'mathjs: sign(0) = 0' },
  { formula: 'conj(t + 2 * i) + re(s * i) + im(t + 5 * i)', at: [1, 3], complex: true, value: [6, -2], source: 'mathjs' },
  { formula: 'atan(t * i)', at: [2, 0], complex: true, value: [pi / 2, 0.5493061443340548], source: 'mathjs' },
  { formula: 'atan(t * i)', at: [1, 0], complex: true, value: [0, Infinity], source: 'mathjs: atan(i) = i∞', fault: { kind: 'non-finite', on: 'atan(t * i)', fn: 'atan', arg: [0, 1] } },
  { formula: 'tan(1 + t * i)', at: [400, 0], complex: true, value: [0, 1], source: 'limit tan(x + i∞) = i (mathjs: NaN part)' },
  { formula: 'tanh(t + i)', at: [1000, 0], complex: true, value: [1, 0], source: 'limit tanh(∞ + i) = 1 (mathjs: NaN part)' },
  { formula: 'exp(i * 3 * (t - s)) * exp(-abs(t - s))', at: [0.3, 0.5], complex: true, value: [Math.cos(-0.6) * Math.exp(-0.2), Math.sin(-0.6) * Math.exp(-0.2)], source: 'Euler: e^(iθ) = cos θ + i sin θ' },
  { formula: '1 / (t - s) + 0 * i', at: [1, 1], complex: true, value: [Infinity, 0], source: 'choice: real-typed 1/0 as IEEE', fault: { kind: 'non-finite', on: '1 / (t - s)', fn: '/' } },
  { formula: '1 / (t * i - s)', at: [0, 0], complex: true, value: [Infinity, 0], source: 'choice (complexMath.ts): z/0 = ∞ in the non-zero parts', fault: { kind: 'non-finite', on: '1 / ((t * i) - s)', fn: '/', arg: [0, 0] } },
  { formula: 'max(i * t, s)', at: [2, 1], complex: true, value: [NaN, 0], source: 'choice: a real-only function of a complex value', fault: { kind: 'complex-where-real', on: 'max(i * t, s)', fn: 'max', arg: [0, 2] } },
  { formula: 'max(i * t, s)', at: [0, 1], complex: true, value: [1, 0], source: 'choice: zero imaginary part acts as real' },
  { formula: 'erf(t + i)', at: [1, 0], complex: true, value: [NaN, 0], source: 'choice', fault: { kind: 'complex-where-real', on: 'erf(t + i)', fn: 'erf', arg: [1, 1] } },
  { formula: 'floor(t + 0 * i)', at: [2.5, 0], complex: true, value: [2, 0], source: 'mathjs' },
  { formula: 't < s + i', at: [1, 2], complex: true, value: [NaN, 0], source: 'choice: comparisons need real values', fault: { kind: 'complex-where-real', on: 't < (s + i)', fn: '<', arg: [2, 1] } },
  { formula: '(t * i) ? 1 : 2', at: [1, 0], complex: true, value: [1, 0], source: 'mathjs: a complex test is true when non-zero' },
  { formula: 'not (t * i)', at: [1, 0], complex: true, value: [0, 0], source: 'mathjs' },
];

function close(actual: number, expected: number): boolean {
  if (Number.isNaN(expected)) return Number.isNaN(actual);
  if (!Number.isFinite(expected)) return actual === expected;
  return Math.abs(actual - expected) <= 4e-16 * Math.max(1, Math.abs(expected));
}

describe('evaluator semantics', () => {
  for (const c of cases) {
    const name = `${c.formula} at (${c.at.join(', ')})${c.complex ? ' [complex]' : ''} = ${c.value[0]} + ${c.value[1]}i — ${c.source}`;
    it(name, () => {
      const { fn, text } = irFromText(c.formula, ['t', 's'], c.complex ?? false);
      const v = runEntries(fn, c.at);
      expect(entryDisagreement(v)).toBe('');
      const r = v.interpreted;
      expect(close(r.re, c.value[0]), `re = ${r.re}`).toBe(true);
      expect(close(r.im, c.value[1]), `im = ${r.im}`).toBe(true);
      if (!c.fault) {
        expect(r.ok).toBe(true);
        return;
      }
      expect(r.ok).toBe(false);
      if (r.ok) return;
      expect(r.fault.kind).toBe(c.fault.kind);
      expect(sliceOf(text, r.fault.range)).toBe(c.fault.on);
      expect(r.fault.fn).toBe(c.fault.fn);
      if (c.fault.arg) expect([r.fault.argRe, r.fault.argIm]).toEqual(c.fault.arg);
      expect(close(r.fault.valueRe, r.re) || !Number.isFinite(r.re)).toBe(true);
    });
  }
});

describe('the cases marked mathjs agree with mathjs', () => {
  const real = create(all, { predictable: true });
  const complex = create(all);
  for (const c of cases.filter((k) => k.source.startsWith('mathjs') && !k.formula.includes('let('))) {
    it(c.formula, () => {
      const math = c.complex ? complex : real;
      const raw = math.evaluate(c.formula, { t: c.at[0], s: c.at[1] }) as unknown;
      const v = typeof raw === 'boolean' ? { re: Number(raw), im: 0 } : typeof raw === 'number' ? { re: raw, im: 0 } : (raw as { re: number; im: number });
      expect(close(v.re, c.value[0]), `mathjs re = ${v.re}`).toBe(true);
      expect(close(v.im, c.value[1]), `mathjs im = ${v.im}`).toBe(true);
    });
  }
});

describe('functions of other arities (compileFunction: evaluate and evaluateColumns)', () => {
  const cases: { formula: string; vars: string[]; rows: number[][]; values: number[]; source: string }[] = [
    { formula: '2 * pi', vars: [], rows: [[], []], values: [2 * Math.PI, 2 * Math.PI], source: 'IEEE' },
    { formula: 'x ^ 2 - 1', vars: ['x'], rows: [[3], [-0.5]], values: [8, -0.75], source: 'IEEE' },
    { formula: 'x * y + z', vars: ['x', 'y', 'z'], rows: [[2, 3, 4], [1, -1, 0.5]], values: [10, -0.5], source: 'IEEE' },
  ];
  for (const c of cases) {
    it(`${c.formula} of (${c.vars.join(', ')})`, () => {
      const { fn } = irFromText(c.formula, c.vars);
      const compiled = compileFunction(fn);
      expect(compiled.arity).toBe(c.vars.length);
      expect(c.rows.map((r) => compiled.evaluate(r).re)).toEqual(c.values);
      const columns = c.vars.map((_, k) => Float64Array.from(c.rows, (r) => r[k]));
      const out = new Float64Array(c.rows.length);
      compiled.evaluateColumns(columns, out, null);
      expect(Array.from(out)).toEqual(c.values);
      if (c.vars.length > 0) expect(() => compiled.evaluate(new Array(c.vars.length - 1).fill(0))).toThrow(RangeError);
    });
  }
});
