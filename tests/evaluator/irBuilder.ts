/**
 * Test-only ways to make IR without the real front end:
 * - irFromText: a mathjs `parse` tree of a formula, printed back in one canonical form whose offsets become the
 *   nodes' ranges (so a test can say "the fault is on `sqrt(t - 2)`" and check `text.slice(range)`);
 *   `let(x, value, body)` binds a name; `i`, `pi`, `e` are the builtin constants;
 * - toMathjs: an IR function as a mathjs expression for cross-checks, with the evaluator's documented choices
 *   spelled in mathjs's own primitives (see `mathjsPrelude`);
 * - small constructors for trees built by hand (deep chains, hostile inputs).
 */
import { parse, type MathNode } from 'mathjs';
import type { IrFunction, IrNode } from '../../src-core/semantics/ir';
import type { BuiltinFunctionName } from '../../src-core/semantics/builtins';
import type { TextRange } from '../../src-core/syntax/textRange';

const operatorOps: Record<string, string> = {
  add: 'add', subtract: 'sub', multiply: 'mul', divide: 'div', pow: 'pow', smaller: 'lt', smallerEq: 'le',
  larger: 'gt', largerEq: 'ge', equal: 'eq', unequal: 'ne', and: 'and', or: 'or',
};
const opText: Record<string, string> = {
  add: '+', sub: '-', mul: '*', div: '/', pow: '^', lt: '<', le: '<=', gt: '>', ge: '>=', eq: '==', ne: '!=',
  and: 'and', or: 'or',
};
const constants: Record<string, [number, number]> = { i: [0, 1], pi: [Math.PI, 0], e: [Math.E, 0] };

/** An IR node without its range (distributed over the union, so each variant keeps its own fields). */
type BareNode = IrNode extends infer N ? (N extends IrNode ? Omit<N, 'range'> : never) : never;

export interface TextIr {
  readonly fn: IrFunction;
  /** The canonical text the ranges point into. */
  readonly text: string;
}

/** Parses `formula` with mathjs and lowers it to IR; `vars` are the argument names (slot order). */
export function irFromText(formula: string, vars: readonly string[] = ['t', 's'], complex?: boolean): TextIr {
  let text = '';
  let slotCount = vars.length;
  let sawComplex = false;
  const lower = (node: MathNode, env: ReadonlyMap<string, number>): IrNode => {
    const start = text.length;
    const done = (ir: BareNode): IrNode => ({ ...ir, range: { start, end: text.length } }) as IrNode;
    const child = (n: MathNode, wrap: boolean): IrNode => {
      while (n.type === 'ParenthesisNode') n = (n as MathNode & { content: MathNode }).content;
      const needParens = wrap && (n.type === 'OperatorNode' || n.type === 'ConditionalNode');
      if (needParens) text += '(';
      const ir = lower(n, env);
      if (needParens) text += ')';
      return ir;
    };
    const n = node as MathNode & Record<string, unknown>;
    switch (node.type) {
      case 'ParenthesisNode':
        return lower(n.content as MathNode, env);
      case 'ConstantNode':
        text += String(n.value);
        return done({ op: 'const', re: Number(n.value), im: 0 });
      case 'SymbolNode': {
        const name = n.name as string;
        text += name;
        const slot = env.get(name);
        if (slot !== undefined) return done({ op: 'var', slot });
        const c = constants[name];
        if (!c) throw new Error(`unknown name ${name}`);
        if (c[1] !== 0) sawComplex = true;
        return done({ op: 'const', re: c[0], im: c[1] });
      }
      case 'OperatorNode': {
        const args = n.args as MathNode[];
        const fn = n.fn as string;
        if (fn === 'unaryMinus' || fn === 'not') {
          text += fn === 'not' ? 'not ' : '-';
          const a = child(args[0], true);
          return done({ op: fn === 'not' ? 'not' : 'neg', a });
        }
        if (fn === 'unaryPlus') return child(args[0], true);
        const op = operatorOps[fn];
        if (!op) throw new Error(`unsupported operator ${fn}`);
        const a = child(args[0], true);
        text += ` ${opText[op]} `;
        const b = child(args[1], true);
        return done({ op, a, b } as BareNode);
      }
      case 'ConditionalNode': {
        const test = child(n.condition as MathNode, true);
        text += ' ? ';
        const then = child(n.trueExpr as MathNode, true);
        text += ' : ';
        const otherwise = child(n.falseExpr as MathNode, true);
        return done({ op: 'cond', test, then, otherwise });
      }
      case 'FunctionNode': {
        const name = (n.fn as { name: string }).name;
        const args = n.args as MathNode[];
        text += `${name}(`;
        if (name === 'let') {
          const bound = (args[0] as MathNode & { name: string }).name;
          const slot = slotCount++;
          text += `${bound}, `;
          const value = lower(args[1], env);
          text += ', ';
          const body = lower(args[2], new Map([...env, [bound, slot]]));
          text += ')';
          return done({ op: 'let', slot, value, body });
        }
        const irArgs: IrNode[] = [];
        args.forEach((a, k) => {
          if (k > 0) text += ', ';
          irArgs.push(lower(a, env));
        });
        text += ')';
        return done({ op: 'call', fn: name as BuiltinFunctionName, args: irArgs });
      }
      default:
        throw new Error(`unsupported mathjs node ${node.type}`);
    }
  };
  const root = lower(parse(formula), new Map(vars.map((v, k) => [v, k])));
  return { fn: { root, arity: vars.length, slotCount, complex: complex ?? sawComplex }, text };
}

