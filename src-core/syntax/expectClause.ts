/**
 * `expect` clauses: a comma-separated list of claims about the kernel declared just above, e.g.
 * `expect hermitian, positive, norm <= 2.5, rank = 3, resolvent 0.5 + 2*i`.
 *
 * An item is a word of letters, digits and underscores with inner hyphens (`hilbert-schmidt`), then optionally
 * one of `<`, `<=`, `=`, then optionally an expression that runs to the next top-level comma or the end of the
 * clause. Whether the word is a known claim and the value fits it is for the semantic layer to say.
 */
import type { ExpectClause, Expectation, ExpectationOp, Expr } from './ast';
import type { Cursor } from './cursor';
import { topLevel, type ExpressionParser } from './expressionParser';
import { range, type TextRange } from './textRange';

/** Parses the clause whose `expect` keyword is the current token. */
export function parseExpectClause(c: Cursor, expressions: ExpressionParser): ExpectClause {
  const keywordRange = c.tokenRange;
  c.advance();
  const items: Expectation[] = [];
  for (;;) {
    const item = parseExpectation(c, expressions);
    if (!item) break;
    items.push(item);
    if (c.kind() === ',') {
      c.advance();
      continue;
    }
    if (c.kind() !== 'end') c.expected('“,” or the end of the line');
    break;
  }
  return { range: range(keywordRange.start, c.prevEnd), keywordRange, items };
}

function parseExpectation(c: Cursor, expressions: ExpressionParser): Expectation | undefined {
  if (c.kind() !== 'ident') {
    c.expected('an expectation name');
    return undefined;
  }
  c.scanner.rescanHyphenatedWord();
  const nameRange = c.tokenRange;
  const name = c.tokenText;
  c.advance();
  let op: ExpectationOp | undefined;
  let opRange: TextRange | undefined;
  const k = c.kind();
  if (k === '<' || k === '<=' || k === '=') {
    op = k;
    opRange = c.tokenRange;
    c.advance();
  } else if (k === '>' || k === '>=' || k === '==' || k === '!=') {
    c.expected('“<”, “<=”, “=” or a value');
  }
  let value: Expr | undefined;
  if (c.kind() !== ',' && c.kind() !== 'end') value = expressions.parse(topLevel);
  return {
    range: range(nameRange.start, c.prevEnd),
    name,
    nameRange,
    ...(op !== undefined && opRange ? { op, opRange } : {}),
    ...(value ? { value } : {}),
  };
}
