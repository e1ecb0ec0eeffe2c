/**
 * The data the evaluator hands out: compiled functions (fast, no checks per point), evaluation faults (what went
 * wrong, where in the source, with which argument) and the results of the slow explaining interpreter.
 */
import type { TextRange } from '../../syntax/textRange';

export interface Complex {
  re: number;
  im: number;
}

export interface CompiledFunction {
  readonly arity: number;
  /** Equal to IrFunction.complex. */
  readonly complex: boolean;
  /** One point; im = 0 on the real path. */
  evaluate(args: readonly number[]): Complex;
  /**
   * out[k] = f(columns[0][k], columns[1][k], ...) for k < outRe.length. outIm is required (non-null) when complex
   * and ignored otherwise.
   */
  evaluateColumns(columns: readonly Float64Array[], outRe: Float64Array, outIm: Float64Array | null): void;
}

export interface CompiledKernel extends CompiledFunction {
  /** Tensor grid: out[i * ss.length + j] = K(ts[i], ss[j]). */
  evaluateGrid(ts: Float64Array, ss: Float64Array, outRe: Float64Array, outIm: Float64Array | null): void;
}

/**
 * - real-domain: a real kernel applied sqrt or log to a negative number, or raised a negative number to a
 *   non-integer power;
 * - complex-where-real: a comparison or a real-only function (min, max, floor, erf) received a value with a
 *   non-zero imaginary part;
 * - non-finite: finite inputs gave NaN or ±∞ (log(0), 1/0, 0/0, overflow), or an input itself was not finite.
 */
export type EvalFaultKind = 'real-domain' | 'complex-where-real' | 'non-finite';

export interface EvalFault {
  kind: EvalFaultKind;
  /** Source range of the node where the fault arose. */
  range: TextRange;
  /** The operation: a builtin name ('sqrt'), an operator ('^', '/', '<', 'and') or absent for a leaf. */
  fn?: string;
  /** The offending argument (see interpret.ts for which one), or NaN for a leaf. */
  argRe: number;
  argIm: number;
  /** The value the node produced. */
  valueRe: number;
  valueIm: number;
}

export type EvalResult =
  | { ok: true; re: number; im: number }
  | { ok: false; re: number; im: number; fault: EvalFault };

export interface KernelFault {
  t: number;
  s: number;
  fault: EvalFault;
}
