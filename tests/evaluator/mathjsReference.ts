/**
 * mathjs as the reference evaluator: one instance per path, the evaluator's documented choices loaded as mathjs
 * functions (irBuilder.ts, mathjsPrelude), results turned into {re, im}, and a comparison with relative and
 * absolute tolerance that also requires the same NaN/∞ status.
 */
import { all, create, type MathJsInstance } from 'mathjs';
import type { IrFunction } from '../../src-core/semantics/ir';
import { mathjsPrelude, toMathjs } from './irBuilder';

/**
 * Real path: predictable mode (sqrt(-1) is NaN, not i). Complex path: the default mode (sqrt(-1) = i). absTol 0
 * and the smallest relTol mathjs's floor accepts, so that `!= 0` in the prelude is an exact test.
 */
const realMath = create(all, { predictable: true, relTol: 1e-15, absTol: 0 });
const complexMath = create(all, { relTol: 1e-15, absTol: 0 });

function preludeScope(math: MathJsInstance): Map<string, unknown> {
  const scope = new Map<string, unknown>();
  for (const line of mathjsPrelude) math.evaluate(line, scope);
  return scope;
}
const realScope = preludeScope(realMath);
const complexScope = preludeScope(complexMath);

export interface Value {
  re: number;
  im: number;
}

export function toValue(raw: unknown): Value {
  if (typeof raw === 'number') return { re: raw, im: 0 };
  if (typeof raw === 'boolean') return { re: raw ? 1 : 0, im: 0 };
  if (raw && typeof raw === 'object' && 're' in raw && 'im' in raw) return { re: Number(raw.re), im: Number(raw.im) };
  throw new Error(`mathjs returned ${String(raw)}`);
}

/** mathjs's value of the IR function at (t, s). */
export function mathjsValue(fn: IrFunction, t: number, s: number): { value: Value; expression: string } {
  const expression = toMathjs(fn);
  const math = fn.complex ? complexMath : realMath;
  const scope = new Map(fn.complex ? complexScope : realScope);
  scope.set('t', t);
  scope.set('s', s);
  return { value: toValue(math.evaluate(expression, scope)), expression };
}

/** Evaluates a mathjs expression over named values on the chosen path: numbers when real-typed, else Complex. */
export function mathjsEvaluate(expression: string, values: Record<string, Value & { realTyped: boolean }>, complex: boolean): Value {
  const math = complex ? complexMath : realMath;
  const scope = new Map(complex ? complexScope : realScope);
  // A complex value's zero parts lose their sign (+ 0): the evaluator reads −0 as +0 on branch cuts
  // (complexMath.ts), where mathjs would take the other side.
  for (const [name, v] of Object.entries(values)) scope.set(name, v.realTyped ? v.re : math.complex(v.re + 0, v.im + 0));
  return toValue(math.evaluate(expression, scope));
}

export type Status = 'finite' | 'NaN' | '+∞' | '−∞' | 'non-finite';

/** Real values: finite, NaN, +∞ or −∞. Complex values: finite or not (mathjs and IEEE place complex ∞ differently). */
export function statusOf(v: Value, complex: boolean): Status {
  if (Number.isFinite(v.re) && Number.isFinite(v.im)) return 'finite';
  if (complex) return 'non-finite';
  if (Number.isNaN(v.re)) return 'NaN';
  return v.re > 0 ? '+∞' : '−∞';
}

/** Same status, and when finite |Δre|, |Δim| ≤ rel · max(|a|, |b|) + abs (moduli). */
export function closeValues(a: Value, b: Value, complex: boolean, rel: number, abs: number): boolean {
  const sa = statusOf(a, complex);
  if (sa !== statusOf(b, complex)) return false;
  if (sa !== 'finite') return true;
  const scale = Math.max(Math.hypot(a.re, a.im), Math.hypot(b.re, b.im));
  const tol = rel * scale + abs;
  return Math.abs(a.re - b.re) <= tol && Math.abs(a.im - b.im) <= tol;
}
