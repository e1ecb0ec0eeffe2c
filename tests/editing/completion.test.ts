/** Completion contexts and candidates, and signature help, with the cursor marked as `$0`. */
import { describe, expect, it } from 'vitest';
import { completionContext, completionsAt, signatureAt } from '@kernwright/core';
import { quick, withCursor } from './cursor';

describe('completion context', () => {
  const cases: [string, string][] = [
    ['$0', 'declaration'],
    ['ker$0', 'declaration'],
    ['kernel k(t, s) = t\n  expect $0', 'expectation'],
    ['kernel k(t, s) = t\nexpect hermitian, pos$0', 'expectation'],
    ['kernel k(t, s) = t\n  expect norm <= $0', 'expression'],
    ['kernel k(t, s) = ex$0', 'expression'],
    ['kernel k(t, s) = t\n    + $0', 'expression'],
    ['kernel k(t, s) = t  # a comm$0', 'none'],
    ['kernel na$0', 'none'],
    ['kernel k(t, s) $0', 'kernel-domain'],
    ['kernel k(t, s) o$0', 'kernel-domain'],
    ['fn f(x, $0', 'none'],
    ['kernel k(t, s) = 2.$0', 'none'],
  ];
  it.each(cases)('%j → %s', (marked, context) => {
    const { text, offset } = withCursor(marked);
    expect(completionContext(text, offset)).toBe(context);
  });
});

describe('completion candidates', () => {
  const labels = (marked: string) => {
    const { text, offset } = withCursor(marked);
    const a = quick(text);
    return completionsAt(a.source, a.model, offset);
  };
  it('offers the parameters of the enclosing declaration only', () => {
    const got = labels('fn f(x) = x\nkernel k(t, s) = $0').map((c) => c.label);
    expect(got).toEqual(expect.arrayContaining(['t', 's', 'f', 'exp', 'pi']));
    expect(got).not.toContain('x');
  });
  it('does not offer a declaration to itself', () => {
    expect(labels('const a = 1\nconst b = $0').map((c) => c.label)).not.toContain('b');
  });
  it('offers claims with snippets for the ones that take values', () => {
    const norm = labels('kernel k(t, s) = t\n  expect $0').find((c) => c.label === 'norm')!;
    expect(norm.insertText).toBe('norm <= ${1:1}');
    expect(norm.snippet).toBe(true);
  });
  it('offers `on` after a kernel’s parameters', () => {
    expect(labels('kernel k(t, s) $0').map((c) => c.label)).toContain('on');
  });
});

describe('signature help', () => {
  const sig = (marked: string) => {
    const { text, offset } = withCursor(marked);
    const a = quick(text);
    return signatureAt(a.source, a.model, offset);
  };
  it('names the function and the active argument', () => {
    expect(sig('kernel k(t, s) = exp($0')).toMatchObject({ label: 'exp(z)', activeParameter: 0 });
    expect(sig('fn g(x, w) = x\nkernel k(t, s) = g(t, (s + 1)$0')).toMatchObject({ label: 'g(x, w)', activeParameter: 1 });
    expect(sig('kernel k(t, s) = exp(min(t, $0')).toMatchObject({ activeParameter: 1 });
    expect(sig('kernel k(t, s) = max(t, s, 1, $0')?.parameters).toHaveLength(4);
  });
  it('skips comments and stops at declaration boundaries', () => {
    expect(sig('kernel k(t, s) = exp(t  # note (a, b, c\n    + $0')).toMatchObject({ label: 'exp(z)', activeParameter: 0 });
    expect(sig('kernel k(t, s) = exp(t\nkernel j(t, s) = $0')).toBeNull();
    expect(sig('kernel k(t, s) = exp(t) + $0')).toBeNull();
    expect(sig('fn f(x, $0')).toBeNull();
  });
});
