import { describe, expect, it } from 'vitest';
import { isAnnotation, readAnnotations } from './annotations';

describe('readAnnotations', () => {
  const cases: { name: string; text: string; expected: ReturnType<typeof readAnnotations> }[] = [
    {
      name: 'carets under columns 17-18',
      text: 'kernel k(t, s) = 2t\n#                ^^ KW104 Missing operator',
      expected: [{ line: 0, startCol: 17, endCol: 19, code: 'KW104', messageFragment: 'Missing operator' }],
    },
    {
      name: 'an empty range',
      text: 'kernel k(t, s) =\n#               | KW102',
      expected: [{ line: 0, startCol: 16, endCol: 16, code: 'KW102', messageFragment: '' }],
    },
    {
      name: 'carets touching the # start at column 0',
      text: 'expect positive\n#^^^^^ KW109',
      expected: [{ line: 0, startCol: 0, endCol: 6, code: 'KW109', messageFragment: '' }],
    },
    {
      name: 'the # alone marks column 0',
      text: '$\n# KW106 A line starts',
      expected: [{ line: 0, startCol: 0, endCol: 1, code: 'KW106', messageFragment: 'A line starts' }],
    },
    {
      name: 'consecutive annotations point at the same code line',
      text: 'a b c\n#  ^ KW104\n#    ^ KW105 x\nnext',
      expected: [
        { line: 0, startCol: 3, endCol: 4, code: 'KW104', messageFragment: '' },
        { line: 0, startCol: 5, endCol: 6, code: 'KW105', messageFragment: 'x' },
      ],
    },
    {
      name: 'CRLF line ends and ordinary comments',
      text: '# a comment\r\nconst c = 1 # metres\r\n#          ^ KW111 trailing\r\n',
      expected: [{ line: 1, startCol: 11, endCol: 12, code: 'KW111', messageFragment: 'trailing' }],
    },
  ];
  for (const { name, text, expected } of cases) {
    it(name, () => expect(readAnnotations(text)).toEqual(expected));
  }

  it('tells annotations from ordinary comments', () => {
    expect(isAnnotation('#   ^ KW101')).toBe(true);
    expect(isAnnotation('# metres')).toBe(false);
    expect(isAnnotation('# KW1 is not a code')).toBe(false);
    expect(isAnnotation('  #   ^ KW101')).toBe(false);
  });

  it('refuses annotations it cannot place', () => {
    expect(() => readAnnotations('#  ^ KW101\ncode')).toThrow(/no code line/);
    expect(() => readAnnotations('code\n#   KW101')).toThrow(/without markers/);
  });
});
