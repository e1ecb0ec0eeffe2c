/**
 * The slow, explaining evaluator: walks the IR tree (iteratively, so any depth is fine) with exactly the arithmetic
 * of the compiled path (codegen.ts emits the same formulas; tests check the two agree bit for bit), and tracks
 * where each NaN or infinity came from.
 *
 * Fault rules. A node is where a fault arises when its evaluated inputs are all finite and
 * - real path: sqrt or log got x < 0, or a^b got a < 0 with b not an integer → 'real-domain' (value NaN);
 * - complex path: a comparison or min, max, floor, erf got an argument with a non-zero imaginary part →
 *   'complex-where-real' (value NaN);
 * - otherwise its value is NaN or ±∞ → 'non-finite' (log(0), 1/0, 0/0, overflow). A constant or argument that is
 *   itself not finite is reported at its own node.
 * Every non-finite value carries the fault it came from (the first non-finite input's, for a node with non-finite
 * inputs; the body's, for a let; the test's or the chosen branch's, for a conditional). The result is ok exactly
 * when the final value is finite; otherwise it names the fault behind it. A NaN that is later absorbed (im(x) of a
 * real x, x^0, exp(-∞) = 0, an untaken branch, which is never evaluated) leaves the result ok.
 * The reported argument is the divisor for '/', the first argument with a non-zero imaginary part for
 * complex-where-real, and the first argument otherwise.
 */
import type { IrFunction, IrNode } from '../ir';
import { complexOut as out, cdiv, cexp, clog, csqrt, csin, ccos, ctan, csinh, ccosh, ctanh, catan, cpow, csign } from './complexMath';
import { erf } from './erf';
import type { EvalFault, EvalFaultKind, EvalResult } from './evalTypes';
import { analyzeIr, childrenOf, internalError, isSquareExponent, type IrShape } from './irShape';
import { compareReal, isCompareOp, logicAnd, logicNot, logicOr, truthComplex, truthReal } from './logicOps';

export const operatorSymbols: Readonly<Record<string, string>> = {
  neg: '-', not: 'not', add: '+', sub: '-', mul: '*', div: '/', pow: '^',
  lt: '<', le: '<=', gt: '>', ge: '>=', eq: '==', ne: '!=', and: 'and', or: 'or',
};

export interface TreeValue {
  re: number;
  im: number;
  origin: EvalFault | null;
}

/** Slot values shared by a walk: arguments first, then let slots as they are bound. */
export interface SlotValues {
  re: number[];
  im: number[];
  origin: (EvalFault | null)[];
}

const realFunctions = {
  exp: Math.exp, log: Math.log, sqrt: Math.sqrt, abs: Math.abs, sin: Math.sin, cos: Math.cos, tan: Math.tan,
  sinh: Math.sinh, cosh: Math.cosh, tanh: Math.tanh, atan: Math.atan, sign: Math.sign, floor: Math.floor, erf,
} as const;
const complexFunctions = {
  log: clog, sqrt: csqrt, sin: csin, cos: ccos, tan: ctan, sinh: csinh, cosh: ccosh, tanh: ctanh, atan: catan,
  sign: csign, exp: cexp,
} as const;

const isFiniteValue = (re: number, im: number): boolean => Number.isFinite(re) && Number.isFinite(im);

interface Applied {
  re: number;
  im: number;
  fault: EvalFaultKind | null;
  arg: number;
}

