/** The canonical layout: golden cases, and invariants on every example (idempotent, same tree, same comments). */
import { readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { breakLine, formatSource, minimalEdit, parse, printExpr, type Declaration, type SourceFile } from '@kernwright/core';

const format = (text: string) => formatSource(parse(text));

describe('golden cases', () => {
  const cases: [string, string][] = [
    ['domain [ 0,1 ]\n', 'domain [0, 1]\n'],
    ['\n\nconst a=(2)*3\n\n\n\nconst b = a\n', 'const a = 2 * 3\n\nconst b = a\n'],
    ['kernel k(t,s) on [0,2]=t*s\n expect hermitian,norm<=2 , rank = 1\n', 'kernel k(t, s) on [0, 2] = t * s\n  expect hermitian, norm <= 2, rank = 1\n'],
    ['const a = 1 # m\nconst bb = 22   # km\n', 'const a = 1    # m\nconst bb = 22  # km\n'],
    ['kernel k(t, s) = t   # one\n    + s    # two\n', '# one\nkernel k(t, s) = t + s  # two\n'],
    ['kernel k(t, s) = t\n# about\nexpect positive  # why\n', 'kernel k(t, s) = t\n  # about\n  expect positive  # why\n'],
    ['domain [0, 1]\r\nconst a = 1\r\n', 'domain [0, 1]\r\nconst a = 1\r\n'],
    ['# only a comment', '# only a comment\n'],
    ['', ''],
  ];
  it.each(cases)('%j', (input, output) => {
    expect(format(input)).toBe(output);
  });
  it('leaves files with syntax errors alone', () => {
    expect(format('kernel k(t, s) = 2t\n')).toBeNull();
  });
  it('breaks long sums before + and -, never elsewhere', () => {
    const lines = breakLine('kernel k(t, s) = ', Array.from({ length: 12 }, (_, i) => `c${i} * exp(-${i} * t)`).join(' + '), 60);
    expect(lines.length).toBeGreaterThan(1);
    for (const l of lines.slice(1)) expect(l).toMatch(/^ {4}\+ /u);
    expect(lines.every((l) => l.length <= 60)).toBe(true);
  });
});

/** Each declaration as canonical text (expressions through printExpr), for comparing trees. */
function shape(source: SourceFile): string[] {
  const p = printExpr;
  return source.declarations.map((d: Declaration) => {
    switch (d.kind) {
      case 'domain': return `domain ${p(d.interval.lower)} ${p(d.interval.upper)}`;
      case 'const': return `const ${d.name.text} ${p(d.value)}`;
      case 'fn': return `fn ${d.name.text} ${d.params.map((x) => x.text)} ${p(d.body)}`;
      case 'kernel': return `kernel ${d.name.text} ${d.params.map((x) => x.text)} ${d.domain ? p(d.domain.lower) + p(d.domain.upper) : ''} ${p(d.body)} ${
        d.expects.map((c) => c.items.map((i) => `${i.name}${i.op ?? ''}${i.value ? p(i.value) : ''}`).join(',')).join(';')}`;
    }
  });
}

describe('invariants on the examples', () => {
  const dirs = ['examples', 'examples/broken'];
  const files = dirs.flatMap((d) => readdirSync(path.resolve(__dirname, '..', '..', d)).filter((f) => f.endsWith('.kw')).map((f) => path.join(d, f)));
  it.each(files)('%s', (file) => {
    const text = readFileSync(path.resolve(__dirname, '..', '..', file), 'utf8');
    const before = parse(text);
    const once = formatSource(before);
    if (before.diagnostics.some((d) => d.severity === 'error')) {
      expect(once).toBeNull();
      return;
    }
    expect(once).not.toBeNull();
    const after = parse(once!);
    expect(after.diagnostics).toEqual([]);
    expect(shape(after)).toEqual(shape(before));
    expect(after.comments.map((c) => c.text.trimEnd()).sort()).toEqual(before.comments.map((c) => c.text.trimEnd()).sort());
    expect(formatSource(after)).toBe(once);
    // The minimal edit turns the old text into the new one.
    const [edit] = minimalEdit(text, once!);
    const applied = edit ? text.slice(0, edit.range.start) + edit.newText + text.slice(edit.range.end) : text;
    expect(applied).toBe(once);
  });
});
