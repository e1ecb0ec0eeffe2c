/**
 * Code generation for one point: turns an IR tree into straight-line JavaScript statements in SSA form (one
 * `const` per operator node), walked iteratively so a tree thousands of levels deep needs no recursion, neither
 * here nor in the JavaScript parser. The formulas are those of interpret.ts, node for node.
 *
 * Safety: the only text that reaches the output is (a) fixed operator and keyword text written here, (b) numeric
 * literals made by numberLiteral from doubles, (c) names made here from counters (r12, i12, e12) or given by the
 * caller, and (d) names from the fixed helper table in codegen.ts, chosen by a switch over known builtin names.
 * Nothing from the user's source text (names, strings) is ever copied.
 *
 * Optimizations: subtrees without arguments are folded (evaluated once by the interpreter, emitted as literals); a
 * conditional with a constant test keeps only its branch, and one whose test is a real comparison branches on the
 * comparison itself; a `let` binds its slot to its value's SSA name; an untaken branch is not evaluated (if/else
 * blocks, up to 48 deep); real-typed values (irShape.ts) have no imaginary variable; NaN and ∞ are written as
 * 0/0 and 1/0 (see logicOps.ts).
 */
import type { IrNode } from '../ir';
import { evaluateTree, type SlotValues } from './interpret';
import { childrenOf, internalError, isSquareExponent, type IrShape } from './irShape';
import {
  compareConditionCode, compareRealCode, infinityCode, isCompareOp, logicAndCode, logicNotCode, logicOrCode, nanCode,
  truthComplex, truthComplexCode, truthReal, truthRealCode, type CompareOp,
} from './logicOps';

/** A value in generated code: its real part and its imaginary part (null when real-typed). */
export interface Operand {
  readonly re: string;
  readonly im: string | null;
  /** Known value, when the operand is a compile-time constant. */
  readonly value?: { re: number; im: number };
  /** A comparison left unevaluated for the conditional it tests (its `re` must not be used). */
  readonly compare?: { op: CompareOp; a: string; b: string };
}

export interface EmittedBody {
  readonly lines: string[];
  readonly result: Operand;
}

/** Serializes a double as JavaScript source; the only way numbers enter generated code. */
export function numberLiteral(x: number): string {
  if (typeof x !== 'number') throw internalError('literal is not a number');
  if (x !== x) return nanCode;
  if (x === Infinity) return infinityCode;
  if (x === -Infinity) return `(-${infinityCode})`;
  if (Object.is(x, -0)) return '(-0)';
  const text = String(Math.abs(x));
  if (!/^\d+(\.\d+)?(e[+-]\d+)?$/.test(text) || Number(text) !== Math.abs(x)) throw internalError(`bad literal ${text}`);
  return x < 0 ? `(-${text})` : text;
}

const realMathNames = new Set(['exp', 'log', 'sqrt', 'abs', 'sin', 'cos', 'tan', 'sinh', 'cosh', 'tanh', 'atan', 'sign', 'floor', 'erf']);
const complexHelperNames: Readonly<Record<string, string>> = {
  log: 'clog', sqrt: 'csqrt', sin: 'csin', cos: 'ccos', tan: 'ctan', sinh: 'csinh', cosh: 'ccosh', tanh: 'ctanh',
  atan: 'catan', sign: 'csign',
};
/** Ops whose value is already a truth value (1, 0 or NaN). */
const truthOps = new Set(['lt', 'le', 'gt', 'ge', 'eq', 'ne', 'and', 'or', 'not']);

interface Frame {
  node: IrNode;
  kids: readonly IrNode[];
  step: number;
  operands: Operand[];
  /** For a conditional: the variables receiving its value, or the branch picked at compile time. */
  target?: Operand;
  picked?: IrNode;
  /** Both branches evaluated, then picked (nesting too deep for blocks). */
  eager?: boolean;
}

