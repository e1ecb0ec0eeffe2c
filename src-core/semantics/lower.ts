/**
 * Lowers a checked expression to IR: constants become numbers, helper and kernel calls become `let` bindings of
 * their arguments around a fresh copy of the callee's body, parentheses disappear. Assumes the names were checked
 * (see resolveNames.ts) and the definitions are acyclic; anything else is an internal error.
 *
 * Both walks here use explicit stacks: expanding a long chain of helpers makes a tree far deeper than the source
 * (each helper adds its own levels), and the size limit, not the call stack, must be what stops it.
 */
import type { BinaryOp, Expr } from '../syntax/ast';
import type { TextRange } from '../syntax/textRange';
import { builtinConstants, builtinFunctions, isBuiltinConstant, isBuiltinFunction } from './builtins';
import type { IrBinaryOp, IrFunction, IrNode } from './ir';
import { irChildren } from './irTools';
import type { Scope } from './scope';

const binaryOps: Record<BinaryOp, IrBinaryOp> = {
  '+': 'add', '-': 'sub', '*': 'mul', '/': 'div', '^': 'pow',
  '<': 'lt', '<=': 'le', '>': 'gt', '>=': 'ge', '==': 'eq', '!=': 'ne',
  and: 'and', or: 'or',
};

/** Largest IR size accepted after helpers are expanded. */
export const maxIrNodes = 20_000;

export class IrTooLargeError extends Error {
  constructor(readonly range: TextRange) {
    super(`expression has more than ${maxIrNodes} parts after expanding helper functions`);
  }
}

type Env = ReadonlyMap<string, number>;

/**
 * Work items of the lowering machine: lower an expression (its node lands on the value stack), enter a callee's
 * body once its arguments are lowered (fresh slots for its parameters), or build a node from the last `count`
 * values.
 */
type Task =
  | { readonly kind: 'lower'; readonly e: Expr; readonly env: Env }
  | { readonly kind: 'enter'; readonly params: readonly string[]; readonly body: Expr; readonly slots: number[] }
  | { readonly kind: 'build'; readonly count: number; readonly make: (parts: IrNode[]) => IrNode };

class Lowerer {
  nextSlot: number;
  count = 0;

  constructor(private readonly scope: Scope, arity: number, private readonly rootRange: TextRange) {
    this.nextSlot = arity;
  }

  private tick(): void {
    if (++this.count > maxIrNodes) throw new IrTooLargeError(this.rootRange);
  }

  lower(root: Expr, rootEnv: Env): IrNode {
    const tasks: Task[] = [{ kind: 'lower', e: root, env: rootEnv }];
    const values: IrNode[] = [];
    const build = (count: number, make: (parts: IrNode[]) => IrNode, children: Task[]) => {
      tasks.push({ kind: 'build', count, make });
      for (let k = children.length - 1; k >= 0; k--) tasks.push(children[k]);
    };
    while (tasks.length > 0) {
      const task = tasks.pop()!;
      if (task.kind === 'build') {
        values.push(task.make(values.splice(values.length - task.count, task.count)));
        continue;
      }
      if (task.kind === 'enter') {
        const inner = new Map<string, number>();
        for (const p of task.params) {
          const slot = this.nextSlot++;
          inner.set(p, slot);
          task.slots.push(slot);
        }
        tasks.push({ kind: 'lower', e: task.body, env: inner });
        continue;
      }
      this.tick();
      const { e, env } = task;
      const range = e.range;
      const sub = (x: Expr): Task => ({ kind: 'lower', e: x, env });
      switch (e.kind) {
        case 'number':
          values.push({ op: 'const', re: e.value, im: 0, range });
          break;
        case 'paren':
          tasks.push(sub(e.inner));
          break;
        case 'ident':
          values.push(this.leaf(e.name, env, range));
          break;
        case 'unary':
          if (e.op === '+') tasks.push(sub(e.operand));
          else {
            const op = e.op === '-' ? 'neg' : 'not';
            build(1, ([a]) => ({ op, a, range }), [sub(e.operand)]);
          }
          break;
        case 'binary': {
          const op = binaryOps[e.op];
          build(2, ([a, b]) => ({ op, a, b, range }), [sub(e.left), sub(e.right)]);
          break;
        }
        case 'cond':
          build(3, ([test, then, otherwise]) => ({ op: 'cond', test, then, otherwise, range }),
            [sub(e.test), sub(e.then), sub(e.otherwise)]);
          break;
        case 'call': {
          const args = e.args.map(sub);
          if (isBuiltinFunction(e.callee)) {
            const fn = builtinFunctions[e.callee].name;
            build(args.length, (parts) => ({ op: 'call', fn, args: parts, range }), args);
            break;
          }
          const sym = this.scope.symbols.get(e.callee);
          if (!sym || sym.kind === 'const') throw new Error(`internal: unresolved function ${e.callee}`);
          const params = sym.kind === 'fn' ? sym.params : sym.decl.params.map((p) => p.text);
          // The arguments are lowered first, in the caller's environment; then the callee's body gets fresh slots.
          const enter = { kind: 'enter' as const, params, body: sym.decl.body, slots: [] as number[] };
          build(args.length + 1, (parts) => {
            let body = parts[parts.length - 1];
            for (let k = enter.slots.length - 1; k >= 0; k--) {
              this.tick();
              body = { op: 'let', slot: enter.slots[k], value: parts[k], body, range };
            }
            return body;
          }, [...args, enter]);
          break;
        }
        case 'error':
          throw new Error('internal: error node reached lowering');
      }
    }
    if (values.length !== 1) throw new Error('internal: lowering left a broken value stack');
    return values[0];
  }

