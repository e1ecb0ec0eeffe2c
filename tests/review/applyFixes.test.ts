/** Choosing and applying fixes (src-core/review/applyFixes.ts). */
import { describe, expect, it } from 'vitest';
import { applyEdits, chooseFixes, compatibleFixes, dominantLineEnding, type Diagnostic, type Fix } from '@kernwright/core';

const edit = (start: number, end: number, newText: string) => ({ range: { start, end }, newText });
const fix = (kind: string, edits: ReturnType<typeof edit>[], preferred?: boolean): Fix => ({ kind, title: kind, edits, ...(preferred === undefined ? {} : { preferred }) });
const diag = (fixes: Fix[]): Diagnostic => ({ code: 'KW999', severity: 'info', range: { start: 0, end: 0 }, message: 'm', fixes });

describe('chooseFixes', () => {
  it('takes the preferred fix of each diagnostic, or with --only the fix of that kind', () => {
    const a = fix('declare-property', [edit(0, 0, 'x')], true);
    const b = fix('declare-property', [edit(0, 0, 'y')], false);
    const s = fix('symmetrize', [edit(1, 2, 'z')]);
    const ds = [diag([a, b]), diag([s]), diag([])];
    expect(chooseFixes(ds).map((c) => c.fix)).toEqual([a]);
    expect(chooseFixes(ds, 'symmetrize').map((c) => c.fix)).toEqual([s]);
    expect(chooseFixes(ds, 'declare-property').map((c) => c.fix)).toEqual([a]);
    expect(chooseFixes(ds, 'did-you-mean')).toEqual([]);
  });
});

describe('compatibleFixes and applyEdits', () => {
  it('keeps fixes whose edits do not overlap, defers the others, and applies identical fixes once', () => {
    const text = 'abcdefghij';
    const chosen = [
      { code: 'A', fix: fix('k', [edit(1, 3, 'X')]) },
      { code: 'B', fix: fix('k', [edit(2, 4, 'Y')]) },
      { code: 'C', fix: fix('k', [edit(5, 5, '+'), edit(8, 9, 'Z')]) },
      { code: 'D', fix: fix('k', [edit(1, 3, 'X')]) },
      { code: 'E', fix: fix('k', [edit(5, 5, '-')]) },
    ];
    const { accepted, deferred } = compatibleFixes(chosen, text.length);
    expect(accepted.map((c) => c.code)).toEqual(['A', 'C']);
    expect(deferred).toBe(2);
    expect(applyEdits(text, accepted.flatMap((c) => c.fix.edits))).toBe('aXde+fghZj');
  });
  it('refuses edits outside the text', () => {
    expect(compatibleFixes([{ code: 'A', fix: fix('k', [edit(3, 40, '')]) }], 10).accepted).toEqual([]);
  });
  it('gives inserted text the line ending of the file', () => {
    expect(dominantLineEnding('a\r\nb\r\nc\n')).toBe('\r\n');
    expect(dominantLineEnding('a\nb\r\nc\n')).toBe('\n');
    expect(applyEdits('k\r\nend\r\n', [edit(1, 1, '\n  expect x')])).toBe('k\r\n  expect x\r\nend\r\n');
    expect(applyEdits('k\nend\n', [edit(1, 1, '\r\n  expect x')])).toBe('k\n  expect x\nend\n');
  });
});