/** Nesting of if/else blocks in generated code (see emitCondStep), and of indentation. */
const maxBlockDepth = 48;
const maxIndent = 8;

export function emitBody(shape: IrShape, argNames: readonly string[]): EmittedBody {
  const lines: string[] = [];
  let depth = 0;
  let counter = 0;
  const emit = (line: string): void => {
    lines.push('  '.repeat(Math.min(depth, maxIndent)) + line);
  };
  const slotOperands: (Operand | undefined)[] = new Array(shape.fn.slotCount).fill(undefined);
  for (let k = 0; k < shape.fn.arity; k++) slotOperands[k] = { re: argNames[k], im: null };
  const constSlots: SlotValues = {
    re: new Array<number>(shape.fn.slotCount).fill(NaN),
    im: new Array<number>(shape.fn.slotCount).fill(0),
    origin: new Array(shape.fn.slotCount).fill(null),
  };
  const isReal = (n: IrNode): boolean => shape.nodes.get(n)!.realTyped;
  /** Comparisons whose only use is as a conditional's test (see emitCondStep). */
  const fusedTests = new Set<IrNode>();
  const literal = (n: IrNode, re: number, im: number): Operand =>
    isReal(n) ? { re: numberLiteral(re), im: null, value: { re, im: 0 } } : { re: numberLiteral(re), im: numberLiteral(im), value: { re, im } };
  const define = (re: string, im: string | null): Operand => {
    const id = counter++;
    if (im === null) {
      emit(`const r${id} = ${re};`);
      return { re: `r${id}`, im: null };
    }
    emit(`const r${id} = ${re}, i${id} = ${im};`);
    return { re: `r${id}`, im: `i${id}` };
  };
  const callHelper = (name: string, args: string[]): Operand => {
    emit(`${name}(${args.join(', ')});`);
    return define('o[0]', 'o[1]');
  };
  const truthCode = (n: IrNode, v: Operand): string =>
    truthOps.has(n.op) ? v.re : v.im === null ? truthRealCode(v.re) : truthComplexCode(v.re, v.im);
  const assignTo = (target: Operand, v: Operand): void => {
    emit(target.im === null ? `${target.re} = ${v.re};` : `${target.re} = ${v.re}; ${target.im} = ${v.im ?? '0'};`);
  };

  const stack: Frame[] = [];
  let last: Operand = { re: nanCode, im: null };
  const push = (node: IrNode): void => {
    const info = shape.nodes.get(node);
    if (!info) throw internalError('node missing from shape');
    if (info.constant && node.op !== 'var') {
      const v = node.op === 'const' ? { re: node.re, im: node.im } : evaluateTree(shape, node, constSlots);
      last = literal(node, v.re, isReal(node) ? 0 : v.im);
      return;
    }
    if (node.op === 'var') {
      const o = slotOperands[node.slot];
      if (!o) throw internalError(`slot ${node.slot} has no value`);
      last = o;
      return;
    }
    stack.push({ node, kids: childrenOf(node), step: 0, operands: [] });
  };

  push(shape.fn.root);
  while (stack.length > 0) {
    const f = stack[stack.length - 1];
    const node = f.node;
    if (f.step > 0) f.operands.push(last);
    f.step++;
    if (node.op === 'let') {
      if (f.step === 1) {
        push(node.value);
        continue;
      }
      if (f.step === 2) {
        const v = f.operands[0];
        slotOperands[node.slot] = v;
        if (v.value) {
          constSlots.re[node.slot] = v.value.re;
          constSlots.im[node.slot] = v.value.im;
        }
        push(node.body);
        continue;
      }
      stack.pop();
      last = f.operands[1];
      continue;
    }
    if (node.op === 'cond') {
      if (emitCondStep(f)) continue;
      stack.pop();
      continue;
    }
    if (f.step <= f.kids.length) {
      push(f.kids[f.step - 1]);
      continue;
    }
    stack.pop();
    last = emitOperator(node, f.operands);
  }
  return { lines, result: last };

  /**
   * Advances a conditional; returns false when it is finished (its value is in `last`). Up to maxBlockDepth nested
   * conditionals become if/else blocks (only the taken branch runs); deeper ones evaluate both branches and pick
   * with a ternary, because JavaScript parsers recurse on nested blocks. The value is the same either way: branches
   * have no side effects, and NaN or ∞ in the untaken branch is simply not picked. A test that is a comparison of
   * real values is fused into the branch conditions (`if (t < s) … else if (t >= s) … else NaN`).
   */
  function emitCondStep(f: Frame): boolean {
    const node = f.node as Extract<IrNode, { op: 'cond' }>;
    const resultReal = isReal(node);
    const asResult = (v: Operand): Operand => (resultReal || v.im !== null ? v : { re: v.re, im: '0' });
    const nan: Operand = resultReal ? { re: nanCode, im: null } : { re: nanCode, im: nanCode };
    if (f.step === 1) {
      if (isCompareOp(node.test.op) && childrenOf(node.test).every(isReal)) fusedTests.add(node.test);
      push(node.test);
      return true;
    }
    const t = f.operands[0];
    if (f.step === 2 && t.value) {
      const truth = t.im === null ? truthReal(t.value.re) : truthComplex(t.value.re, t.value.im);
      if (truth !== truth) {
        last = nan;
        return false;
      }
      f.picked = truth !== 0 ? node.then : node.otherwise;
      push(f.picked);
      return true;
    }
    if (f.picked !== undefined) {
      last = asResult(f.operands[1]);
      return false;
    }
    // Branch conditions: `first` holds → first branch; else `second` holds → second branch; else NaN.
    let first: string;
    let second: string;
    let firstBranch: IrNode;
    let secondBranch: IrNode;
    if (t.compare) {
      const c = compareConditionCode(t.compare.op, t.compare.a, t.compare.b);
      [first, second, firstBranch, secondBranch] = [c.whenTrue, c.whenFalse, node.then, node.otherwise];
    } else {
      first = t.im === null ? `${t.re} === 0` : `${t.re} === 0 && ${t.im} === 0`;
      second = t.im === null ? `${t.re} === ${t.re}` : `${t.re} === ${t.re} && ${t.im} === ${t.im}`;
      [firstBranch, secondBranch] = [node.otherwise, node.then];
    }
    if (f.step === 2) {
      f.eager = depth >= maxBlockDepth;
      if (!f.eager) {
        const id = counter++;
        f.target = resultReal ? { re: `r${id}`, im: null } : { re: `r${id}`, im: `i${id}` };
        emit(resultReal ? `let r${id};` : `let r${id}, i${id};`);
        emit(`if (${first}) {`);
        depth++;
      }
      push(firstBranch);
      return true;
    }
    if (f.step === 3) {
      if (!f.eager) {
        assignTo(f.target!, asResult(f.operands[1]));
        depth--;
        emit(`} else if (${second}) {`);
        depth++;
      }
      push(secondBranch);
      return true;
    }
    const firstValue = asResult(f.operands[1]);
    const secondValue = asResult(f.operands[2]);
    if (f.eager) {
      const pick = (part: (v: Operand) => string): string => `${first} ? ${part(firstValue)} : ${second} ? ${part(secondValue)} : ${nanCode}`;
      last = define(pick((v) => v.re), resultReal ? null : pick((v) => v.im!));
      return false;
    }
    const target = f.target!;
    assignTo(target, secondValue);
    depth--;
    emit('} else {');
    depth++;
    assignTo(target, nan);
    depth--;
    emit('}');
    last = target;
    return false;
  }

  function emitOperator(node: IrNode, v: Operand[]): Operand {
    const [a, b] = v;
    const ai = a.im ?? '0';
    switch (node.op) {
      case 'neg':
        return define(`-${a.re}`, a.im === null ? null : `-${a.im}`);
      case 'not':
        return define(logicNotCode(truthCode(node.a, a)), null);
      case 'and':
        return define(logicAndCode(truthCode(node.a, a), truthCode(node.b, b)), null);
      case 'or':
        return define(logicOrCode(truthCode(node.a, a), truthCode(node.b, b)), null);
      case 'add':
        return define(`${a.re} + ${b.re}`, a.im === null ? b.im : b.im === null ? a.im : `${a.im} + ${b.im}`);
      case 'sub':
        return define(`${a.re} - ${b.re}`, a.im === null ? (b.im === null ? null : `-${b.im}`) : b.im === null ? a.im : `${a.im} - ${b.im}`);
      case 'mul':
        if (a.im === null && b.im === null) return define(`${a.re} * ${b.re}`, null);
        if (b.im === null) return define(`${a.re} * ${b.re}`, `${a.im} * ${b.re}`);
        if (a.im === null) return define(`${a.re} * ${b.re}`, `${a.re} * ${b.im}`);
        return define(`${a.re} * ${b.re} - ${a.im} * ${b.im}`, `${a.re} * ${b.im} + ${a.im} * ${b.re}`);
      case 'div':
        if (a.im === null && b.im === null) return define(`${a.re} / ${b.re}`, null);
        if (b.im === null) return define(`${a.re} / ${b.re}`, `${a.im} / ${b.re}`);
        return callHelper('cdiv', [a.re, ai, b.re, b.im!]);
      case 'pow':
        if (isReal(node)) return define(isSquareExponent(node.b) ? `${a.re} * ${a.re}` : `pow(${a.re}, ${b.re})`, null);
        return callHelper('cpow', [a.re, ai, b.re, b.im ?? '0']);
      case 'call':
        return emitCall(node, v);
      default:
        if (isCompareOp(node.op)) {
          if (fusedTests.delete(node)) return { re: nanCode, im: null, compare: { op: node.op, a: a.re, b: b.re } };
          const cmp = compareRealCode(node.op, a.re, b.re);
          return define(complexGuard(v, cmp), null);
        }
        throw internalError(`cannot emit ${node.op}`);
    }
  }

  /** `value`, or NaN when some complex-typed operand has a non-zero imaginary part. */
  function complexGuard(v: Operand[], value: string): string {
    const tests = v.filter((o) => o.im !== null).map((o) => `${o.im} !== 0`);
    return tests.length === 0 ? value : `(${tests.join(' || ')} ? ${nanCode} : ${value})`;
  }

  function emitCall(node: Extract<IrNode, { op: 'call' }>, v: Operand[]): Operand {
    const name = node.fn;
    const a = v[0];
    switch (name) {
      case 'min':
      case 'max':
        return define(complexGuard(v, `${name}(${v.map((o) => o.re).join(', ')})`), null);
      case 'floor':
      case 'erf':
        return define(complexGuard(v, `${name}(${a.re})`), null);
      case 're':
        return { re: a.re, im: null };
      case 'im':
        return a.im === null ? { re: '0', im: null, value: { re: 0, im: 0 } } : { re: a.im, im: null };
      case 'conj':
        return a.im === null ? a : define(a.re, `-${a.im}`);
      case 'abs':
        return define(a.im === null ? `abs(${a.re})` : `hypot(${a.re}, ${a.im})`, null);
      default:
        break;
    }
    if (!realMathNames.has(name)) throw internalError(`no code for ${name}`);
    if (shape.realPath || (a.im === null && name !== 'log' && name !== 'sqrt')) return define(`${name}(${a.re})`, null);
    const im = a.im ?? '0';
    if (name === 'exp') {
      const id = counter++;
      emit(`const e${id} = exp(${a.re});`);
      return define(`e${id} * cos(${im})`, `e${id} * sin(${im})`);
    }
    const helper = complexHelperNames[name];
    if (helper === undefined) throw internalError(`no complex code for ${name}`);
    return callHelper(helper, [a.re, im]);
  }
}