/** The first node (pre-order) that satisfies `pred`. */
export function findNode(root: IrNode, pred: (n: IrNode) => boolean): IrNode {
  const stack = [root];
  while (stack.length > 0) {
    const n = stack.pop()!;
    if (pred(n)) return n;
    const kids: IrNode[] =
      n.op === 'const' || n.op === 'var' ? [] :
      n.op === 'neg' || n.op === 'not' ? [n.a] :
      n.op === 'call' ? [...n.args] :
      n.op === 'cond' ? [n.test, n.then, n.otherwise] :
      n.op === 'let' ? [n.value, n.body] : [n.a, (n as { b: IrNode }).b];
    stack.push(...kids.reverse());
  }
  throw new Error('node not found');
}

export function sliceOf(text: string, range: TextRange): string {
  return text.slice(range.start, range.end);
}

/**
 * mathjs definitions of the evaluator's documented choices, made only of mathjs primitives:
 * - kCmp: exact three-way comparison (mathjs compares within relTol);
 * - comparisons, logic, conditionals: NaN operands or tests give NaN (mathjs would turn NaN into false);
 * - comparisons, min, max, floor, erf: NaN for a non-zero imaginary part (mathjs throws or rounds each part);
 * - kFloor: floor without mathjs's rounding to the nearest integer within relTol (mathjs: floor(2.9999999999999987)
 *   is 3), corrected with the exact comparison;
 * - kIsInt: an exact integer test (mathjs's isInteger(2.999999999999999) is true within relTol);
 * - kPow (real path): a finite negative base with a non-integer exponent is NaN (mathjs's predictable mode takes
 *   real odd roots, (-8)^(1/3) = -2, and rounds near-integer exponents); with an infinite base or exponent it
 *   follows IEEE 754 pow, |a|^b (common practice: (−2)^∞ = ∞, (−∞)^½ = ∞);
 * - kPowC (complex path): mathjs's complex power (complex.js 2.4) treats a purely imaginary base as if the exponent
 *   were an integer ((-3i)^(1e-300) = ∞); there the reference uses the definition exp(b log a).
 */
export const mathjsPrelude = [
  'kCmp(a, b) = isNaN(a - b) ? 0 : sign(a - b)',
  'kBad(a) = isNaN(a) or im(a) != 0',
  'kLt(a, b) = (kBad(a) or kBad(b)) ? NaN : (kCmp(re(a), re(b)) < 0 ? 1 : 0)',
  'kLe(a, b) = (kBad(a) or kBad(b)) ? NaN : (kCmp(re(a), re(b)) <= 0 ? 1 : 0)',
  'kGt(a, b) = (kBad(a) or kBad(b)) ? NaN : (kCmp(re(a), re(b)) > 0 ? 1 : 0)',
  'kGe(a, b) = (kBad(a) or kBad(b)) ? NaN : (kCmp(re(a), re(b)) >= 0 ? 1 : 0)',
  'kEq(a, b) = (kBad(a) or kBad(b)) ? NaN : (kCmp(re(a), re(b)) == 0 ? 1 : 0)',
  'kNe(a, b) = (kBad(a) or kBad(b)) ? NaN : (kCmp(re(a), re(b)) != 0 ? 1 : 0)',
  'kAnd(a, b) = (isNaN(a) or isNaN(b)) ? NaN : ((a != 0 and b != 0) ? 1 : 0)',
  'kOr(a, b) = (isNaN(a) or isNaN(b)) ? NaN : ((a != 0 or b != 0) ? 1 : 0)',
  'kNot(a) = isNaN(a) ? NaN : (a == 0 ? 1 : 0)',
  'kCond(c, a, b) = isNaN(c) ? NaN : (c != 0 ? a : b)',
  'kMin(a, b) = (kBad(a) or kBad(b)) ? NaN : min(re(a), re(b))',
  'kMax(a, b) = (kBad(a) or kBad(b)) ? NaN : max(re(a), re(b))',
  'kFloorExact(x) = kCmp(floor(x), x) > 0 ? floor(x) - 1 : floor(x)',
  'kFloor(a) = kBad(a) ? NaN : kFloorExact(re(a))',
  'kErf(a) = kBad(a) ? NaN : erf(re(a))',
  'kIsInt(b) = isFinite(b) and kCmp(floor(b), b) == 0',
  'kPowNegative(a, b) = kIsInt(b) ? a ^ b : ((isFinite(a) and isFinite(b)) ? NaN : abs(a) ^ b)',
  'kPow(a, b) = a < 0 ? kPowNegative(a, b) : a ^ b',
  'kPowC(a, b) = (re(a) == 0 and im(a) != 0 and not (im(b) == 0 and kIsInt(re(b)))) ? exp(b * log(a)) : a ^ b',
];

