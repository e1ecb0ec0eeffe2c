/**
 * Lowers a checked expression to IR: constants become numbers, helper and kernel calls become `let` bindings of
 * their arguments around a fresh copy of the callee's body, parentheses disappear. Assumes the names were checked
 * (see resolveNames.ts) and the definitions are acyclic; anything else is an internal error.
 */
import type { BinaryOp, Expr } from '../syntax/ast';
import type { TextRange } from '../syntax/textRange';
import { builtinConstants, builtinFunctions, isBuiltinConstant, isBuiltinFunction } from './builtins';
import type { IrBinaryOp, IrFunction, IrNode } from './ir';
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

class Lowerer {
  nextSlot: number;
  count = 0;

  constructor(private readonly scope: Scope, arity: number, private readonly rootRange: TextRange) {
    this.nextSlot = arity;
  }

  private tick(): void {
    if (++this.count > maxIrNodes) throw new IrTooLargeError(this.rootRange);
  }

  lower(e: Expr, env: ReadonlyMap<string, number>): IrNode {
    this.tick();
    const range = e.range;
    switch (e.kind) {
      case 'number':
        return { op: 'const', re: e.value, im: 0, range };
      case 'paren':
        return this.lower(e.inner, env);
      case 'ident': {
        const slot = env.get(e.name);
        if (slot !== undefined) return { op: 'var', slot, range };
        const sym = this.scope.symbols.get(e.name);
        if (sym?.kind === 'const') {
          if (!sym.value) throw new Error(`internal: constant ${e.name} has no value`);
          return { op: 'const', re: sym.value.re, im: sym.value.im, range };
        }
        if (isBuiltinConstant(e.name)) {
          const c = builtinConstants[e.name];
          return { op: 'const', re: c.re, im: c.im, range };
        }
        throw new Error(`internal: unresolved name ${e.name}`);
      }
      case 'unary': {
        const a = this.lower(e.operand, env);
        if (e.op === '+') return a;
        return { op: e.op === '-' ? 'neg' : 'not', a, range };
      }
      case 'binary':
        return { op: binaryOps[e.op], a: this.lower(e.left, env), b: this.lower(e.right, env), range };
      case 'cond':
        return {
          op: 'cond', test: this.lower(e.test, env), then: this.lower(e.then, env),
          otherwise: this.lower(e.otherwise, env), range,
        };
      case 'call': {
        const args = e.args.map((a) => this.lower(a, env));
        if (isBuiltinFunction(e.callee)) return { op: 'call', fn: builtinFunctions[e.callee].name, args, range };
        const sym = this.scope.symbols.get(e.callee);
        if (!sym || sym.kind === 'const') throw new Error(`internal: unresolved function ${e.callee}`);
        const params = sym.kind === 'fn' ? sym.params : sym.decl.params.map((p) => p.text);
        const inner = new Map<string, number>();
        const slots = params.map((p) => {
          const slot = this.nextSlot++;
          inner.set(p, slot);
          return slot;
        });
        let body = this.lower(sym.decl.body, inner);
        for (let k = slots.length - 1; k >= 0; k--) {
          this.tick();
          body = { op: 'let', slot: slots[k], value: args[k], body, range };
        }
        return body;
      }
      case 'error':
        throw new Error('internal: error node reached lowering');
    }
  }
}

/** Lowers an expression whose free variables are `params` (slots 0..params.length-1). */
export function lowerFunction(expr: Expr, params: readonly string[], scope: Scope): IrFunction {
  const lowerer = new Lowerer(scope, params.length, expr.range);
  const env = new Map(params.map((p, k) => [p, k] as const));
  const root = lowerer.lower(expr, env);
  return { root, arity: params.length, slotCount: lowerer.nextSlot, complex: mayBeComplex(root, lowerer.nextSlot) };
}

/** True when some node of the tree may take a complex value (so the complex evaluation path is needed). */
export function mayBeComplex(root: IrNode, slotCount: number): boolean {
  const slotComplex = new Array<boolean>(slotCount).fill(false);
  let any = false;
  const visit = (n: IrNode): boolean => {
    let c: boolean;
    switch (n.op) {
      case 'const': c = n.im !== 0; break;
      case 'var': c = slotComplex[n.slot]; break;
      case 'neg': c = visit(n.a); break;
      case 'not': visit(n.a); c = false; break;
      case 'add': case 'sub': case 'mul': case 'div': case 'pow': {
        const ca = visit(n.a);
        const cb = visit(n.b);
        c = ca || cb;
        break;
      }
      case 'lt': case 'le': case 'gt': case 'ge': case 'eq': case 'ne': case 'and': case 'or':
        visit(n.a); visit(n.b); c = false; break;
      case 'call': {
        const cs = n.args.map(visit);
        c = !builtinFunctions[n.fn].realResult && cs.some(Boolean);
        break;
      }
      case 'cond': {
        visit(n.test);
        const ct = visit(n.then);
        const co = visit(n.otherwise);
        c = ct || co;
        break;
      }
      case 'let':
        slotComplex[n.slot] = visit(n.value);
        c = visit(n.body);
        break;
    }
    if (c) any = true;
    return c;
  };
  visit(root);
  return any;
}
