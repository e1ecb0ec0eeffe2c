/**
 * What the evaluator needs to know about an IR tree before running it, found in one iterative pass (no recursion,
 * so trees thousands of levels deep are fine):
 *
 * - real-typed nodes: on the complex path a node is real-typed when it cannot carry an imaginary part: variables,
 *   real constants, functions with a real result (abs, re, im, min, max, floor, erf), comparisons and logic, and
 *   arithmetic of real-typed operands (a power only with a constant integer exponent). This mirrors mathjs, where
 *   a number stays a number until an operation (sqrt(-1), log(-1), (-8)^(1/3)) makes it Complex. Real-typed values
 *   use real arithmetic, so a real kernel written with complex numbers elsewhere keeps its real values exactly.
 *   On the real path every node is real-typed.
 * - constant nodes: nodes that do not depend on an argument slot; the code generator folds them.
 * - validity: every op, builtin name, argument count and slot is checked; anything else is an internal error,
 *   because the IR producer guarantees a valid tree and nothing unchecked may reach generated code.
 */
import { builtinFunctions, isBuiltinFunction, type BuiltinFunctionName } from '../builtins';
import type { IrFunction, IrNode } from '../ir';

export interface NodeShape {
  readonly realTyped: boolean;
  readonly constant: boolean;
}

export interface IrShape {
  readonly fn: IrFunction;
  /** True on the real path (IrFunction.complex false). */
  readonly realPath: boolean;
  readonly nodes: ReadonlyMap<IrNode, NodeShape>;
}

const binaryOps = new Set(['add', 'sub', 'mul', 'div', 'pow', 'lt', 'le', 'gt', 'ge', 'eq', 'ne', 'and', 'or']);
const realResultOps = new Set(['lt', 'le', 'gt', 'ge', 'eq', 'ne', 'and', 'or', 'not']);
/** Builtins whose result is real-typed exactly when their argument is. */
const typePreserving = new Set<BuiltinFunctionName>(['exp', 'sin', 'cos', 'tan', 'sinh', 'cosh', 'tanh', 'atan', 'sign', 'conj']);

export function internalError(message: string): Error {
  return new Error(`internal evaluator error: ${message}`);
}

/** Children in evaluation order. */
export function childrenOf(node: IrNode): readonly IrNode[] {
  switch (node.op) {
    case 'const':
    case 'var':
      return [];
    case 'neg':
    case 'not':
      return [node.a];
    case 'call':
      return node.args;
    case 'cond':
      return [node.test, node.then, node.otherwise];
    case 'let':
      return [node.value, node.body];
    default:
      if (binaryOps.has((node as IrNode).op)) {
        const n = node as { a: IrNode; b: IrNode };
        return [n.a, n.b];
      }
      throw internalError(`unknown IR op ${JSON.stringify((node as { op: unknown }).op)}`);
  }
}

/** A power that stays real for a real base: the exponent is a literal real integer. */
export function isIntegerExponent(b: IrNode): boolean {
  return b.op === 'const' && b.im === 0 && Number.isInteger(b.re);
}

/** A literal 2 exponent, computed as a*a (bit-identical to Math.pow(a, 2) in V8, and faster). */
export function isSquareExponent(b: IrNode): boolean {
  return b.op === 'const' && b.im === 0 && b.re === 2;
}

function checkCall(node: Extract<IrNode, { op: 'call' }>): void {
  if (!isBuiltinFunction(node.fn)) throw internalError(`unknown builtin ${JSON.stringify(node.fn)}`);
  const info = builtinFunctions[node.fn];
  if (node.args.length < info.minArgs || node.args.length > info.maxArgs) {
    throw internalError(`${node.fn} called with ${node.args.length} arguments`);
  }
}

export function analyzeIr(fn: IrFunction): IrShape {
  const realPath = !fn.complex;
  const { arity, slotCount } = fn;
  if (!Number.isInteger(arity) || !Number.isInteger(slotCount) || arity < 0 || slotCount < arity) {
    throw internalError(`bad arity ${arity} / slot count ${slotCount}`);
  }
  const nodes = new Map<IrNode, NodeShape>();
  const slotShape: (NodeShape | undefined)[] = new Array(slotCount).fill(undefined);
  const slotBound: boolean[] = new Array(slotCount).fill(false);
  for (let k = 0; k < arity; k++) slotShape[k] = { realTyped: true, constant: false };

  const shapeOf = (n: IrNode): NodeShape => {
    const s = nodes.get(n);
    if (!s) throw internalError('child visited out of order');
    return s;
  };
  const leave = (node: IrNode): NodeShape => {
    const kids = childrenOf(node);
    const allConstant = kids.every((k) => shapeOf(k).constant);
    const allReal = kids.every((k) => shapeOf(k).realTyped);
    switch (node.op) {
      case 'const':
        if (typeof node.re !== 'number' || typeof node.im !== 'number') throw internalError('non-numeric constant');
        if (realPath && node.im !== 0) throw internalError('complex constant in a real function');
        return { realTyped: node.im === 0, constant: true };
      case 'var': {
        const k = node.slot;
        if (!Number.isInteger(k) || k < 0 || k >= slotCount) throw internalError(`slot ${k} out of range`);
        if (k >= arity && !slotBound[k]) throw internalError(`slot ${k} used outside its let`);
        return slotShape[k]!;
      }
      case 'let':
        return { realTyped: shapeOf(node.body).realTyped, constant: allConstant };
      case 'cond':
        return { realTyped: shapeOf(node.then).realTyped && shapeOf(node.otherwise).realTyped, constant: allConstant };
      case 'call': {
        checkCall(node);
        const info = builtinFunctions[node.fn];
        const realTyped = realPath || info.realResult || (typePreserving.has(node.fn) && allReal);
        return { realTyped, constant: allConstant };
      }
      case 'pow':
        return { realTyped: realPath || (shapeOf(node.a).realTyped && isIntegerExponent(node.b)), constant: allConstant };
      default:
        if (realResultOps.has(node.op)) return { realTyped: true, constant: allConstant };
        return { realTyped: realPath || allReal, constant: allConstant };
    }
  };

  // Iterative post-order walk; a let's slot is described (and bound) between its value and its body.
  const stack: { node: IrNode; next: number; kids: readonly IrNode[] }[] = [];
  const push = (node: IrNode): void => {
    if (node === null || typeof node !== 'object') throw internalError('missing IR node');
    stack.push({ node, next: 0, kids: childrenOf(node) });
  };
  push(fn.root);
  while (stack.length > 0) {
    const top = stack[stack.length - 1];
    if (top.next < top.kids.length) {
      if (top.node.op === 'let' && top.next === 1) {
        const k = top.node.slot;
        if (!Number.isInteger(k) || k < arity || k >= slotCount) throw internalError(`let slot ${k} out of range`);
        if (slotBound[k]) throw internalError(`let slot ${k} bound twice`);
        slotShape[k] = shapeOf(top.node.value);
        slotBound[k] = true;
      }
      push(top.kids[top.next++]);
      continue;
    }
    stack.pop();
    const shape = leave(top.node);
    if (top.node.op === 'let') slotBound[top.node.slot] = false;
    nodes.set(top.node, shape);
  }
  return { fn, realPath, nodes };
}
