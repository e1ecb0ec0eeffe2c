/**
 * Limits of the parser: nesting depth (64 levels) and size (4000 nodes) of one expression, and speed.
 * The limits keep the editor responsive and the stack safe; they are the project's own choice.
 */
import { describe, expect, it } from 'vitest';
import { parse, parseExpression } from '../../src-core/syntax/parser';
import { maxExpressionNodes, maxNestingDepth } from '../../src-core/syntax/expressionParser';
import type { KernelDecl } from '../../src-core/syntax';
import { allExprs } from './treeText';

const head = 'kernel k(t, s) = ';
const codes = (text: string) => parse(text).diagnostics.map((d) => d.code);

describe('nesting depth', () => {
  const nested = (open: string, close: string, depth: number) => open.repeat(depth) + 't' + close.repeat(depth);
  // Each form, and the token of `open` that opens a new level.
  const forms: [name: string, open: string, close: string, opener: string][] = [
    ['parentheses', '(', ')', '('],
    ['calls', 'exp(', ')', '('],
    ['prefix minus', '-', '', '-'],
    ['not', 'not ', '', 'not'],
    ['powers', 't^', '', '^'],
    ['conditionals', 'c ? ', ' : 1', '?'],
  ];
  for (const [name, open, close, opener] of forms) {
    it(`${name}: ${maxNestingDepth} levels parse, one more is refused at the token that opens it`, () => {
      expect(codes(head + nested(open, close, maxNestingDepth))).toEqual([]);
      const text = head + nested(open, close, maxNestingDepth + 1);
      const [d, ...rest] = parse(text).diagnostics;
      expect(rest).toEqual([]);
      expect(d.code).toBe('KW107');
      expect(d.message).toBe('This expression is nested more than 64 levels deep; the limit is 64.');
      const start = head.length + maxNestingDepth * open.length + open.indexOf(opener);
      expect(d.range).toEqual({ start, end: start + opener.length });
    });
  }
});

describe('expression size', () => {
  // -t + t + ... has 2n nodes for n terms: the unary minus, n names and n - 1 additions.
  const sum = (terms: number) => '-' + Array(terms).fill('t').join(' + ');

  it(`${maxExpressionNodes} nodes parse`, () => {
    const { expr, diagnostics } = parseExpression(sum(maxExpressionNodes / 2));
    expect(diagnostics).toEqual([]);
    const file = parse(head + sum(maxExpressionNodes / 2));
    expect(file.diagnostics).toEqual([]);
    expect(allExprs(file)).toHaveLength(maxExpressionNodes);
    expect(expr.kind).toBe('binary');
  });

  it('one node more is refused at the token that would make it', () => {
    const text = head + sum(maxExpressionNodes / 2) + ' + t';
    const [d, ...rest] = parse(text).diagnostics;
    expect(rest).toEqual([]);
    expect(d.code).toBe('KW107');
    expect(d.message).toBe('This expression has more than 4000 parts; the limit is 4000.');
    expect(d.range).toEqual({ start: text.length - 3, end: text.length - 2 }); // the last +
  });

  it('counts each expression of a declaration on its own', () => {
    const bound = sum(maxExpressionNodes / 2);
    expect(codes(`domain [${bound}, ${bound}]`)).toEqual([]);
    const k = parse(`kernel k(t, s) on [${bound}, 1] = ${bound}\n  expect norm <= ${bound}`).declarations[0] as KernelDecl;
    expect(k.expects[0].items[0].value?.kind).toBe('binary');
  });
});

describe('speed', () => {
  it('parses a 50-kernel file in well under 5 ms', () => {
    const lines = ['domain [0, 1]', 'const c = 2.5   # metres', 'fn bump(x) = exp(-x^2 / 2)'];
    for (let i = 0; i < 50; i++) {
      lines.push(
        `kernel k${i}(t, s) on [0, 2 * pi] = exp(-abs(t - s) / c) * (1 + t*s) + min(t, s)^2`,
        `    - (t < s ? sin(pi*t) : cos(pi*s)) + bump(t - s) / (1 + ${i})`,
        `  expect hermitian, positive, norm <= 2.5`,
      );
    }
    const text = lines.join('\n');
    for (let i = 0; i < 20; i++) parse(text); // warm up the compiler
    const times: number[] = [];
    for (let i = 0; i < 21; i++) {
      const t0 = performance.now();
      const file = parse(text);
      times.push(performance.now() - t0);
      expect(file.diagnostics).toEqual([]);
    }
    times.sort((a, b) => a - b);
    expect(times[10]).toBeLessThan(5); // the median; about 0.5 ms on an idle machine
  });
});
