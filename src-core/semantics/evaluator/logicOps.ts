/**
 * Comparisons, truth values and logic, each as a function (for the interpreter) and as a code template (for the
 * compiled path) side by side, so the two cannot drift apart.
 *
 * Choices (differences from mathjs, on purpose):
 * - Comparisons are exact IEEE comparisons (mathjs compares within relTol = 1e-12); a piecewise kernel switches
 *   exactly where it was written.
 * - A NaN is never turned into a truth value: a comparison, and/or/not with a NaN operand, and a conditional with
 *   a NaN test all give NaN (mathjs: NaN < 1 is false, not(NaN) is true, NaN ? a : b is b). This keeps a fault
 *   inside a test visible in the kernel's values.
 * - Otherwise as mathjs: results are 1 and 0, any non-zero value is true (a complex value when either part is
 *   non-zero), ±∞ compare as usual.
 */

/**
 * NaN and ∞ in generated code: constant expressions the JIT folds. (The global names NaN and Infinity are property
 * reads of the global object, which kept V8 from keeping a value unboxed and made a piecewise loop 2.4× slower.)
 */
export const nanCode = '(0 / 0)';
export const infinityCode = '(1 / 0)';

export type CompareOp = 'lt' | 'le' | 'gt' | 'ge' | 'eq' | 'ne';

export function isCompareOp(op: string): op is CompareOp {
  return op === 'lt' || op === 'le' || op === 'gt' || op === 'ge' || op === 'eq' || op === 'ne';
}

/** 1, 0, or NaN when either side is NaN (both tests fail only then). */
export function compareReal(op: CompareOp, a: number, b: number): number {
  switch (op) {
    case 'lt':
      return a < b ? 1 : a >= b ? 0 : NaN;
    case 'le':
      return a <= b ? 1 : a > b ? 0 : NaN;
    case 'gt':
      return a > b ? 1 : a <= b ? 0 : NaN;
    case 'ge':
      return a >= b ? 1 : a < b ? 0 : NaN;
    case 'eq':
      return a === b ? 1 : a < b || a > b ? 0 : NaN;
    case 'ne':
      return a === b ? 0 : a < b || a > b ? 1 : NaN;
  }
}

/** Code for compareReal; a and b are identifiers or literals. */
export function compareRealCode(op: CompareOp, a: string, b: string): string {
  switch (op) {
    case 'lt':
      return `(${a} < ${b} ? 1 : ${a} >= ${b} ? 0 : ${nanCode})`;
    case 'le':
      return `(${a} <= ${b} ? 1 : ${a} > ${b} ? 0 : ${nanCode})`;
    case 'gt':
      return `(${a} > ${b} ? 1 : ${a} <= ${b} ? 0 : ${nanCode})`;
    case 'ge':
      return `(${a} >= ${b} ? 1 : ${a} < ${b} ? 0 : ${nanCode})`;
    case 'eq':
      return `(${a} === ${b} ? 1 : ${a} < ${b} || ${a} > ${b} ? 0 : ${nanCode})`;
    case 'ne':
      return `(${a} === ${b} ? 0 : ${a} < ${b} || ${a} > ${b} ? 1 : ${nanCode})`;
  }
}

/**
 * A comparison as two branch conditions for a conditional: `whenTrue` holds when compareReal gives 1, `whenFalse`
 * when it gives 0; neither holds exactly when it gives NaN.
 */
export function compareConditionCode(op: CompareOp, a: string, b: string): { whenTrue: string; whenFalse: string } {
  switch (op) {
    case 'lt':
      return { whenTrue: `${a} < ${b}`, whenFalse: `${a} >= ${b}` };
    case 'le':
      return { whenTrue: `${a} <= ${b}`, whenFalse: `${a} > ${b}` };
    case 'gt':
      return { whenTrue: `${a} > ${b}`, whenFalse: `${a} <= ${b}` };
    case 'ge':
      return { whenTrue: `${a} >= ${b}`, whenFalse: `${a} < ${b}` };
    case 'eq':
      return { whenTrue: `${a} === ${b}`, whenFalse: `${a} < ${b} || ${a} > ${b}` };
    case 'ne':
      return { whenTrue: `${a} < ${b} || ${a} > ${b}`, whenFalse: `${a} === ${b}` };
  }
}

/** Truth value of a real: 1, 0 or NaN. */
export function truthReal(x: number): number {
  return x !== x ? NaN : x !== 0 ? 1 : 0;
}

export function truthRealCode(x: string): string {
  return `(${x} !== ${x} ? ${nanCode} : ${x} !== 0 ? 1 : 0)`;
}

/** Truth value of a complex: NaN if either part is NaN, else 1 when either part is non-zero. */
export function truthComplex(x: number, y: number): number {
  return x !== x || y !== y ? NaN : x !== 0 || y !== 0 ? 1 : 0;
}

export function truthComplexCode(x: string, y: string): string {
  return `(${x} !== ${x} || ${y} !== ${y} ? ${nanCode} : ${x} !== 0 || ${y} !== 0 ? 1 : 0)`;
}

/** On truth values (1, 0, NaN): and = a·b, or = a + b − a·b, not = 1 − a; NaN propagates through all three. */
export function logicAnd(a: number, b: number): number {
  return a * b;
}
export function logicOr(a: number, b: number): number {
  return a + b - a * b;
}
export function logicNot(a: number): number {
  return 1 - a;
}
export function logicAndCode(a: string, b: string): string {
  return `${a} * ${b}`;
}
export function logicOrCode(a: string, b: string): string {
  return `${a} + ${b} - ${a} * ${b}`;
}
export function logicNotCode(a: string): string {
  return `1 - ${a}`;
}
