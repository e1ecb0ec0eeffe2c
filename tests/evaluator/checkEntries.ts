/**
 * Runs one IR function at one point through every entry of the evaluator (interpret, evaluate, evaluateColumns,
 * evaluateGrid) and reports whether they agree bit for bit (NaN equal to NaN; +0 and −0 told apart only where a
 * real part can carry a sign, which is everywhere, so they must match exactly).
 */
import { compileFunction, compileKernel, interpret, type EvalResult } from '../../src-core/semantics/evaluator';
import type { IrFunction } from '../../src-core/semantics/ir';

export interface EntryValues {
  interpreted: EvalResult;
  point: { re: number; im: number };
  columns: { re: number; im: number };
  grid: { re: number; im: number } | null;
}

export function sameDouble(a: number, b: number): boolean {
  return Object.is(a, b) || (a !== a && b !== b);
}

/** Evaluates `fn` at `args` through all entries (the grid only for two arguments: a 1×2 grid checks the layout). */
export function runEntries(fn: IrFunction, args: readonly number[]): EntryValues {
  const interpreted = interpret(fn, args);
  const kernel = fn.arity === 2 ? compileKernel(fn) : null;
  const compiled = kernel ?? compileFunction(fn);
  const point = compiled.evaluate(args);
  const cols = args.map((x) => Float64Array.of(x, x));
  const outRe = new Float64Array(2);
  const outIm = new Float64Array(2);
  compiled.evaluateColumns(cols, outRe, compiled.complex ? outIm : null);
  const columns = { re: outRe[1], im: compiled.complex ? outIm[1] : 0 };
  let grid: EntryValues['grid'] = null;
  if (kernel) {
    // A 2×2 grid whose entry (1, 0) is the point: checks the row-major layout too.
    const ts = Float64Array.of(NaN, args[0]);
    const ss = Float64Array.of(args[1], NaN);
    const gRe = new Float64Array(4);
    const gIm = new Float64Array(4);
    kernel.evaluateGrid(ts, ss, gRe, kernel.complex ? gIm : null);
    grid = { re: gRe[2], im: kernel.complex ? gIm[2] : 0 };
  }
  return { interpreted, point, columns, grid };
}

/** Empty when all entries agree exactly, else a description of the disagreement. */
export function entryDisagreement(v: EntryValues): string {
  const ref = v.interpreted;
  const others: [string, { re: number; im: number } | null][] = [['evaluate', v.point], ['evaluateColumns', v.columns], ['evaluateGrid', v.grid]];
  for (const [name, o] of others) {
    if (o === null) continue;
    if (!sameDouble(o.re, ref.re) || !sameDouble(o.im, ref.im)) {
      return `${name} gave ${o.re} + ${o.im}i, interpret gave ${ref.re} + ${ref.im}i`;
    }
  }
  return '';
}
