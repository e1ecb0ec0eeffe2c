/**
 * The canonical text of an expression: numbers as written, single spaces around binary operators and around
 * `?` and `:`, `, ` between arguments, and the fewest parentheses the precedence rules of expressionParser.ts
 * need (a child gets parentheses exactly when its precedence is below what its position admits; the written
 * parentheses of `ParenExpr` nodes are dropped and re-derived). Printing then parsing gives back the same tree
 * up to parentheses, so printing is a fixed point: printExpr(parse(printExpr(x))) === printExpr(x).
 *
 * The printer works with an explicit stack, so trees of any depth print without recursion.
 * An `ErrorExpr` prints as `…`.
 */
import type { BinaryOp, Expr } from './ast';

/** Precedence levels, lowest first. */
const Level = {
  Top: 0,
  Conditional: 1,
  Or: 2,
  And: 3,
  Not: 4,
  Comparison: 5,
  Additive: 6,
  Multiplicative: 7,
  Unary: 8,
  Power: 9,
  Primary: 10,
} as const;
type Level = (typeof Level)[keyof typeof Level];

/** For each binary operator: its own level and the least levels its left and right operands may have. */
const binaryLevels: Readonly<Record<BinaryOp, readonly [Level, Level, Level]>> = {
  or: [Level.Or, Level.Or, Level.And],
  and: [Level.And, Level.And, Level.Not],
  '<': [Level.Comparison, Level.Additive, Level.Additive],
  '<=': [Level.Comparison, Level.Additive, Level.Additive],
  '>': [Level.Comparison, Level.Additive, Level.Additive],
  '>=': [Level.Comparison, Level.Additive, Level.Additive],
  '==': [Level.Comparison, Level.Additive, Level.Additive],
  '!=': [Level.Comparison, Level.Additive, Level.Additive],
  '+': [Level.Additive, Level.Additive, Level.Multiplicative],
  '-': [Level.Additive, Level.Additive, Level.Multiplicative],
  '*': [Level.Multiplicative, Level.Multiplicative, Level.Unary],
  '/': [Level.Multiplicative, Level.Multiplicative, Level.Unary],
  // The base of a power is a primary (so (-t)^2 and (a^b)^c keep their parentheses); the exponent may be signed.
  '^': [Level.Power, Level.Primary, Level.Unary],
};

function unwrap(expr: Expr): Expr {
  let e = expr;
  while (e.kind === 'paren') e = e.inner;
  return e;
}

function levelOf(expr: Expr): Level {
  switch (expr.kind) {
    case 'number':
      return expr.raw.startsWith('-') ? Level.Unary : Level.Primary;
    case 'ident':
    case 'call':
    case 'error':
    case 'paren':
      return Level.Primary;
    case 'unary':
      return expr.op === 'not' ? Level.Not : Level.Unary;
    case 'binary':
      return binaryLevels[expr.op][0];
    case 'cond':
      return Level.Conditional;
  }
}

type Piece = string | { readonly expr: Expr; readonly least: Level };

/** The pieces of `expr` in reading order, without outer parentheses. */
function piecesOf(expr: Expr): Piece[] {
  switch (expr.kind) {
    case 'number':
      return [expr.raw];
    case 'ident':
      return [expr.name];
    case 'error':
      return ['…'];
    case 'paren':
      return [{ expr: expr.inner, least: Level.Top }];
    case 'unary':
      return expr.op === 'not'
        ? ['not ', { expr: expr.operand, least: Level.Not }]
        : [expr.op, { expr: expr.operand, least: Level.Unary }];
    case 'binary': {
      const [, left, right] = binaryLevels[expr.op];
      return [{ expr: expr.left, least: left }, ` ${expr.op} `, { expr: expr.right, least: right }];
    }
    case 'call': {
      const pieces: Piece[] = [expr.callee, '('];
      expr.args.forEach((arg, i) => {
        if (i > 0) pieces.push(', ');
        pieces.push({ expr: arg, least: Level.Top });
      });
      pieces.push(')');
      return pieces;
    }
    case 'cond':
      return [
        { expr: expr.test, least: Level.Or },
        ' ? ',
        { expr: expr.then, least: Level.Conditional },
        ' : ',
        { expr: expr.otherwise, least: Level.Conditional },
      ];
  }
}

/** The canonical text of `expr`. */
export function printExpr(expr: Expr): string {
  const out: string[] = [];
  const stack: Piece[] = [{ expr, least: Level.Top }];
  while (stack.length > 0) {
    const piece = stack.pop()!;
    if (typeof piece === 'string') {
      out.push(piece);
      continue;
    }
    const e = unwrap(piece.expr);
    const pieces = piecesOf(e);
    const parenthesised = levelOf(e) < piece.least;
    if (parenthesised) stack.push(')');
    for (let i = pieces.length - 1; i >= 0; i--) stack.push(pieces[i]);
    if (parenthesised) stack.push('(');
  }
  return out.join('');
}
