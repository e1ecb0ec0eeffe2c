/**
 * The scanner of kernel files: turns text into tokens on demand, one at a time, without allocating a token object
 * (the current token lives in the scanner's fields, as in the TypeScript compiler's scanner). Comments are collected
 * on the way; line structure is reported through `lineStart` and `indented` so that the parser can tell where a
 * declaration ends.
 *
 * The scanner never fails: a character that starts no token becomes an `unknown` token, a malformed number a
 * `badNumber` token, and forms the format rejects (strings, `&&`, `%`, ...) get tokens of their own so that the
 * parser can say precisely what is wrong.
 */
import type { Comment } from './ast';

export type TokenKind =
  | 'eof'
  | 'ident'
  | 'number'
  | 'badNumber'
  | 'string'
  | 'unknown'
  | '+' | '-' | '*' | '/' | '^'
  | '<' | '<=' | '>' | '>=' | '==' | '!='
  | '=' | '?' | ':' | ',' | '(' | ')' | '[' | ']' | '{' | '}'
  | '.' | '%' | '!' | ';' | '&&' | '||' | '=>' | '**';

/** The words that start a declaration (a subset of the keywords of `semantics/builtins.ts`). */
export const declarationKeywords = ['domain', 'const', 'fn', 'kernel', 'expect'] as const;

const CR = 13;
const LF = 10;
const HASH = 35;

const identStart = /[\p{L}_]/u;
const identPart = /[\p{L}\p{M}\p{Nd}_]/u;
const whitespace = /\s/;

function isAsciiLetter(c: number): boolean {
  return (c >= 97 && c <= 122) || (c >= 65 && c <= 90) || c === 95;
}

function isDigit(c: number): boolean {
  return c >= 48 && c <= 57;
}

function isSpace(c: number): boolean {
  if (c === 32 || c === 9) return true;
  if (c < 128) return c === 11 || c === 12;
  return whitespace.test(String.fromCharCode(c));
}

export class Scanner {
  /** The current token. */
  kind: TokenKind = 'eof';
  start = 0;
  end = 0;
  /** The current token is the first one on its line. */
  lineStart = true;
  /** The line of the current token starts with whitespace (meaningful when `lineStart`). */
  indented = false;
  /** The value of a `number` token. */
  value = 0;
  readonly comments: Comment[] = [];

  private pos = 0;
  private atLineStart = true;
  private lineIndented = false;

  constructor(readonly text: string) {
    if (text.charCodeAt(0) === 0xfeff) this.pos = 1; // a byte-order mark is not indentation
    this.next();
  }

  /** The text of the current token. */
  get tokenText(): string {
    return this.text.slice(this.start, this.end);
  }

  /** True when the current token is the identifier `word`. */
  isWord(word: string): boolean {
    return this.kind === 'ident' && this.end - this.start === word.length && this.text.startsWith(word, this.start);
  }

  /** Moves to the next token, skipping whitespace, line ends and comments. */
  next(): void {
    const text = this.text;
    for (;;) {
      const c = text.charCodeAt(this.pos);
      if (c === LF || c === CR) {
        this.pos += c === CR && text.charCodeAt(this.pos + 1) === LF ? 2 : 1;
        this.atLineStart = true;
        this.lineIndented = false;
      } else if (c === HASH) {
        this.scanComment();
      } else if (this.pos < text.length && isSpace(c)) {
        if (this.atLineStart) this.lineIndented = true;
        this.pos++;
      } else {
        break;
      }
    }
    this.lineStart = this.atLineStart;
    this.indented = this.lineIndented;
    this.atLineStart = false;
    this.start = this.pos;
    if (this.pos >= text.length) {
      this.kind = 'eof';
      this.end = this.pos;
      this.lineStart = true;
      return;
    }
    this.kind = this.scanToken();
    this.end = this.pos;
  }

  /**
   * Re-reads the current identifier as a word with inner hyphens (`hilbert-schmidt`), as expectation names are
   * written. A hyphen belongs to the word only when a letter, digit or underscore follows it directly.
   */
  rescanHyphenatedWord(): void {
    if (this.kind !== 'ident') return;
    let p = this.end;
    for (;;) {
      if (this.text.charCodeAt(p) === 45 /* - */ && this.isIdentPartAt(p + 1)) p++;
      else break;
      while (this.isIdentPartAt(p)) p += this.codePointLength(p);
    }
    this.pos = this.end = p;
  }

  private scanComment(): void {
    const text = this.text;
    const start = this.pos;
    let p = start + 1;
    while (p < text.length) {
      const c = text.charCodeAt(p);
      if (c === LF || c === CR) break;
      p++;
    }
    this.comments.push({ range: { start, end: p }, text: text.slice(start + 1, p) });
    this.pos = p;
  }