/** Value of an operator or call node from its children's values (all children are evaluated). */
function applyNode(shape: IrShape, node: IrNode, re: number[], im: number[], real: boolean[], allFinite: boolean): Applied {
  const r: Applied = { re: NaN, im: 0, fault: null, arg: 0 };
  const realPath = shape.realPath;
  const set = (x: number, y: number): void => {
    r.re = x;
    r.im = y;
  };
  const firstComplexArg = (): number => re.findIndex((_, k) => !real[k] && im[k] !== 0);
  switch (node.op) {
    case 'neg':
      set(-re[0], real[0] ? 0 : -im[0]);
      break;
    case 'not':
      set(logicNot(real[0] ? truthReal(re[0]) : truthComplex(re[0], im[0])), 0);
      break;
    case 'and':
    case 'or': {
      const ta = real[0] ? truthReal(re[0]) : truthComplex(re[0], im[0]);
      const tb = real[1] ? truthReal(re[1]) : truthComplex(re[1], im[1]);
      set(node.op === 'and' ? logicAnd(ta, tb) : logicOr(ta, tb), 0);
      break;
    }
    case 'add':
      set(re[0] + re[1], real[0] && real[1] ? 0 : real[0] ? im[1] : real[1] ? im[0] : im[0] + im[1]);
      break;
    case 'sub':
      set(re[0] - re[1], real[0] && real[1] ? 0 : real[0] ? -im[1] : real[1] ? im[0] : im[0] - im[1]);
      break;
    case 'mul':
      if (real[0] && real[1]) set(re[0] * re[1], 0);
      else if (real[1]) set(re[0] * re[1], im[0] * re[1]);
      else if (real[0]) set(re[0] * re[1], re[0] * im[1]);
      else set(re[0] * re[1] - im[0] * im[1], re[0] * im[1] + im[0] * re[1]);
      break;
    case 'div':
      r.arg = 1;
      if (real[0] && real[1]) set(re[0] / re[1], 0);
      else if (real[1]) set(re[0] / re[1], im[0] / re[1]);
      else {
        cdiv(re[0], real[0] ? 0 : im[0], re[1], im[1]);
        set(out[0], out[1]);
      }
      break;
    case 'pow':
      if (shape.nodes.get(node)!.realTyped) {
        set(isSquareExponent(node.b) ? re[0] * re[0] : Math.pow(re[0], re[1]), 0);
        if (realPath && allFinite && re[0] < 0 && !Number.isInteger(re[1])) r.fault = 'real-domain';
      } else {
        cpow(re[0], real[0] ? 0 : im[0], re[1], real[1] ? 0 : im[1]);
        set(out[0], out[1]);
      }
      break;
    case 'call': {
      const name = node.fn;
      if (name === 'min' || name === 'max' || name === 'floor' || name === 'erf') {
        const k = firstComplexArg();
        if (k >= 0) {
          set(NaN, 0);
          if (allFinite) {
            r.fault = 'complex-where-real';
            r.arg = k;
          }
        } else if (name === 'min') set(Math.min(...re), 0);
        else if (name === 'max') set(Math.max(...re), 0);
        else set(realFunctions[name](re[0]), 0);
      } else if (name === 're') set(re[0], 0);
      else if (name === 'im') set(real[0] ? 0 : im[0], 0);
      else if (name === 'conj') set(re[0], real[0] ? 0 : -im[0]);
      else if (name === 'abs') set(real[0] ? Math.abs(re[0]) : Math.hypot(re[0], im[0]), 0);
      else if (realPath || (real[0] && name !== 'log' && name !== 'sqrt')) {
        set(realFunctions[name](re[0]), 0);
        if (realPath && allFinite && (name === 'log' || name === 'sqrt') && re[0] < 0) r.fault = 'real-domain';
      } else {
        complexFunctions[name](re[0], real[0] ? 0 : im[0]);
        set(out[0], out[1]);
      }
      break;
    }
    default:
      if (isCompareOp(node.op)) {
        const k = firstComplexArg();
        if (k >= 0) {
          set(NaN, 0);
          if (allFinite) {
            r.fault = 'complex-where-real';
            r.arg = k;
          }
        } else set(compareReal(node.op, re[0], re[1]), 0);
        break;
      }
      throw internalError(`cannot apply ${node.op}`);
  }
  return r;
}

function makeFault(kind: EvalFaultKind, node: IrNode, argRe: number, argIm: number, re: number, im: number): EvalFault {
  const fn = node.op === 'call' ? node.fn : operatorSymbols[node.op];
  const fault: EvalFault = { kind, range: node.range, argRe, argIm, valueRe: re, valueIm: im };
  if (fn !== undefined) fault.fn = fn;
  return fault;
}

interface Frame {
  node: IrNode;
  kids: readonly IrNode[];
  step: number;
  re: number[];
  im: number[];
  origin: (EvalFault | null)[];
  /** The branch a conditional took (null before its test is known, or when the test was NaN). */
  branch: IrNode | null;
}

