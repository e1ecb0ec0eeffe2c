/** Test helpers: compact views of syntax trees (an s-expression, and every node's range with its text). */
import type { Expr, SourceFile, TextRange } from '../../src-core/syntax';
import { exprChildren, walkExpr } from '../../src-core/syntax/walk';

/** `(+ 1 (* 2 3))`; calls as `(call f a b)`, conditionals as `(? c a b)`, parentheses as `(paren x)`. */
export function sexpr(expr: Expr): string {
  switch (expr.kind) {
    case 'number':
      return expr.raw;
    case 'ident':
      return expr.name;
    case 'error':
      return 'error';
    case 'paren':
      return `(paren ${sexpr(expr.inner)})`;
    case 'unary':
      return `(${expr.op} ${sexpr(expr.operand)})`;
    case 'binary':
      return `(${expr.op} ${sexpr(expr.left)} ${sexpr(expr.right)})`;
    case 'call':
      return `(call ${[expr.callee, ...expr.args.map(sexpr)].join(' ')})`;
    case 'cond':
      return `(? ${sexpr(expr.test)} ${sexpr(expr.then)} ${sexpr(expr.otherwise)})`;
  }
}

/** The source text under each node of `expr`, in pre-order. */
export function nodeTexts(text: string, expr: Expr): string[] {
  const out: string[] = [];
  walkExpr(expr, (node) => {
    out.push(text.slice(node.range.start, node.range.end));
  });
  return out;
}

/** Every expression in a file (roots and descendants). */
export function allExprs(file: SourceFile): Expr[] {
  const out: Expr[] = [];
  for (const root of exprRoots(file)) walkExpr(root, (node) => void out.push(node));
  return out;
}

/** The top-level expressions of each declaration: interval ends, values, bodies, expectation values. */
export function exprRoots(file: SourceFile): Expr[] {
  const roots: Expr[] = [];
  for (const d of file.declarations) {
    if (d.kind === 'domain') roots.push(d.interval.lower, d.interval.upper);
    if (d.kind === 'const') roots.push(d.value);
    if (d.kind === 'fn') roots.push(d.body);
    if (d.kind === 'kernel') {
      if (d.domain) roots.push(d.domain.lower, d.domain.upper);
      roots.push(d.body);
      for (const clause of d.expects) for (const item of clause.items) if (item.value) roots.push(item.value);
    }
  }
  return roots;
}

/** Each (parent, child) pair of ranges in the file, declarations included, for containment checks. */
export function rangePairs(file: SourceFile): { parent: TextRange; child: TextRange; what: string }[] {
  const pairs: { parent: TextRange; child: TextRange; what: string }[] = [];
  const add = (parent: TextRange, child: TextRange, what: string) => pairs.push({ parent, child, what });
  const addExpr = (parent: TextRange, root: Expr, what: string) => {
    add(parent, root.range, what);
    walkExpr(root, (node) => {
      for (const child of exprChildren(node)) add(node.range, child.range, `${what} > ${node.kind}`);
      if (node.kind === 'binary' || node.kind === 'unary') add(node.range, node.opRange, `${what} > ${node.kind} op`);
      if (node.kind === 'call') add(node.range, node.calleeRange, `${what} > callee`);
    });
  };
  const whole = { start: 0, end: file.text.length };
  for (const d of file.declarations) {
    add(whole, d.range, d.kind);
    add(d.range, d.keywordRange, `${d.kind} keyword`);
    if (d.kind === 'domain') {
      add(d.range, d.interval.range, 'domain interval');
      addExpr(d.interval.range, d.interval.lower, 'domain lower');
      addExpr(d.interval.range, d.interval.upper, 'domain upper');
    }
    if (d.kind === 'const') {
      add(d.range, d.name.range, 'const name');
      addExpr(d.range, d.value, 'const value');
    }
    if (d.kind === 'fn' || d.kind === 'kernel') {
      add(d.range, d.name.range, `${d.kind} name`);
      for (const p of d.params) add(d.range, p.range, `${d.kind} param`);
      addExpr(d.range, d.body, `${d.kind} body`);
    }
    if (d.kind === 'kernel') {
      if (d.domain) {
        add(d.range, d.domain.range, 'kernel domain');
        addExpr(d.domain.range, d.domain.lower, 'kernel domain lower');
        addExpr(d.domain.range, d.domain.upper, 'kernel domain upper');
      }
      for (const clause of d.expects) {
        add(d.range, clause.range, 'expect clause');
        add(clause.range, clause.keywordRange, 'expect keyword');
        for (const item of clause.items) {
          add(clause.range, item.range, 'expectation');
          add(item.range, item.nameRange, 'expectation name');
          if (item.opRange) add(item.range, item.opRange, 'expectation op');
          if (item.value) addExpr(item.range, item.value, 'expectation value');
        }
      }
    }
  }
  return pairs;
}