  private scanToken(): TokenKind {
    const text = this.text;
    const c = text.charCodeAt(this.pos);
    const d = text.charCodeAt(this.pos + 1);
    if (isDigit(c) || (c === 46 /* . */ && isDigit(d))) return this.scanNumber();
    if (isAsciiLetter(c) || (c >= 128 && this.isIdentStartAt(this.pos))) {
      this.pos += this.codePointLength(this.pos);
      while (this.isIdentPartAt(this.pos)) this.pos += this.codePointLength(this.pos);
      return 'ident';
    }
    const two = (second: number, kind: TokenKind, single: TokenKind): TokenKind => {
      this.pos += d === second ? 2 : 1;
      return d === second ? kind : single;
    };
    switch (c) {
      case 43: this.pos++; return '+';
      case 45: this.pos++; return '-';
      case 42: return two(42, '**', '*');
      case 47: this.pos++; return '/';
      case 94: this.pos++; return '^';
      case 60: return two(61, '<=', '<');
      case 62: return two(61, '>=', '>');
      case 61:
        if (d === 62) { this.pos += 2; return '=>'; }
        return two(61, '==', '=');
      case 33: return two(61, '!=', '!');
      case 63: this.pos++; return '?';
      case 58: this.pos++; return ':';
      case 44: this.pos++; return ',';
      case 40: this.pos++; return '(';
      case 41: this.pos++; return ')';
      case 91: this.pos++; return '[';
      case 93: this.pos++; return ']';
      case 123: this.pos++; return '{';
      case 125: this.pos++; return '}';
      case 46: this.pos++; return '.';
      case 37: this.pos++; return '%';
      case 59: this.pos++; return ';';
      case 38:
        if (d === 38) { this.pos += 2; return '&&'; }
        break;
      case 124:
        if (d === 124) { this.pos += 2; return '||'; }
        break;
      case 34:
      case 39:
        return this.scanString(c);
    }
    this.pos += this.codePointLength(this.pos);
    return 'unknown';
  }

  /**
   * Numbers: digits with an optional fraction (`2`, `0.5`, `.5`) and exponent (`3e-4`, `1.5E+2`). A number that
   * goes on with a dot (`1.2.3`, `1.`) or an exponent without digits (`1e`, `1e+`) is one `badNumber` token.
   * `2exp` and `2eta` are the number 2 followed by a name (the parser reports the missing operator).
   */
  private scanNumber(): TokenKind {
    const text = this.text;
    const start = this.pos;
    let p = start;
    while (isDigit(text.charCodeAt(p))) p++;
    if (text.charCodeAt(p) === 46 && isDigit(text.charCodeAt(p + 1))) {
      p++;
      while (isDigit(text.charCodeAt(p))) p++;
    }
    let bad = false;
    const e = text.charCodeAt(p);
    if (e === 101 || e === 69) {
      const sign = text.charCodeAt(p + 1);
      const signed = sign === 43 || sign === 45;
      if (isDigit(text.charCodeAt(p + (signed ? 2 : 1)))) {
        p += signed ? 2 : 1;
        while (isDigit(text.charCodeAt(p))) p++;
      } else if (signed || !this.isIdentPartAt(p + 1)) {
        p += signed ? 2 : 1;
        bad = true;
      }
    }
    if (text.charCodeAt(p) === 46) {
      // Runs like 1.2.3, 1., 1e5.2: swallow every digit, dot and exponent that follows.
      bad = true;
      for (;;) {
        const c = text.charCodeAt(p);
        if (isDigit(c) || c === 46) p++;
        else if ((c === 101 || c === 69) && isDigit(text.charCodeAt(p - 1))) {
          p++;
          const s = text.charCodeAt(p);
          if (s === 43 || s === 45) p++;
        } else break;
      }
    }
    this.pos = p;
    if (bad) return 'badNumber';
    this.value = Number(text.slice(start, p));
    return 'number';
  }

  /** A quoted string, up to its closing quote, a comment or the end of the line. */
  private scanString(quote: number): TokenKind {
    const text = this.text;
    let p = this.pos + 1;
    while (p < text.length) {
      const c = text.charCodeAt(p);
      if (c === LF || c === CR || c === HASH) break;
      p++;
      if (c === quote) break;
    }
    this.pos = p;
    return 'string';
  }

  private codePointLength(p: number): number {
    const c = this.text.charCodeAt(p);
    if (c < 0xd800 || c > 0xdbff) return 1;
    const low = this.text.charCodeAt(p + 1);
    return low >= 0xdc00 && low <= 0xdfff ? 2 : 1;
  }

  private isIdentStartAt(p: number): boolean {
    const c = this.text.charCodeAt(p);
    if (c < 128) return isAsciiLetter(c);
    const cp = this.text.codePointAt(p);
    return cp !== undefined && identStart.test(String.fromCodePoint(cp));
  }

  private isIdentPartAt(p: number): boolean {
    const c = this.text.charCodeAt(p);
    if (c < 128) return isAsciiLetter(c) || isDigit(c);
    if (Number.isNaN(c)) return false;
    const cp = this.text.codePointAt(p);
    return cp !== undefined && identPart.test(String.fromCodePoint(cp));
  }
}