/** Evaluates the subtree at `root`; `slots` holds the argument values and receives let values. */
export function evaluateTree(shape: IrShape, root: IrNode, slots: SlotValues): TreeValue {
  const realOf = (n: IrNode): boolean => shape.nodes.get(n)!.realTyped;
  const stack: Frame[] = [];
  const push = (node: IrNode): void => {
    stack.push({ node, kids: childrenOf(node), step: 0, re: [], im: [], origin: [], branch: null });
  };
  let last: TreeValue = { re: NaN, im: NaN, origin: null };
  push(root);
  while (stack.length > 0) {
    const f = stack[stack.length - 1];
    const node = f.node;
    if (f.step > 0) {
      f.re.push(last.re);
      f.im.push(last.im);
      f.origin.push(last.origin);
    }
    // Choose the next child to evaluate, if any.
    let next: IrNode | null = null;
    if (node.op === 'cond') {
      if (f.step === 0) next = node.test;
      else if (f.step === 1) {
        const t = realOf(node.test) ? truthReal(f.re[0]) : truthComplex(f.re[0], f.im[0]);
        if (t === t) next = f.branch = t !== 0 ? node.then : node.otherwise;
      }
    } else if (node.op === 'let') {
      if (f.step === 1) {
        slots.re[node.slot] = f.re[0];
        slots.im[node.slot] = f.im[0];
        slots.origin[node.slot] = f.origin[0];
      }
      if (f.step < 2) next = f.kids[f.step];
    } else if (f.step < f.kids.length) next = f.kids[f.step];
    if (next !== null) {
      f.step++;
      push(next);
      continue;
    }
    stack.pop();
    last = finish(shape, f, slots, realOf);
  }
  return last;
}

function finish(shape: IrShape, f: Frame, slots: SlotValues, realOf: (n: IrNode) => boolean): TreeValue {
  const node = f.node;
  switch (node.op) {
    case 'const': {
      const ok = isFiniteValue(node.re, node.im);
      return { re: node.re, im: node.im, origin: ok ? null : makeFault('non-finite', node, NaN, NaN, node.re, node.im) };
    }
    case 'var': {
      const k = node.slot;
      if (k >= shape.fn.arity) return { re: slots.re[k], im: slots.im[k], origin: slots.origin[k] };
      const x = slots.re[k];
      return { re: x, im: 0, origin: Number.isFinite(x) ? null : makeFault('non-finite', node, NaN, NaN, x, 0) };
    }
    case 'let':
      return { re: f.re[1], im: f.im[1], origin: f.origin[1] };
    case 'cond': {
      const complexResult = !shape.nodes.get(node)!.realTyped;
      if (f.branch === null) return { re: NaN, im: complexResult ? NaN : 0, origin: f.origin[0] };
      const branchReal = realOf(f.branch);
      return { re: f.re[1], im: complexResult && !branchReal ? f.im[1] : 0, origin: f.origin[1] };
    }
    default: {
      const real = f.kids.map(realOf);
      let allFinite = true;
      let firstBad = -1;
      for (let k = 0; k < f.re.length; k++) {
        if (!isFiniteValue(f.re[k], f.im[k])) {
          allFinite = false;
          if (firstBad < 0) firstBad = k;
        }
      }
      const a = applyNode(shape, node, f.re, f.im, real, allFinite);
      let origin: EvalFault | null = null;
      if (a.fault !== null) {
        origin = makeFault(a.fault, node, f.re[a.arg], f.im[a.arg], a.re, a.im);
      } else if (!isFiniteValue(a.re, a.im)) {
        origin = allFinite
          ? makeFault('non-finite', node, f.re[a.arg] ?? NaN, f.im[a.arg] ?? NaN, a.re, a.im)
          : f.origin[firstBad];
      }
      return { re: a.re, im: a.im, origin };
    }
  }
}

export function interpretWithShape(shape: IrShape, args: readonly number[]): EvalResult {
  const fn = shape.fn;
  if (args.length < fn.arity) throw new RangeError(`expected ${fn.arity} arguments, got ${args.length}`);
  const slots: SlotValues = {
    re: new Array<number>(fn.slotCount).fill(NaN),
    im: new Array<number>(fn.slotCount).fill(0),
    origin: new Array<EvalFault | null>(fn.slotCount).fill(null),
  };
  for (let k = 0; k < fn.arity; k++) slots.re[k] = args[k];
  const v = evaluateTree(shape, fn.root, slots);
  const re = v.re;
  const im = shape.realPath ? 0 : v.im;
  if (isFiniteValue(re, im)) return { ok: true, re, im };
  const fault = v.origin ?? makeFault('non-finite', fn.root, NaN, NaN, re, im);
  return { ok: false, re, im, fault };
}

/** Slow tree-walking evaluation that names the first node where a finite input gave a NaN/∞ or a fault. */
export function interpret(fn: IrFunction, args: readonly number[]): EvalResult {
  return interpretWithShape(analyzeIr(fn), args);
}
