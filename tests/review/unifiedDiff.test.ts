/** The unified diff printed by `kernwright fix --dry-run` (src-core/review/unifiedDiff.ts). */
import { describe, expect, it } from 'vitest';
import { splitLines, unifiedDiff } from '@kernwright/core';

/** Applies a unified diff to `text` (a small patch reader, to check diffs by round trip). */
function applyPatch(text: string, patch: string): string {
  const lines = splitLines(text);
  const out: string[] = [];
  let at = 0;
  const rows = patch.split('\n');
  for (let r = 2; r < rows.length; r++) {
    const m = /^@@ -(\d+)(?:,(\d+))? \+\d+(?:,\d+)? @@$/.exec(rows[r]);
    if (!m) continue;
    const start = Number(m[2] === '0' ? Number(m[1]) + 1 : m[1]) - 1;
    while (at < start) out.push(lines[at++]);
    for (r++; r < rows.length && !rows[r].startsWith('@@'); r++) {
      const row = rows[r];
      if (row === '') continue;
      const noEol = rows[r + 1] === '\\ No newline at end of file';
      const body = row.slice(1) + (noEol ? '' : '\n');
      if (row[0] === ' ') { expect(lines[at]).toBe(body); out.push(lines[at++]); }
      else if (row[0] === '-') { expect(lines[at]).toBe(body); at++; }
      else if (row[0] === '+') out.push(body);
      if (noEol) r++;
    }
    r--;
  }
  while (at < lines.length) out.push(lines[at++]);
  return out.join('');
}

const many = Array.from({ length: 30 }, (_, k) => `line ${k + 1}\n`).join('');

describe('unifiedDiff', () => {
  it('is empty for equal texts', () => expect(unifiedDiff('a\n', 'a\n', 'a/x', 'b/x')).toBe(''));

  it('prints one hunk with three lines of context', () => {
    const after = many.replace('line 10\n', 'line ten\n');
    expect(unifiedDiff(many, after, 'a/f.kw', 'b/f.kw')).toBe(
      ['--- a/f.kw', '+++ b/f.kw', '@@ -7,7 +7,7 @@', 'line 7', 'line 8', 'line 9', '-line 10', '+line ten', 'line 11', 'line 12', 'line 13', '']
        .map((l, i) => (i >= 3 && !l.startsWith('-') && !l.startsWith('+') && l !== '' ? ` ${l}` : l)).join('\n'),
    );
  });

  it('keeps distant changes in separate hunks, and writes empty ranges as diff does', () => {
    const after = 'line 0\n' + many.replace('line 25\n', '');
    const d = unifiedDiff(many, after, 'a', 'b');
    expect(d.match(/^@@/gm)).toHaveLength(2);
    expect(applyPatch(many, d)).toBe(after);
    expect(unifiedDiff('', 'a\n', 'x', 'y')).toBe('--- x\n+++ y\n@@ -0,0 +1 @@\n+a\n');
    expect(unifiedDiff('a\nb\n', '', 'x', 'y')).toBe('--- x\n+++ y\n@@ -1,2 +0,0 @@\n-a\n-b\n');
  });

  it('marks a last line without a line break', () => {
    const d = unifiedDiff('a\nb', 'a\nc', 'x', 'y');
    expect(d).toBe('--- x\n+++ y\n@@ -1,2 +1,2 @@\n a\n-b\n\\ No newline at end of file\n+c\n\\ No newline at end of file\n');
  });

  it('round-trips random edits through a patch reader', () => {
    let seed = 7;
    const rand = (n: number) => (seed = (seed * 1103515245 + 12345) % 2147483648) % n;
    for (let trial = 0; trial < 60; trial++) {
      const a = Array.from({ length: rand(25) }, () => `${rand(6)}\n`);
      const b = [...a];
      for (let e = rand(6); e > 0; e--) {
        const op = rand(3);
        if (op === 0 && b.length > 0) b.splice(rand(b.length), 1);
        else if (op === 1) b.splice(rand(b.length + 1), 0, `${rand(6)}\n`);
        else if (b.length > 0) b[rand(b.length)] = `x${rand(3)}\n`;
      }
      const before = a.join('');
      const after = b.join('') + (rand(2) ? 'tail' : '');
      expect(applyPatch(before, unifiedDiff(before, after, 'a', 'b'))).toBe(after);
    }
  });

  it('shows a change of line ending', () => {
    expect(unifiedDiff('a\r\nb\r\n', 'a\nb\r\n', 'x', 'y')).toContain('-a\r\n+a\n');
  });
});
