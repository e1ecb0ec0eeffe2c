/** The “declare it” fix of KW610: where the claims go, and that the result re-analyses without the hint. */
import { describe, expect, it } from 'vitest';
import { analyzeText, type Fix } from '@kernwright/core';
import { applyFix } from './helpers';

function hintFixes(text: string): Fix[] {
  const d = analyzeText(text, { timeBudgetMs: 5000 }).diagnostics.find((x) => x.code === 'KW610');
  if (!d?.fixes) throw new Error('no KW610 hint with fixes');
  return [...d.fixes];
}

describe('declare the properties that hold', () => {
  it('appends to the last expect clause; the combined fix is preferred, single ones follow', () => {
    const text = 'domain [0, 1]\nkernel k(t, s) = 1 + t * s\n  expect hermitian\n';
    const fixes = hintFixes(text);
    expect(fixes.map((f) => f.title)).toEqual([
      'Declare “positive”, “continuous”, “rank = 2”', 'Declare “positive”', 'Declare “continuous”', 'Declare “rank = 2”',
    ]);
    expect(fixes[0].preferred).toBe(true);
    expect(fixes.slice(1).every((f) => !f.preferred)).toBe(true);
    const after = applyFix(text, fixes[0]);
    expect(after).toBe('domain [0, 1]\nkernel k(t, s) = 1 + t * s\n  expect hermitian, positive, continuous, rank = 2\n');
    const again = analyzeText(after, { timeBudgetMs: 5000 });
    expect(again.diagnostics).toEqual([]);
  });

  it('adds an expect line after the declaration, after a trailing comment, with the file’s line ends', () => {
    const text = 'domain [0, 1]\r\nkernel k(t, s) = exp(-(t - s)^2)   # a note\r\nkernel m(t, s) = t\r\n';
    const after = applyFix(text, hintFixes(text)[0]);
    expect(after).toBe('domain [0, 1]\r\nkernel k(t, s) = exp(-(t - s)^2)   # a note\r\n  expect positive, continuous\r\nkernel m(t, s) = t\r\n');
    const again = analyzeText(after, { timeBudgetMs: 5000 });
    expect(again.diagnostics.filter((d) => d.range.start < after.indexOf('kernel m')).map((d) => d.code)).toEqual([]);
  });

  it('works at the end of a file without a final line break', () => {
    const text = 'domain [0, 1]\nkernel k(t, s) = exp(-(t - s)^2)';
    expect(applyFix(text, hintFixes(text)[0])).toBe(`${text}\n  expect positive, continuous`);
  });
});
