/**
 * Expressions of kernel files, by recursive descent with one function per precedence level (the classic layering
 * of N. Wirth, "Algorithms + Data Structures = Programs", 1976, ch. 5), lowest to highest:
 *
 *   conditional  c ? a : b            right-associative
 *   or           a or b
 *   and          a and b
 *   not          not a                prefix
 *   comparison   < <= > >= == !=      not chainable (a < b < c is rejected)
 *   additive     + -
 *   multiplicative  * /
 *   unary        - +                  prefix; -t^2 is -(t^2)
 *   power        ^                    right-associative; the exponent may carry a sign: t^-2
 *   postfix      f(a, b), primaries   numbers, names, ( ... )
 *
 * A prefix operator is accepted wherever an operand is (2 * -t, a < not b); the printer parenthesises such
 * operands. Recursion is bounded: every parenthesis, call, prefix operator, exponent and conditional branch is a
 * nesting level, and more than 64 of them, or more than 4000 nodes, stop the parse with KW107. Left-associative
 * chains are loops, so a long sum costs no stack.
 *
 * Errors: the first one ends the declaration (see `Cursor`). When it is found right after a complete operand
 * (a missing operator, a rejected form), that operand and the rest of the text become one `ErrorExpr`.
 */
import type { BinaryOp, Expr, ErrorExpr, UnaryOp } from './ast';
import { makeDiagnostic } from '../diagnostics/make';
import { shortened, type Cursor, type CursorKind } from './cursor';
import { chainedComparison, rejectToken } from './rejectedForms';
import { declarationKeywords } from './scanner';
import { range } from './textRange';

export const maxNestingDepth = 64;
export const maxExpressionNodes = 4000;

/** Where an expression stands, which decides the tokens that end it. */
export interface ExpressionContext {
  /** Inside the first branch of a conditional: a `:` ends the expression. */
  readonly colonEnds: boolean;
  /** Inside an interval [a, b]: a `]` ends the expression. */
  readonly inInterval: boolean;
}

export const topLevel: ExpressionContext = { colonEnds: false, inInterval: false };
export const intervalBound: ExpressionContext = { colonEnds: false, inInterval: true };

const comparisonOps = new Set<CursorKind>(['<', '<=', '>', '>=', '==', '!=']);

export class ExpressionParser {
  private depth = 0;
  private nodes = 0;

  constructor(private readonly c: Cursor) {}

  /** Parses one complete expression; the limits count afresh for each. */
  parse(ctx: ExpressionContext): Expr {
    this.depth = 0;
    this.nodes = 0;
    return this.conditional(ctx);
  }

  private conditional(ctx: ExpressionContext): Expr {
    const test = this.or(ctx);
    if (this.c.kind() !== '?') return test;
    const refused = this.admit(true, test.range.start);
    if (refused) return refused;
    this.c.advance();
    const then = this.conditional({ colonEnds: true, inInterval: ctx.inInterval });
    let otherwise: Expr;
    if (this.c.kind() === ':') {
      this.c.advance();
      otherwise = this.conditional(ctx);
    } else {
      otherwise = this.c.expected('“:”');
    }
    this.depth--;
    return { kind: 'cond', range: range(test.range.start, this.c.prevEnd), test, then, otherwise };
  }

  private or(ctx: ExpressionContext): Expr {
    let left = this.and(ctx);
    while (this.c.isWord('or')) left = this.binary(left, 'or', () => this.and(ctx));
    return left;
  }

  private and(ctx: ExpressionContext): Expr {
    let left = this.not(ctx);
    while (this.c.isWord('and')) left = this.binary(left, 'and', () => this.not(ctx));
    return left;
  }

  private not(ctx: ExpressionContext): Expr {
    if (this.c.isWord('not')) return this.prefix('not', () => this.not(ctx));
    return this.comparison(ctx);
  }

  private comparison(ctx: ExpressionContext): Expr {
    const left = this.additive(ctx);
    if (!comparisonOps.has(this.c.kind())) return left;
    const result = this.binary(left, this.c.kind() as BinaryOp, () => this.additive(ctx));
    if (!comparisonOps.has(this.c.kind())) return result;
    return this.c.fail(makeDiagnostic('form-not-allowed', this.c.tokenRange, { ...chainedComparison }), left.range.start);
  }

