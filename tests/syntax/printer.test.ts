/** The canonical printer (fewest parentheses, single spaces) and the pre-order walker. */
import { describe, expect, it } from 'vitest';
import type { Expr } from '../../src-core/syntax';
import { parseExpression } from '../../src-core/syntax/parser';
import { printExpr } from '../../src-core/syntax/printer';
import { walkExpr } from '../../src-core/syntax/walk';

const print = (text: string) => printExpr(parseExpression(text).expr);

describe('printExpr', () => {
  const cases: [text: string, printed: string][] = [
    ['((a+b))*c', '(a + b) * c'],
    ['a-(b-c)', 'a - (b - c)'],
    ['(a-b)-c', 'a - b - c'],
    ['a*(b/c)', 'a * (b / c)'],
    ['(a*b)/c', 'a * b / c'],
    ['(-t)^2', '(-t) ^ 2'],
    ['-(t^2)', '-t ^ 2'],
    ['(2^3)^4', '(2 ^ 3) ^ 4'],
    ['2^(3^4)', '2 ^ 3 ^ 4'],
    ['t^(-2)', 't ^ -2'],
    ['2*(-t)', '2 * -t'],
    ['-(a*b)', '-(a * b)'],
    ['-(-t)', '--t'],
    ['a<(b<c)', 'a < (b < c)'],
    ['(a<b)==(c<d)', '(a < b) == (c < d)'],
    ['(c?a:b)?x:y', '(c ? a : b) ? x : y'],
    ['c?(d?1:2):3', 'c ? d ? 1 : 2 : 3'],
    ['c?1:(d?2:3)', 'c ? 1 : d ? 2 : 3'],
    ['(c?1:2)+1', '(c ? 1 : 2) + 1'],
    ['min( t,s )', 'min(t, s)'],
    ['f((a), (b + c))', 'f(a, b + c)'],
    ['1.50 + .5e+1', '1.50 + .5e+1'],
    ['not(a and b)', 'not (a and b)'],
    ['(not a) and b', 'not a and b'],
    ['-(not a)', '-(not a)'],
    ['a + not b', 'a + (not b)'],
    ['(a or b) and c', '(a or b) and c'],
    ['a or (b and c)', 'a or b and c'],
    ['not (a < b)', 'not a < b'],
  ];
  for (const [text, printed] of cases) {
    it(`${text} → ${printed}`, () => {
      expect(parseExpression(text).diagnostics).toEqual([]);
      expect(print(text)).toBe(printed);
      expect(print(printed)).toBe(printed);
    });
  }

  it('prints an error node as …', () => {
    expect(print('t +')).toBe('t + …');
  });

  it('prints a tree far deeper than the call stack allows recursion for', () => {
    let expr: Expr = { kind: 'ident', range: { start: 0, end: 1 }, name: 't' };
    for (let i = 0; i < 100_000; i++) {
      expr = { kind: 'unary', range: { start: 0, end: 1 }, op: '-', opRange: { start: 0, end: 1 }, operand: expr };
    }
    expect(printExpr(expr)).toBe(`${'-'.repeat(100_000)}t`);
  });
});

describe('walkExpr', () => {
  it('visits in pre-order, children in source order', () => {
    const names: string[] = [];
    walkExpr(parseExpression('f(a + b, c ? d : -e)').expr, (node) => {
      names.push(node.kind === 'ident' ? node.name : node.kind === 'call' ? node.callee : node.kind);
    });
    expect(names).toEqual(['f', 'binary', 'a', 'b', 'cond', 'c', 'd', 'unary', 'e']);
  });

  it('skips the children of a node when the visitor returns false', () => {
    const seen: string[] = [];
    walkExpr(parseExpression('(a + b) * c').expr, (node) => {
      seen.push(node.kind === 'ident' ? node.name : node.kind);
      return node.kind !== 'paren';
    });
    expect(seen).toEqual(['binary', 'paren', 'c']);
  });
});
