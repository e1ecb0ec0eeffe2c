/**
 * Walking expression trees: the children of a node, and a pre-order walk with an explicit stack (so that trees
 * of any depth are safe to walk).
 */
import type { Expr } from './ast';

/** The direct children of `expr`, in source order. */
export function exprChildren(expr: Expr): readonly Expr[] {
  switch (expr.kind) {
    case 'number':
    case 'ident':
    case 'error':
      return [];
    case 'unary':
      return [expr.operand];
    case 'binary':
      return [expr.left, expr.right];
    case 'call':
      return expr.args;
    case 'cond':
      return [expr.test, expr.then, expr.otherwise];
    case 'paren':
      return [expr.inner];
  }
}

/**
 * Visits `expr` and its descendants in pre-order (a node before its children, children in source order).
 * When `visit` returns false, the children of that node are skipped.
 */
export function walkExpr(expr: Expr, visit: (node: Expr) => boolean | void): void {
  const stack: Expr[] = [expr];
  while (stack.length > 0) {
    const node = stack.pop()!;
    if (visit(node) === false) continue;
    const children = exprChildren(node);
    for (let i = children.length - 1; i >= 0; i--) stack.push(children[i]);
  }
}