  private additive(ctx: ExpressionContext): Expr {
    let left = this.multiplicative(ctx);
    for (let k = this.c.kind(); k === '+' || k === '-'; k = this.c.kind()) {
      left = this.binary(left, k, () => this.multiplicative(ctx));
    }
    return left;
  }

  private multiplicative(ctx: ExpressionContext): Expr {
    let left = this.unary(ctx);
    for (let k = this.c.kind(); k === '*' || k === '/'; k = this.c.kind()) {
      left = this.binary(left, k, () => this.unary(ctx));
    }
    return left;
  }

  private unary(ctx: ExpressionContext): Expr {
    const k = this.c.kind();
    if (k === '-' || k === '+') return this.prefix(k, () => this.unary(ctx));
    if (this.c.isWord('not')) return this.prefix('not', () => this.not(ctx));
    return this.power(ctx);
  }

  private power(ctx: ExpressionContext): Expr {
    const base = this.postfix(ctx);
    if (this.c.kind() !== '^') return base;
    const refused = this.admit(true, base.range.start);
    if (refused) return refused;
    const opRange = this.c.tokenRange;
    this.c.advance();
    const exponent = this.unary(ctx);
    this.depth--;
    return { kind: 'binary', range: range(base.range.start, this.c.prevEnd), op: '^', opRange, left: base, right: exponent };
  }

  /** A primary, then a check that what follows can follow an operand. */
  private postfix(ctx: ExpressionContext): Expr {
    const operand = this.primary(ctx);
    if (this.c.failed) return operand;
    return this.checkAfterOperand(operand, ctx) ?? operand;
  }

  private primary(ctx: ExpressionContext): Expr {
    const c = this.c;
    const kind = c.kind();
    const start = c.here();
    if (kind === 'number') {
      const refused = this.admit(false, start);
      if (refused) return refused;
      const raw = c.tokenText;
      const value = c.scanner.value;
      c.advance();
      return { kind: 'number', range: range(start, c.prevEnd), value, raw };
    }
    if (kind === 'ident' && !c.isWord('and') && !c.isWord('or') && !c.isWord('not')) {
      const refused = this.admit(false, start);
      if (refused) return refused;
      const name = c.tokenText;
      const nameRange = c.tokenRange;
      c.advance();
      if (c.kind() !== '(') return { kind: 'ident', range: nameRange, name };
      return this.call(name, nameRange, ctx);
    }
    if (kind === '(') {
      const refused = this.admit(true, start);
      if (refused) return refused;
      const open = c.tokenRange;
      c.advance();
      const inner = this.conditional({ colonEnds: false, inInterval: ctx.inInterval });
      if (c.kind() === ')') c.advance();
      else c.unclosed(open, '(', ')');
      this.depth--;
      return { kind: 'paren', range: range(start, c.prevEnd), inner };
    }
    return rejectToken(c, 'operand', start) ?? c.expected('an expression');
  }

  private call(callee: string, calleeRange: { start: number; end: number }, ctx: ExpressionContext): Expr {
    const c = this.c;
    const refused = this.admit(true, calleeRange.start, false);
    if (refused) return refused;
    const open = c.tokenRange;
    c.advance();
    const args: Expr[] = [];
    if (c.kind() === ')') {
      c.advance();
    } else {
      const argCtx: ExpressionContext = { colonEnds: false, inInterval: ctx.inInterval };
      for (;;) {
        args.push(this.conditional(argCtx));
        if (c.kind() === ',') c.advance();
        else if (c.kind() === ')') {
          c.advance();
          break;
        } else {
          c.unclosed(open, '(', ')', { expected: '“,” or “)”' });
          break;
        }
      }
    }
    this.depth--;
    return { kind: 'call', range: range(calleeRange.start, c.prevEnd), callee, calleeRange, args };
  }

  private prefix(op: UnaryOp, operand: () => Expr): Expr {
    const start = this.c.here();
    const refused = this.admit(true, start);
    if (refused) return refused;
    const opRange = this.c.tokenRange;
    this.c.advance();
    const inner = operand();
    this.depth--;
    return { kind: 'unary', range: range(start, this.c.prevEnd), op, opRange, operand: inner };
  }