const mathjsCalls: Record<string, string> = {
  lt: 'kLt', le: 'kLe', gt: 'kGt', ge: 'kGe', eq: 'kEq', ne: 'kNe', and: 'kAnd', or: 'kOr',
};

function mathjsNumber(x: number): string {
  if (Number.isNaN(x)) return 'NaN';
  if (x === Infinity) return 'Infinity';
  if (x === -Infinity) return '(-Infinity)';
  return x < 0 || Object.is(x, -0) ? `(-${String(-x)})` : String(x);
}

/** The IR as one mathjs expression over the argument names (let values are substituted). */
export function toMathjs(fn: IrFunction, vars: readonly string[] = ['t', 's']): string {
  const env = new Map<number, string>(vars.map((v, k) => [k, v]));
  const go = (n: IrNode): string => {
    switch (n.op) {
      case 'const':
        return n.im === 0 ? mathjsNumber(n.re) : `complex(${mathjsNumber(n.re)}, ${mathjsNumber(n.im)})`;
      case 'var': {
        const v = env.get(n.slot);
        if (v === undefined) throw new Error(`unbound slot ${n.slot}`);
        return v;
      }
      case 'let':
        env.set(n.slot, `(${go(n.value)})`);
        return go(n.body);
      case 'neg':
        return `(-${go(n.a)})`;
      case 'not':
        return `kNot(${go(n.a)})`;
      case 'cond':
        return `kCond(${go(n.test)}, ${go(n.then)}, ${go(n.otherwise)})`;
      case 'call': {
        const args = n.args.map(go);
        if (n.fn === 'min' || n.fn === 'max') {
          const f = n.fn === 'min' ? 'kMin' : 'kMax';
          return args.slice(1).reduce((acc, a) => `${f}(${acc}, ${a})`, args[0]);
        }
        if (n.fn === 'floor') return `kFloor(${args[0]})`;
        if (n.fn === 'erf') return `kErf(${args[0]})`;
        return `${n.fn}(${args.join(', ')})`;
      }
      case 'pow':
        return fn.complex ? `kPowC(${go(n.a)}, ${go(n.b)})` : `kPow(${go(n.a)}, ${go(n.b)})`;
      default: {
        const call = mathjsCalls[n.op];
        if (call) return `${call}(${go(n.a)}, ${go(n.b)})`;
        return `(${go(n.a)} ${opText[n.op]} ${go(n.b)})`;
      }
    }
  };
  return go(fn.root);
}

/** Hand-built trees: each node gets the next synthetic range. */
export class IrMaker {
  private offset = 0;

  private range(): TextRange {
    const start = this.offset++;
    return { start, end: start + 1 };
  }

  c(re: number, im = 0): IrNode {
    return { op: 'const', re, im, range: this.range() };
  }

  v(slot: number): IrNode {
    return { op: 'var', slot, range: this.range() };
  }

  un(op: 'neg' | 'not', a: IrNode): IrNode {
    return { op, a, range: this.range() };
  }

  bin(op: Extract<IrNode, { b: IrNode }>['op'], a: IrNode, b: IrNode): IrNode {
    return { op, a, b, range: this.range() };
  }

  call(fn: BuiltinFunctionName, ...args: IrNode[]): IrNode {
    return { op: 'call', fn, args, range: this.range() };
  }

  cond(test: IrNode, then: IrNode, otherwise: IrNode): IrNode {
    return { op: 'cond', test, then, otherwise, range: this.range() };
  }

  let(slot: number, value: IrNode, body: IrNode): IrNode {
    return { op: 'let', slot, value, body, range: this.range() };
  }
}
