/** Values of closed expressions (constants, domain ends, claim values) and how they are written in messages. */
import type { Expr } from '../syntax/ast';
import type { Diagnostic } from '../diagnostics/types';
import { makeDiagnostic } from '../diagnostics/make';
import { interpret } from './evaluator';
import { IrTooLargeError, lowerFunction, maxIrNodes } from './lower';
import type { Scope } from './scope';
import type { ComplexValue } from './model';

export function formatNumber(x: number): string {
  if (Number.isNaN(x)) return 'NaN';
  if (!Number.isFinite(x)) return x > 0 ? '∞' : '-∞';
  return String(Number(x.toPrecision(12)));
}

/** A complex value as a reader writes it: `2`, `i`, `-0.5i`, `1 + i`, `3 - 2i`. */
export function formatComplex(v: ComplexValue): string {
  const imaginary = (x: number) => (x === 1 ? 'i' : `${formatNumber(x)}i`);
  if (v.im === 0) return formatNumber(v.re);
  if (v.re === 0) return v.im === -1 ? '-i' : imaginary(v.im);
  return `${formatNumber(v.re)} ${v.im < 0 ? '-' : '+'} ${imaginary(Math.abs(v.im))}`;
}

/** Evaluates a closed expression (no variables) that passed the name checks; null with a diagnostic on failure. */
export function evaluateClosed(expr: Expr, scope: Scope, diagnostics: Diagnostic[]): ComplexValue | null {
  try {
    const ir = lowerFunction(expr, [], scope);
    const r = interpret(ir, []);
    return { re: r.re, im: r.im };
  } catch (err) {
    if (err instanceof IrTooLargeError) {
      diagnostics.push(makeDiagnostic('expression-too-complex', err.range, {
        what: 'has too many parts after expanding helper functions', limit: maxIrNodes,
      }));
      return null;
    }
    throw err;
  }
}