  private binary(left: Expr, op: BinaryOp, right: () => Expr): Expr {
    const refused = this.admit(false, left.range.start);
    if (refused) return refused;
    const opRange = this.c.tokenRange;
    this.c.advance();
    const r = right();
    return { kind: 'binary', range: range(left.range.start, this.c.prevEnd), op, opRange, left, right: r };
  }

  /**
   * Counts one more node (and one more nesting level when `nest`); past a limit, reports KW107 at the current
   * token and returns the error node for the text from `from`.
   */
  private admit(nest: boolean, from: number, countNode = true): ErrorExpr | undefined {
    if (countNode && ++this.nodes > maxExpressionNodes) {
      return this.c.fail(
        makeDiagnostic('expression-too-complex', this.c.tokenRange, {
          what: `has more than ${maxExpressionNodes} parts`,
          limit: maxExpressionNodes,
        }),
        from,
      );
    }
    if (nest && ++this.depth > maxNestingDepth) {
      return this.c.fail(
        makeDiagnostic('expression-too-complex', this.c.tokenRange, {
          what: `is nested more than ${maxNestingDepth} levels deep`,
          limit: maxNestingDepth,
        }),
        from,
      );
    }
    return undefined;
  }

  /**
   * After a complete operand, the next token must be an operator or end the expression. Otherwise the operand and
   * the rest of the declaration become an error: a missing operator (KW104), a malformed number (KW108), a rejected
   * form (KW105) or a stray character (KW101).
   */
  private checkAfterOperand(operand: Expr, ctx: ExpressionContext): ErrorExpr | undefined {
    const c = this.c;
    const kind = c.kind();
    switch (kind) {
      case 'end': case ')': case ',': case '?': case '^':
      case '+': case '-': case '*': case '/':
      case '<': case '<=': case '>': case '>=': case '==': case '!=':
        return undefined;
      case ':':
        if (ctx.colonEnds) return undefined;
        break;
      case ']':
        if (ctx.inInterval) return undefined;
        break;
      case '=':
        // In `on [a, b = ...` the `]` is what is missing: let the interval report its open bracket.
        if (ctx.inInterval) return undefined;
        break;
      case 'number':
      case '(':
        return this.missingOperator(operand);
      case 'ident':
        if (c.isWord('and') || c.isWord('or') || c.isWord('on')) return undefined;
        // A continuation line that starts like a declaration is most likely a declaration indented by mistake:
        // the declaration above ends here and the text left over is reported as such (KW111).
        if (c.scanner.lineStart && declarationKeywords.some((k) => c.isWord(k))) return undefined;
        if (c.isWord('not')) return c.expected('an operator', operand.range.start);
        return this.missingOperator(operand);
    }
    return rejectToken(c, 'operator', operand.range.start) ?? c.expected('an operator', operand.range.start);
  }

  /** KW104 for juxtaposed operands (2t, 2 pi, (t-s)(t+s)), with the fix that inserts `*`. */
  private missingOperator(left: Expr): ErrorExpr {
    const c = this.c;
    const text = c.scanner.text;
    const rightStart = c.tokenRange.start;
    const adjacent = rightStart === left.range.end;
    const leftText = text.slice(left.range.start, left.range.end);
    const shownLeft = leftText.length > 24 ? `…${leftText.slice(-23)}` : leftText;
    let rightEnd = c.tokenRange.end;
    if (c.kind() === '(') rightEnd = c.consumeBalanced('(', ')');
    const rightText = shortened(text.slice(rightStart, rightEnd), 24);
    const diagnostic = makeDiagnostic(
      'missing-operator',
      range(rightStart, rightStart),
      { left: shownLeft, right: rightText },
      {
        fixes: [
          {
            kind: 'insert-operator',
            title: 'Insert *',
            edits: [{ range: range(rightStart, rightStart), newText: adjacent ? '*' : '* ' }],
            preferred: true,
          },
        ],
      },
    );
    return c.fail(diagnostic, left.range.start);
  }
}
