/** What is at the cursor, go to definition, references and rename, as plain offsets. */
import { describe, expect, it } from 'vitest';
import { definitionAt, nodeAt, referencesAt, renameAt } from '@kernwright/core';
import { quick, withCursor } from './cursor';

const file = 'domain [0, 1]\nconst ell = 0.5\nfn bump(x) = exp(-x^2 / ell)\nkernel k(t, s) = bump(t - s) * ell\n  expect hermitian\n';

function at(marked: string) {
  const { text, offset } = withCursor(marked);
  const a = quick(text);
  return { text, offset, a, node: nodeAt(a.source, a.model, offset) };
}

describe('nodeAt', () => {
  const cases: [string, string, string][] = [
    ['const e$0ll = 0.5\nkernel k(t, s) = ell', 'symbol', 'ell'],
    ['const ell = 0.5\nkernel k(t, s) = el$0l', 'symbol', 'ell'],
    ['fn bump(x) = x\nkernel k(t, s) = bu$0mp(t)', 'symbol', 'bump'],
    ['kernel k(t, s) = t$0 * s', 'parameter', 't'],
    ['kernel k(t, $0s) = t * s', 'parameter', 's'],
    ['kernel k(t, s) = ex$0p(t)', 'builtin-function', 'exp'],
    ['kernel k(t, s) = p$0i * t', 'builtin-constant', 'pi'],
    ['kernel k(t, s) = t\n  expect herm$0itian', 'expectation', 'hermitian'],
    ['ker$0nel k(t, s) = t', 'keyword', 'kernel'],
    ['kernel k(t, s) = lenght$0', 'unresolved', 'lenght'],
  ];
  it.each(cases)('%j is a %s named %s', (marked, kind, name) => {
    const { node } = at(marked);
    expect(node?.kind).toBe(kind);
    const got = node && ('symbol' in node ? node.symbol.name : 'item' in node ? node.item.name : 'word' in node ? node.word : node.name);
    expect(got).toBe(name);
  });
  it('finds nothing in comments and blank space', () => {
    expect(at('# a comment$0\nkernel k(t, s) = t').node).toBeNull();
  });
});

describe('definition and references', () => {
  it('goes from a use to the declaration', () => {
    const { text, offset, a } = at(file.replace('* ell', '* e$0ll'));
    const r = definitionAt(a.source, a.model, offset)!;
    expect(text.slice(r.start, r.end)).toBe('ell');
    expect(r.start).toBe(text.indexOf('ell'));
  });
  it('lists the declaration and every use in order', () => {
    const { text, offset, a } = at(file.replace('const ell', 'const e$0ll'));
    const refs = referencesAt(a.source, a.model, offset, true)!;
    expect(refs.map((r) => text.slice(r.start, r.end))).toEqual(['ell', 'ell', 'ell']);
    expect(refs.map((r) => r.start)).toEqual([...refs.map((r) => r.start)].sort((x, y) => x - y));
    expect(referencesAt(a.source, a.model, offset, false)).toHaveLength(2);
  });
});

describe('rename', () => {
  function rename(marked: string, newName: string): string | { error: string } {
    const { text, offset, a } = at(marked);
    const r = renameAt(a.source, a.model, offset, newName);
    if ('error' in r) return r;
    let out = text;
    for (const e of [...r.edits].sort((x, y) => y.range.start - x.range.start)) out = out.slice(0, e.range.start) + e.newText + out.slice(e.range.end);
    return out;
  }
  it('renames a constant, a helper, a kernel and a parameter', () => {
    expect(rename(file.replace('const ell', 'const e$0ll'), 'width')).toBe(file.replaceAll('ell', 'width'));
    expect(rename(file.replace('fn bump', 'fn b$0ump'), 'hat')).toBe(file.replaceAll('bump', 'hat'));
    expect(rename('kernel k$0(t, s) = t\nkernel j(t, s) = k(t, s)\n', 'base')).toBe('kernel base(t, s) = t\nkernel j(t, s) = base(t, s)\n');
    expect(rename('kernel k(t$0, s) = t * s + exp(t)\n', 'u')).toBe('kernel k(u, s) = u * s + exp(u)\n');
  });
  it('refuses clashes, keywords, built-ins, malformed names and captures', () => {
    const refusal = (r: string | { error: string }) => (typeof r === 'string' ? r : r.error);
    expect(refusal(rename(file.replace('const ell', 'const e$0ll'), 'bump'))).toMatch(/already declared/u);
    expect(refusal(rename(file.replace('const ell', 'const e$0ll'), 'kernel'))).toMatch(/keyword/u);
    expect(refusal(rename(file.replace('const ell', 'const e$0ll'), 'sqrt'))).toMatch(/built-in/u);
    expect(refusal(rename(file.replace('const ell', 'const e$0ll'), '2x'))).toMatch(/not a valid name/u);
    expect(refusal(rename(file.replace('const ell', 'const e$0ll'), 'x'))).toMatch(/hide/u);
    expect(refusal(rename('kernel k(t$0, s) = t * s\n', 's'))).toMatch(/already a parameter/u);
    expect(refusal(rename('const a = 1\nkernel k(t$0, s) = t * s * a\n', 'a'))).toMatch(/hide/u);
    expect(refusal(rename('kernel k(t, s) = ex$0p(t)\n', 'f'))).toMatch(/Only constants/u);
  });
});
