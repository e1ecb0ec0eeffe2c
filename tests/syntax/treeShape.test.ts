/**
 * Precedence and associativity, as trees. The conventions are those of ordinary mathematical notation and of
 * most expression languages (common practice): * before +, left-to-right for - and /, powers right to left and
 * above a leading minus (-t^2 is -(t^2)), comparisons below arithmetic, and before or; the conditional lowest.
 * properties.test.ts checks the same conventions against the mathjs parser on generated expressions.
 */
import { describe, expect, it } from 'vitest';
import { parseExpression } from '../../src-core/syntax/parser';
import { sexpr } from './treeText';

const cases: [text: string, tree: string][] = [
  // arithmetic
  ['1 + 2 * 3', '(+ 1 (* 2 3))'],
  ['1 * 2 + 3', '(+ (* 1 2) 3)'],
  ['1 - 2 - 3', '(- (- 1 2) 3)'],
  ['8 / 4 / 2', '(/ (/ 8 4) 2)'],
  ['2 * 3 / 4 * 5', '(* (/ (* 2 3) 4) 5)'],
  ['2 ^ 3 ^ 2', '(^ 2 (^ 3 2))'],
  ['-t^2', '(- (^ t 2))'],
  ['t^-2', '(^ t (- 2))'],
  ['t^-s^2', '(^ t (- (^ s 2)))'],
  ['-2 * 3', '(* (- 2) 3)'],
  ['2 * -t', '(* 2 (- t))'],
  ['a - -b', '(- a (- b))'],
  ['--t', '(- (- t))'],
  ['+t - s', '(- (+ t) s)'],
  ['(t - s) * (t + s)', '(* (paren (- t s)) (paren (+ t s)))'],
  ['((t))', '(paren (paren t))'],
  // numbers and names as written
  ['.5 + 3e-4 * 1.5E+2', '(+ .5 (* 3e-4 1.5E+2))'],
  ['σ * ℓ_2 + _x1', '(+ (* σ ℓ_2) _x1)'],
  // calls
  ['min(t, s) * 2', '(* (call min t s) 2)'],
  ['f()', '(call f)'],
  ['exp(-(t - s)^2)', '(call exp (- (^ (paren (- t s)) 2)))'],
  ['max(t, s, a ? b : c)', '(call max t s (? a b c))'],
  ['f (t)', '(call f t)'],
  // comparisons and logic
  ['a < b + 1', '(< a (+ b 1))'],
  ['a + 1 >= b * 2', '(>= (+ a 1) (* b 2))'],
  ['a == b and c != d', '(and (== a b) (!= c d))'],
  ['a or b and c', '(or a (and b c))'],
  ['a and b or c', '(or (and a b) c)'],
  ['a or b or c', '(or (or a b) c)'],
  ['not a and b', '(and (not a) b)'],
  ['not a < b', '(not (< a b))'],
  ['not not a', '(not (not a))'],
  ['a < not b', '(< a (not b))'],
  ['-not a', '(- (not a))'],
  // conditionals
  ['c ? a : b ? x : y', '(? c a (? b x y))'],
  ['c ? d ? 1 : 2 : 3', '(? c (? d 1 2) 3)'],
  ['a or b ? 1 : 2', '(? (or a b) 1 2)'],
  ['t < s ? t : s', '(? (< t s) t s)'],
  ['1 + (c ? a : b)', '(+ 1 (paren (? c a b)))'],
];

describe('expression trees', () => {
  for (const [text, tree] of cases) {
    it(text, () => {
      const { expr, diagnostics } = parseExpression(text);
      expect(diagnostics).toEqual([]);
      expect(sexpr(expr)).toBe(tree);
    });
  }
});

describe('number values', () => {
  const numbers: [raw: string, value: number][] = [
    ['2', 2],
    ['0.5', 0.5],
    ['.5', 0.5],
    ['3e-4', 0.0003],
    ['1.5E+2', 150],
    ['10e2', 1000],
  ];
  for (const [raw, value] of numbers) {
    it(raw, () => expect(parseExpression(raw).expr).toMatchObject({ kind: 'number', raw, value }));
  }
});
