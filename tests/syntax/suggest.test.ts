/**
 * The did-you-mean helper (src-core/util/suggest.ts; its test sits with the parser, its first user).
 * Distances are checked against worked values of the edit distances (from memory, standard examples):
 * kitten → sitting is 3 (the classic Levenshtein example, also in Wagner and Fischer's setting), and
 * CA → ABC is 2 for the unrestricted Damerau–Levenshtein distance (CA → AC → ABC) where the restricted
 * "optimal string alignment" variant gives 3 — the example that tells the two apart.
 */
import { describe, expect, it } from 'vitest';
import { damerauLevenshtein, suggest } from '../../src-core/util/suggest';
import { declarationKeywords } from '../../src-core/syntax/parser';
import { keywords } from '../../src-core/semantics/builtins';

describe('damerauLevenshtein', () => {
  const cases: [a: string, b: string, distance: number][] = [
    ['', '', 0],
    ['', 'abc', 3],
    ['abc', '', 3],
    ['kernel', 'kernel', 0],
    ['kitten', 'sitting', 3],
    ['CA', 'ABC', 2],
    ['teh', 'the', 1],
    ['domian', 'domain', 1],
    ['kernal', 'kernel', 1],
    ['abcdef', 'badcfe', 3],
    ['σ', 's', 1],
    ['ℓ_2', 'ℓ2', 1],
    ['𝜎', '𝜏', 1],
  ];
  for (const [a, b, distance] of cases) {
    it(`${a || '∅'} → ${b || '∅'} = ${distance}`, () => {
      expect(damerauLevenshtein(a, b)).toBe(distance);
      expect(damerauLevenshtein(b, a)).toBe(distance);
    });
  }
});

describe('suggest', () => {
  const candidates = ['domain', 'const', 'fn', 'kernel', 'expect'];
  const cases: [word: string, suggestion: string | undefined][] = [
    ['kernal', 'kernel'],
    ['Kernel', 'kernel'],
    ['kernl', 'kernel'],
    ['krenel', 'kernel'],
    ['kxrnxl', 'kernel'], // 6 letters allow 2 edits
    ['kxxnxl', undefined], // 3 edits are too many
    ['domian', 'domain'],
    ['cnst', 'const'],
    ['fm', 'fn'], // short words still allow 1 edit
    ['xy', undefined],
    ['function', undefined],
    ['expects', 'expect'],
    ['', undefined], // one edit away from a one-letter word only
  ];
  for (const [word, suggestion] of cases) {
    it(`${word} → ${suggestion ?? 'nothing'}`, () => expect(suggest(word, candidates)).toBe(suggestion));
  }

  it('breaks ties by the order of the candidates', () => {
    expect(suggest('ab', ['ac', 'ad'])).toBe('ac');
    expect(suggest('ab', ['ad', 'ac'])).toBe('ad');
    expect(suggest('cat', ['cut', 'at'])).toBe('cut');
  });

  it('prefers the nearest candidate over an earlier, farther one', () => {
    expect(suggest('kernels', ['kernel_x', 'kernel'])).toBe('kernel');
  });

  it('takes any iterable', () => {
    expect(suggest('exx', new Set(['exp', 'exx2']))).toBe('exp');
  });

  it('has the declaration keywords among the keywords of the builtins', () => {
    for (const k of declarationKeywords) expect(keywords).toContain(k);
  });
});
