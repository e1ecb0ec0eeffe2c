/** Every node's range covers exactly its own text: expressions in pre-order, then declarations. */
import { describe, expect, it } from 'vitest';
import type { ConstDecl, DomainDecl, FnDecl, KernelDecl } from '../../src-core/syntax';
import { parse, parseExpression } from '../../src-core/syntax/parser';
import { nodeTexts } from './treeText';

const slice = (text: string, r: { start: number; end: number }) => text.slice(r.start, r.end);

describe('expression ranges (pre-order)', () => {
  const cases: [text: string, texts: string[]][] = [
    ['2 * (t + s)', ['2 * (t + s)', '2', '(t + s)', 't + s', 't', 's']],
    ['exp(-(t - s)^2)', ['exp(-(t - s)^2)', '-(t - s)^2', '(t - s)^2', '(t - s)', 't - s', 't', 's', '2']],
    ['min( t ,s )', ['min( t ,s )', 't', 's']],
    ['not  a', ['not  a', 'a']],
    ['c ? x : y', ['c ? x : y', 'c', 'x', 'y']],
    ['  σ + 1.5E+2  ', ['σ + 1.5E+2', 'σ', '1.5E+2']],
  ];
  for (const [text, texts] of cases) {
    it(text, () => expect(nodeTexts(text, parseExpression(text).expr)).toEqual(texts));
  }

  it('operator and callee ranges', () => {
    const text = 'f(a) <= b';
    const { expr } = parseExpression(text);
    if (expr.kind !== 'binary' || expr.left.kind !== 'call') throw new Error('unexpected shape');
    expect(slice(text, expr.opRange)).toBe('<=');
    expect(slice(text, expr.left.calleeRange)).toBe('f');
  });
});

describe('declaration ranges', () => {
  it('domain: keyword, interval from [ to ]', () => {
    const text = 'domain [0, 1]   # default';
    const d = parse(text).declarations[0] as DomainDecl;
    expect(slice(text, d.range)).toBe('domain [0, 1]');
    expect(slice(text, d.keywordRange)).toBe('domain');
    expect(slice(text, d.interval.range)).toBe('[0, 1]');
  });

  it('const: the name, the value, the note; the trailing comment stays outside', () => {
    const text = 'const c = 2.5 # metres';
    const d = parse(text).declarations[0] as ConstDecl;
    expect(slice(text, d.range)).toBe('const c = 2.5');
    expect(slice(text, d.name.range)).toBe('c');
    expect(d.note).toBe('metres');
  });

  it('const: the note comes from the last line of a continued declaration only', () => {
    const text = 'const c = 1 +  # first line\n  2  # second line\nconst d = 3\n# not a note';
    const [c, d] = parse(text).declarations as ConstDecl[];
    expect(slice(text, c.range)).toBe('const c = 1 +  # first line\n  2');
    expect(c.note).toBe('second line');
    expect(d.note).toBeUndefined();
  });

  it('fn: name and parameters', () => {
    const text = 'fn blend(a, b, w) = w*a + (1 - w)*b';
    const d = parse(text).declarations[0] as FnDecl;
    expect(slice(text, d.name.range)).toBe('blend');
    expect(d.params.map((p) => slice(text, p.range))).toEqual(['a', 'b', 'w']);
    expect(slice(text, d.body.range)).toBe('w*a + (1 - w)*b');
  });

  it('kernel: continuation lines and expect clauses are inside, comments after them are not', () => {
    const text = [
      'kernel k(t, s) on [0, 2] = t',
      '    + s   # continued',
      '',
      '  expect hermitian, norm <= 2',
      'expect rank = 3   # trailing',
      'domain [0, 1]',
    ].join('\n');
    const file = parse(text);
    expect(file.diagnostics).toEqual([]);
    const k = file.declarations[0] as KernelDecl;
    expect(slice(text, k.range)).toBe(text.slice(0, text.indexOf('   # trailing')));
    expect(slice(text, k.domain!.range)).toBe('[0, 2]');
    expect(slice(text, k.body.range)).toBe('t\n    + s');
    expect(k.expects.map((c) => slice(text, c.range))).toEqual(['expect hermitian, norm <= 2', 'expect rank = 3']);
    const [hermitian, norm] = k.expects[0].items;
    expect(slice(text, hermitian.range)).toBe('hermitian');
    expect(slice(text, norm.range)).toBe('norm <= 2');
    expect(slice(text, norm.nameRange)).toBe('norm');
    expect(slice(text, norm.opRange!)).toBe('<=');
    expect(slice(text, k.expects[0].keywordRange)).toBe('expect');
  });

  it('missing pieces are empty nodes at the exact spot', () => {
    const text = 'kernel k(t, s) =\nconst = 3\ndomain [0,]';
    const [k, c, d] = parse(text).declarations as [KernelDecl, ConstDecl, DomainDecl];
    expect(k.body).toEqual({ kind: 'error', range: { start: 16, end: 16 } });
    expect(c.name).toEqual({ text: '', range: { start: text.indexOf('= 3'), end: text.indexOf('= 3') } });
    expect(d.interval.upper.kind).toBe('error');
    expect(slice(text, d.interval.upper.range)).toBe(']');
    expect(slice(text, d.range)).toBe('domain [0,]');
  });
});
