/**
 * Hostile input: names that are special to JavaScript objects, code-like text, huge lines and deep nesting.
 * The parser must not throw, must stay quick, and must say clearly what is wrong. (The time bounds are loose on
 * purpose, for busy test machines: they catch quadratic behaviour, which would take minutes here.)
 */
import { describe, expect, it } from 'vitest';
import type { ConstDecl, KernelDecl } from '../../src-core/syntax';
import { parse, parseExpression } from '../../src-core/syntax/parser';
import { printExpr } from '../../src-core/syntax/printer';
import { suggest } from '../../src-core/util/suggest';

const summary = (text: string) => parse(text).diagnostics.map((d) => `${d.code} ${text.slice(d.range.start, d.range.end)}`);

function timed<T>(run: () => T): { result: T; ms: number } {
  const t0 = performance.now();
  const result = run();
  return { result, ms: performance.now() - t0 };
}

describe('names special to JavaScript', () => {
  it('are ordinary names in declarations and expressions', () => {
    const text = [
      'const constructor = 1',
      'const __proto__ = 2',
      'fn toString(hasOwnProperty) = hasOwnProperty + this',
      'kernel valueOf(t, s) = constructor * __proto__ + toString(t)',
      '  expect __proto__, constructor = 3',
    ].join('\n');
    const file = parse(text);
    expect(file.diagnostics).toEqual([]);
    expect((file.declarations[1] as ConstDecl).name.text).toBe('__proto__');
    const k = file.declarations[3] as KernelDecl;
    expect(printExpr(k.body)).toBe('constructor * __proto__ + toString(t)');
    expect(k.expects[0].items.map((i) => i.name)).toEqual(['__proto__', 'constructor']);
  });

  it('as the first word of a line are unknown declarations, with no false suggestion', () => {
    expect(summary('constructor\n__proto__ = 1\ntoString()')).toEqual(['KW106 constructor', 'KW106 __proto__', 'KW106 toString']);
    expect(suggest('__proto__', ['domain', 'const', 'fn', 'kernel', 'expect'])).toBeUndefined();
    expect(suggest('constructor', ['constructor'])).toBe('constructor');
  });
});

describe('code-like text', () => {
  const cases: [text: string, expected: string[]][] = [
    ['kernel k(t, s) = process.exit()', ['KW105 .exit']],
    ['kernel k(t, s) = require("fs")', ['KW105 "fs"']],
    ['kernel k(t, s) = globalThis.process', ['KW105 .process']],
    ['kernel k(t, s) = this', []],
    ['kernel k(t, s) = `${t}`', ['KW101 `']],
    ['kernel k(t, s) = eval(\'1\')', ["KW105 '1'"]],
    ['kernel k(t, s) = (() => t)()', ['KW102 )']],
    ['kernel k(t, s) = t; process.exit()', ['KW105 ;']],
    ['kernel k(t, s) = import("x")', ['KW105 "x"']],
  ];
  for (const [text, expected] of cases) it(text, () => expect(summary(text)).toEqual(expected));
});

describe('huge input', () => {
  it('a 1 MB expression line: refused for size, quickly', () => {
    const text = 'kernel k(t, s) = ' + 't + '.repeat(250_000) + 't';
    expect(text.length).toBeGreaterThan(1_000_000);
    const { result, ms } = timed(() => parse(text));
    expect(result.diagnostics.map((d) => d.code)).toEqual(['KW107']);
    expect(result.declarations).toHaveLength(1);
    expect(result.declarations[0].range).toEqual({ start: 0, end: text.length });
    expect(ms).toBeLessThan(3000);
  });

  it('a 1 MB name is a name; a 1 MB unknown word gets a short message', () => {
    const long = 'a'.repeat(1_000_000);
    const file = parse(`const ${long} = 1`);
    expect(file.diagnostics).toEqual([]);
    expect((file.declarations[0] as ConstDecl).name.text).toHaveLength(1_000_000);
    const [d] = parse(long).diagnostics;
    expect(d.code).toBe('KW106');
    expect(d.range).toEqual({ start: 0, end: 1_000_000 });
    expect(d.message.length).toBeLessThan(120);
  });

  it('a 1 MB comment, string or run of stray characters', () => {
    expect(parse('#' + 'x'.repeat(1_000_000)).comments[0].text).toHaveLength(1_000_000);
    expect(summary('kernel k(t, s) = "' + 'x'.repeat(1_000_000)).map((s) => s.slice(0, 8))).toEqual(['KW105 "x']);
    expect(parse('kernel k(t, s) = ' + '$'.repeat(1_000_000)).diagnostics.map((d) => d.code)).toEqual(['KW101']);
    const [n] = parse('const c = 1' + '.1'.repeat(500_000)).diagnostics;
    expect(n.code).toBe('KW108');
    expect(n.message.length).toBeLessThan(80);
  });

  it('20000 lines with an error each: one diagnostic per line', () => {
    const text = 'kernel k(t, s) = 2t\n'.repeat(20_000);
    const { result, ms } = timed(() => parse(text));
    expect(result.diagnostics).toHaveLength(20_000);
    expect(result.declarations).toHaveLength(20_000);
    expect(ms).toBeLessThan(5000);
  });
});

describe('deep nesting', () => {
  const deep: [name: string, text: string, code: string][] = [
    ['100000 "("', '('.repeat(100_000), 'KW107'],
    ['100000 "(" then as many ")"', '('.repeat(100_000) + 't' + ')'.repeat(100_000), 'KW107'],
    ['100000 calls', 'f('.repeat(100_000) + 't', 'KW107'],
    ['100000 minus signs', '-'.repeat(100_000) + 't', 'KW107'],
    ['100000 nots', 'not '.repeat(100_000) + 't', 'KW107'],
    ['100000 powers', 't^'.repeat(100_000) + 't', 'KW107'],
    ['100000 conditionals', 'c ? '.repeat(100_000) + 't', 'KW107'],
    ['100000 "["', '['.repeat(100_000), 'KW105'],
    ['100000 "{"', '{'.repeat(100_000), 'KW105'],
  ];
  for (const [name, body, code] of deep) {
    it(name, () => {
      const { result, ms } = timed(() => parse('kernel k(t, s) = ' + body));
      expect(result.diagnostics.map((d) => d.code)).toEqual([code]);
      expect(ms).toBeLessThan(3000);
      expect(parseExpression(body).diagnostics.map((d) => d.code)).toEqual([code]);
    });
  }

  it('100000 "(" in a domain and in an expect value', () => {
    expect(parse('domain [' + '('.repeat(100_000)).diagnostics.map((d) => d.code)).toEqual(['KW107']);
    expect(parse('kernel k(t, s) = t\n  expect norm <= ' + '('.repeat(100_000)).diagnostics.map((d) => d.code)).toEqual(['KW107']);
  });
});
