/** Diagnostics in small cases: which code, on which text, with which fix; and the line structure of files. */
import { describe, expect, it } from 'vitest';
import type { KernelDecl } from '../../src-core/syntax';
import { parse, parseExpression } from '../../src-core/syntax/parser';
import { printExpr } from '../../src-core/syntax/printer';

/** Each diagnostic as `code «text under its range»`, or `code ‸offset` for an empty range. */
function summary(text: string, diagnostics = parse(text).diagnostics): string[] {
  return diagnostics.map((d) =>
    d.range.start === d.range.end ? `${d.code} ‸${d.range.start}` : `${d.code} «${text.slice(d.range.start, d.range.end)}»`,
  );
}

describe('the two lines of the format’s first example', () => {
  it('parse with no diagnostic exactly as written', () => {
    const file = parse('domain [0, 1]\nkernel wiener(t, s) = min(t, s)');
    expect(file.diagnostics).toEqual([]);
    expect(file.declarations.map((d) => d.kind)).toEqual(['domain', 'kernel']);
    expect(printExpr((file.declarations[1] as KernelDecl).body)).toBe('min(t, s)');
  });
});

describe('missing operator fix', () => {
  const fixOf = (text: string) => parse(text).diagnostics[0].fixes;
  it('inserts * in the gap of 2t', () => {
    expect(fixOf('kernel k(t, s) = 2t')).toEqual([
      { kind: 'insert-operator', title: 'Insert *', edits: [{ range: { start: 18, end: 18 }, newText: '*' }], preferred: true },
    ]);
  });
  it('inserts "* " before the second operand of 2 pi, so that the result reads 2 * pi', () => {
    expect(fixOf('kernel k(t, s) = 2 pi')).toEqual([
      { kind: 'insert-operator', title: 'Insert *', edits: [{ range: { start: 19, end: 19 }, newText: '* ' }], preferred: true },
    ]);
  });
  it('gives text that parses once applied', () => {
    for (const text of ['kernel k(t, s) = 2t', 'kernel k(t, s) = (t - s)(t + s)', 'kernel k(t, s) = 3(t)', 'kernel k(t, s) = 2 pi']) {
      const [edit] = parse(text).diagnostics[0].fixes![0].edits;
      const fixed = text.slice(0, edit.range.start) + edit.newText + text.slice(edit.range.end);
      expect(parse(fixed).diagnostics, fixed).toEqual([]);
    }
  });
});

describe('single cases', () => {
  const cases: [text: string, expected: string[]][] = [
    // line structure
    ['domain [0, 1]\r\nkernel k(t, s) = t +\r\n  s\rkernel j(t, s) = 2s', ['KW104 ‸59']],
    ['\uFEFFdomain [0, 1]', []],
    ['kernel k(t, s) = t\n\n   # a comment\n\n  + s', []],
    ['kernel k(t, s) = t +\n# a comment at column 0 does not end it\n  s', []],
    ['kernel k(t, s) = t +\nkernel j(t, s) = s', ['KW102 ‸20']],
    ['kernel k(t, s) = t\n  expect norm <=\n    2.5, rank\n  = 3', []],
    ['  expect hermitian', ['KW109 «expect»']],
    ['kernel k(t, s) = t\n  kernel j(t, s) = s', ['KW111 «kernel j(t, s) = s»']],
    ['kernel k(t, s) = t kernel', ['KW104 ‸19']],
    ['\t t\nkernel k(t, s) = t', ['KW110 «t»']],
    // one diagnostic per declaration, the next declaration is checked again
    ['kernel k(t, s) = 2t $ [\nkernel j(t, s) = s $', ['KW104 ‸18', 'KW101 «$»']],
    // brackets
    ['kernel k(t, s) = min(t, s', ['KW103 «(»']],
    ['kernel k(t, s) = min(t s)', ['KW104 ‸23']],
    ['kernel k(t, s) = min(t, s]', ['KW105 «]»']],
    ['domain [0, min(1, 2]', ['KW102 «]»']],
    ['domain [(0, 1]', ['KW102 «,»']],
    ['kernel k(t, s) on [0, 1) = t', ['KW102 «)»']],
    ['kernel k(t, s = t', ['KW103 «(»']],
    ['kernel k(t, s) on [0, 1 = t', ['KW103 «[»']],
    ['kernel k(t, s) on [0 = t', ['KW102 «=»']],
    // kernels take any number of parameters; helpers at least one
    ['kernel k() = 1\nkernel j(a, b, c) = a', []],
    ['fn f() = 1', ['KW102 «)»']],
    // expectations: words with inner hyphens, the parser does not judge names or values
    ['kernel k(t, s) = t\nexpect hilbert-schmidt, wobbly, rank = 2.5, norm <, resolvent 0.5 + 2*i', []],
    ['kernel k(t, s) = t\nexpect norm <= 2t', ['KW104 ‸35']],
    ['kernel k(t, s) = t\nexpect norm <= (1', ['KW103 «(»']],
    // rejected forms at an operand position
    ['kernel k(t, s) = [0, 1]', ['KW105 «[0, 1]»']],
    ['kernel k(t, s) = {', ['KW105 «{»']],
    ['kernel k(t, s) = = t', ['KW102 «=»']],
    ['kernel k(t, s) = t ? : s', ['KW102 «:»']],
    ['kernel k(t, s) = ~t', ['KW101 «~»']],
    ['kernel k(t, s) = t\u200B', ['KW101 «\u200B»']],
    ['kernel k(t, s) = t 𝜎', ['KW104 ‸19']],
    ['kernel k(t, s) = t ☃', ['KW101 «☃»']],
    ['kernel k(t, s) = t \uD800', ['KW101 «\uD800»']],
  ];
  for (const [text, expected] of cases) it(JSON.stringify(text), () => expect(summary(text)).toEqual(expected));

  it('names invisible characters by their code point', () => {
    expect(parse('kernel k(t, s) = t\u200B').diagnostics[0].message).toBe('Unexpected character “U+200B”.');
    expect(parse('kernel k(t, s) = t\u0007').diagnostics[0].message).toBe('Unexpected character “U+0007”.');
  });
});

describe('parseExpression', () => {
  const cases: [text: string, expected: string[]][] = [
    ['t + s', []],
    ['t +\n s', []],
    ['t + s # note', []],
    ['', ['KW102 ‸0']],
    ['t s', ['KW104 ‸2']],
    ['t)', ['KW111 «)»']],
    ['t, s', ['KW111 «, s»']],
  ];
  for (const [text, expected] of cases) {
    it(JSON.stringify(text), () => expect(summary(text, parseExpression(text).diagnostics)).toEqual(expected));
  }

  it('names the expression in the trailing-text message', () => {
    expect(parseExpression('t)').diagnostics[0].message).toBe('Unexpected “)” after the end of the expression.');
  });
});