  private leaf(name: string, env: Env, range: TextRange): IrNode {
    const slot = env.get(name);
    if (slot !== undefined) return { op: 'var', slot, range };
    const sym = this.scope.symbols.get(name);
    if (sym?.kind === 'const') {
      if (!sym.value) throw new Error(`internal: constant ${name} has no value`);
      return { op: 'const', re: sym.value.re, im: sym.value.im, range };
    }
    if (isBuiltinConstant(name)) {
      const c = builtinConstants[name];
      return { op: 'const', re: c.re, im: c.im, range };
    }
    throw new Error(`internal: unresolved name ${name}`);
  }
}

/**
 * How many parts lowering `expr` takes (the count `maxIrNodes` limits: one per syntax node, one per argument bound to
 * a parameter, and the expanded body of every helper or kernel called), without building anything. `calleeSize`
 * gives the count a call adds besides its own node and arguments: the callee's expanded body plus one binding per
 * parameter. Stops counting once past the limit.
 */
export function expandedSize(expr: Expr, calleeSize: (name: string) => number): number {
  let n = 0;
  const stack: Expr[] = [expr];
  while (stack.length > 0 && n <= maxIrNodes) {
    const e = stack.pop()!;
    n++;
    switch (e.kind) {
      case 'paren': stack.push(e.inner); break;
      case 'unary': stack.push(e.operand); break;
      case 'binary': stack.push(e.left, e.right); break;
      case 'cond': stack.push(e.test, e.then, e.otherwise); break;
      case 'call':
        for (const a of e.args) stack.push(a);
        if (!isBuiltinFunction(e.callee)) n += calleeSize(e.callee);
        break;
      default: break;
    }
  }
  return n;
}

/** Lowers an expression whose free variables are `params` (slots 0..params.length-1). */
export function lowerFunction(expr: Expr, params: readonly string[], scope: Scope): IrFunction {
  const lowerer = new Lowerer(scope, params.length, expr.range);
  const env = new Map(params.map((p, k) => [p, k] as const));
  const root = lowerer.lower(expr, env);
  return { root, arity: params.length, slotCount: lowerer.nextSlot, complex: mayBeComplex(root, lowerer.nextSlot) };
}

/** Whether one node may be complex, given whether each of its children may be (in evaluation order). */
function nodeComplex(n: IrNode, kids: readonly boolean[], slotComplex: readonly boolean[]): boolean {
  switch (n.op) {
    case 'const': return n.im !== 0;
    case 'var': return slotComplex[n.slot] ?? false;
    case 'neg': case 'add': case 'sub': case 'mul': case 'div': case 'pow': return kids.some(Boolean);
    case 'not': case 'lt': case 'le': case 'gt': case 'ge': case 'eq': case 'ne': case 'and': case 'or': return false;
    case 'call': return !builtinFunctions[n.fn].realResult && kids.some(Boolean);
    case 'cond': return kids[1] || kids[2];
    case 'let': return kids[1];
  }
}

/** True when some node of the tree may take a complex value (so the complex evaluation path is needed). */
export function mayBeComplex(root: IrNode, slotCount: number): boolean {
  const slotComplex = new Array<boolean>(slotCount).fill(false);
  let any = false;
  // Post-order with an explicit stack; a let's slot is marked as soon as its value is done, before its body runs.
  const stack: { n: IrNode; kids: IrNode[]; done: boolean[] }[] = [{ n: root, kids: irChildren(root), done: [] }];
  let last = false;
  while (stack.length > 0) {
    const top = stack[stack.length - 1];
    if (top.done.length < top.kids.length) {
      const next = top.kids[top.done.length];
      stack.push({ n: next, kids: irChildren(next), done: [] });
      continue;
    }
    stack.pop();
    last = nodeComplex(top.n, top.done, slotComplex);
    if (last) any = true;
    const parent = stack[stack.length - 1];
    if (parent) {
      parent.done.push(last);
      if (parent.n.op === 'let' && parent.done.length === 1) slotComplex[parent.n.slot] = last;
    }
  }
  return any;
}
