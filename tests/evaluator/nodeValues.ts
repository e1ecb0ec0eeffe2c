/**
 * The value of every node of an IR function at one point, each computed by compiling that node's subtree on its
 * own (wrapped in the `let`s whose bodies enclose it), and each operator node restated as a one-operation IR
 * function of its children, so mathjs can apply the same operation to exactly the same inputs.
 */
import { compileKernel } from '../../src-core/semantics/evaluator';
import { analyzeIr } from '../../src-core/semantics/evaluator/irShape';
import type { IrFunction, IrNode } from '../../src-core/semantics/ir';

export interface NodeValue {
  node: IrNode;
  re: number;
  im: number;
  /** Real-typed nodes are numbers for mathjs, the others Complex values. */
  realTyped: boolean;
  children: IrNode[];
}

function childrenOf(n: IrNode): IrNode[] {
  switch (n.op) {
    case 'const':
    case 'var':
      return [];
    case 'neg':
    case 'not':
      return [n.a];
    case 'call':
      return [...n.args];
    case 'cond':
      return [n.test, n.then, n.otherwise];
    case 'let':
      return [n.value, n.body];
    default:
      return [n.a, n.b];
  }
}

/** Every node's subtree as a function of (t, s) of its own, inside the lets whose bodies enclose it; pre-order. */
export function subtreeFunctions(fn: IrFunction): Map<IrNode, IrFunction> {
  const result = new Map<IrNode, IrFunction>();
  const visit = (n: IrNode, lets: Extract<IrNode, { op: 'let' }>[]): void => {
    let root: IrNode = n;
    for (let k = lets.length - 1; k >= 0; k--) root = { ...lets[k], body: root };
    result.set(n, { ...fn, root });
    if (n.op === 'let') {
      visit(n.value, lets);
      visit(n.body, [...lets, n]);
    } else {
      for (const c of childrenOf(n)) visit(c, lets);
    }
  };
  visit(fn.root, []);
  return result;
}

/** Values of all nodes of `fn` at (t, s), each from the compiled subtree. */
export function nodeValues(fn: IrFunction, t: number, s: number): Map<IrNode, NodeValue> {
  const shape = analyzeIr(fn);
  const result = new Map<IrNode, NodeValue>();
  for (const [n, sub] of subtreeFunctions(fn)) {
    const value = compileKernel(sub).evaluate([t, s]);
    result.set(n, { node: n, re: value.re, im: value.im, realTyped: shape.nodes.get(n)!.realTyped, children: childrenOf(n) });
  }
  return result;
}

/** The node as a function of its children: child k becomes argument a{k}. Null for leaves and lets. */
export function oneOperation(n: IrNode, complex: boolean): { fn: IrFunction; vars: string[] } | null {
  const kids = childrenOf(n);
  if (kids.length === 0 || n.op === 'let') return null;
  const arg = (k: number): IrNode => ({ op: 'var', slot: k, range: kids[k].range });
  let root: IrNode;
  switch (n.op) {
    case 'neg':
    case 'not':
      root = { ...n, a: arg(0) };
      break;
    case 'call':
      root = { ...n, args: kids.map((_, k) => arg(k)) };
      break;
    case 'cond':
      root = { ...n, test: arg(0), then: arg(1), otherwise: arg(2) };
      break;
    default:
      root = { ...n, a: arg(0), b: arg(1) } as IrNode;
  }
  const vars = kids.map((_, k) => `a${k}`);
  return { fn: { root, arity: kids.length, slotCount: kids.length, complex }, vars };
}
