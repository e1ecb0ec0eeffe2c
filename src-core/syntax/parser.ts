/**
 * The parser of kernel files (`.kw`). It never throws: it always returns a complete tree and the syntax
 * diagnostics (KW1xx), recovering at declaration boundaries in the manner of the TypeScript compiler's parser
 * (report the first error, skip to the next declaration, carry on).
 *
 * ## The format
 *
 * Lines end with \n, \r\n or \r. `#` starts a comment that runs to the end of the line; every comment is kept in
 * `SourceFile.comments`. Blank lines and comment-only lines are skipped everywhere and never end a declaration.
 *
 * One declaration per line. A declaration starts at column 0 with its keyword; a following line that starts with
 * whitespace continues it (the expression simply goes on), except that an indented line whose first word is
 * `expect` starts an expect clause. (An indented line that starts with another declaration keyword where an
 * operator should come is taken for a declaration indented by mistake and reported as trailing text, KW111.)
 *
 *     domain [a, b]                          default interval of the file's kernels
 *     const NAME = expr        # note        the trailing comment of the last line is the constant's note (a unit)
 *     fn NAME(p1, p2, ...) = expr            a helper; one or more parameters
 *     kernel NAME(t, s) = expr               any number of parameters parses (the semantic layer wants two)
 *     kernel NAME(t, s) on [a, b] = expr     a kernel with its own interval
 *     expect item, item, ...                 claims about the kernel above, at column 0 or indented
 *
 * An `expect` clause belongs to the kernel declared just before it, also when other expect clauses come between;
 * anywhere else it is an orphan (KW109), still parsed and then dropped. An expectation item is a word with inner
 * hyphens, an optional `<`, `<=` or `=`, and an optional value expression (see expectClause.ts).
 *
 * Names are a Unicode letter or `_` followed by letters, digits and `_` (σ, ℓ). Numbers are written 2, 0.5, .5,
 * 3e-4, 1.5E+2. Expressions, from the lowest precedence to the highest: `c ? a : b`, `or`, `and`, `not`,
 * comparisons (`< <= > >= == !=`, not chainable), `+ -`, `* /`, prefix `- +`, `^` (right-associative),
 * calls and primaries (see expressionParser.ts).
 *
 * ## Diagnostics
 *
 * KW101 stray character, KW102 missing piece, KW103 unclosed bracket, KW104 missing operator (with an
 * "Insert *" fix), KW105 form not allowed (assignment, string, array, object, property access, %, factorial,
 * range, &&, ||, =>, **, chained comparison), KW106 unknown declaration (with did-you-mean), KW107 expression
 * too deep or too long, KW108 malformed number, KW109 orphan expect, KW110 indented line before any declaration,
 * KW111 text after a complete declaration.
 *
 * Recovery: a declaration reports at most one error; what was read stays in the tree, a missing piece becomes an
 * `ErrorExpr` (or a `Name` with empty text) whose range is the exact spot, and parsing resumes at the next
 * declaration. A declaration's range runs from its keyword to its last token (continuation lines and expect
 * clauses included, trailing comments excluded); a syntax error of a declaration lies inside that range. Later
 * layers should not evaluate a declaration whose range holds a syntax diagnostic: an unclosed bracket or trailing
 * text leaves a tree without error nodes (the structure read is complete), but the text is still wrong.
 */
import type {
  ConstDecl,
  Declaration,
  ExpectClause,
  Expr,
  Interval,
  KernelDecl,
  Name,
  SourceFile,
} from './ast';
import type { Diagnostic } from '../diagnostics/types';
import { makeDiagnostic } from '../diagnostics/make';
import { suggest } from '../util/suggest';
import { Cursor, shortened } from './cursor';
import { parseExpectClause } from './expectClause';
import { ExpressionParser, intervalBound, topLevel } from './expressionParser';
import { declarationKeywords, Scanner } from './scanner';
import { range, type TextRange } from './textRange';

export { declarationKeywords };

/** Parses a kernel file. Never throws. */
export function parse(text: string): SourceFile {
  return new FileParser(text).parseFile();
}

/** Parses a lone expression (for quick fixes and tests); text left after it is reported as KW111. */
export function parseExpression(text: string): { expr: Expr; diagnostics: Diagnostic[] } {
  const c = new Cursor(new Scanner(text), false);
  const expr = new ExpressionParser(c).parse(topLevel);
  c.rejectTrailingText('expression');
  return { expr, diagnostics: c.diagnostics };
}

class FileParser {
  private readonly scanner: Scanner;
  private readonly c: Cursor;
  private readonly expressions: ExpressionParser;
  private readonly declarations: Declaration[] = [];

  constructor(private readonly text: string) {
    this.scanner = new Scanner(text);
    this.c = new Cursor(this.scanner, true);
    this.expressions = new ExpressionParser(this.c);
  }

  parseFile(): SourceFile {
    const sc = this.scanner;
    while (sc.kind !== 'eof') {
      this.c.beginDeclaration();
      if (sc.isWord('expect')) this.orphanExpect();
      else if (sc.indented) this.strayContinuation();
      else if (sc.isWord('domain')) this.domain();
      else if (sc.isWord('const')) this.constant();
      else if (sc.isWord('fn')) this.helper();
      else if (sc.isWord('kernel')) this.kernel();
      else this.unknownDeclaration();
    }
    const diagnostics = [...this.c.diagnostics].sort((a, b) => a.range.start - b.range.start);
    return { text: this.text, declarations: this.declarations, comments: sc.comments, diagnostics };
  }

  /** Consumes the declaration keyword (the current token) and returns its range. */
  private keyword(): TextRange {
    const r = this.c.tokenRange;
    this.c.advance();
    return r;
  }

  private domain(): void {
    const keywordRange = this.keyword();
    const interval = this.interval();
    this.c.rejectTrailingText('domain declaration');
    this.declarations.push({ kind: 'domain', range: range(keywordRange.start, this.c.prevEnd), keywordRange, interval });
  }

  private constant(): void {
    const firstComment = this.scanner.comments.length;
    const keywordRange = this.keyword();
    const name = this.name('a constant name');
    this.equals();
    const value = this.expressions.parse(topLevel);
    this.c.rejectTrailingText('constant’s value');
    const end = this.c.prevEnd;
    const note = this.trailingComment(firstComment, end);
    const decl: ConstDecl = { kind: 'const', range: range(keywordRange.start, end), keywordRange, name, value };
    this.declarations.push(note === undefined ? decl : { ...decl, note });
  }

  private helper(): void {
    const keywordRange = this.keyword();
    const name = this.name('a function name');
    const params = this.parameters(true);
    this.equals();
    const body = this.expressions.parse(topLevel);
    this.c.rejectTrailingText('helper’s body');
    this.declarations.push({ kind: 'fn', range: range(keywordRange.start, this.c.prevEnd), keywordRange, name, params, body });
  }

  private kernel(): void {
    const c = this.c;
    const keywordRange = this.keyword();
    const name = this.name('a kernel name');
    const params = this.parameters(false);
    let domain: Interval | undefined;
    if (c.isWord('on')) {
      c.advance();
      domain = this.interval();
    }
    this.equals();
    const body = this.expressions.parse(topLevel);
    c.rejectTrailingText('kernel’s body');
    const expects: ExpectClause[] = [];
    while (this.scanner.kind !== 'eof' && this.scanner.isWord('expect')) {
      c.beginDeclaration();
      expects.push(parseExpectClause(c, this.expressions));
    }
    const whole = range(keywordRange.start, c.prevEnd);
    const decl: KernelDecl = domain
      ? { kind: 'kernel', range: whole, keywordRange, name, params, domain, body, expects }
      : { kind: 'kernel', range: whole, keywordRange, name, params, body, expects };
    this.declarations.push(decl);
  }

  /** KW109: an expect clause that follows no kernel. Its items are still checked, then dropped. */
  private orphanExpect(): void {
    this.c.report(makeDiagnostic('orphan-expect', this.c.tokenRange));
    parseExpectClause(this.c, this.expressions);
  }

  /** KW110: indented lines before the first declaration. The first line is reported, all are skipped. */
  private strayContinuation(): void {
    const start = this.c.tokenRange.start;
    const end = this.c.consumeLine();
    this.c.fail(makeDiagnostic('stray-continuation', range(start, end)));
  }

  /** KW106: a column-0 line whose first word is no declaration keyword; it and its continuation are skipped. */
  private unknownDeclaration(): void {
    const sc = this.scanner;
    const word = sc.tokenText;
    const guess = sc.kind === 'ident' ? suggest(word, declarationKeywords) : undefined;
    const at = this.c.tokenRange;
    this.c.advance();
    this.c.fail(
      makeDiagnostic('unknown-declaration', at, {
        word: shortened(word),
        suggestion: guess ? ` Did you mean “${guess}”?` : '',
      }),
    );
  }

  private name(what: string): Name {
    const c = this.c;
    if (c.kind() === 'ident') {
      const name = { text: c.tokenText, range: c.tokenRange };
      c.advance();
      return name;
    }
    const at = c.here();
    c.expected(what);
    return { text: '', range: range(at, at) };
  }

  /** `(p1, p2, ...)`; `required` asks for at least one parameter. */
  private parameters(required: boolean): Name[] {
    const c = this.c;
    const params: Name[] = [];
    if (c.kind() !== '(') {
      c.expected('“(”');
      return params;
    }
    const open = c.tokenRange;
    c.advance();
    if (c.kind() === ')' && !required) {
      c.advance();
      return params;
    }
    for (;;) {
      if (c.kind() !== 'ident') {
        c.expected('a parameter name');
        return params;
      }
      params.push({ text: c.tokenText, range: c.tokenRange });
      c.advance();
      if (c.kind() === ',') {
        c.advance();
      } else if (c.kind() === ')') {
        c.advance();
        return params;
      } else {
        c.unclosed(open, '(', ')', { expected: '“,” or “)”', alsoUnclosedAt: ['='] });
        return params;
      }
    }
  }

  private equals(): void {
    if (this.c.kind() === '=') this.c.advance();
    else this.c.expected('“=”');
  }

  /** `[a, b]` */
  private interval(): Interval {
    const c = this.c;
    if (c.kind() !== '[') {
      const missing = c.expected('“[”');
      return { range: missing.range, lower: missing, upper: { kind: 'error', range: missing.range } };
    }
    const open = c.tokenRange;
    c.advance();
    const lower = this.expressions.parse(intervalBound);
    let upper: Expr;
    if (c.kind() === ',') {
      c.advance();
      upper = this.expressions.parse(intervalBound);
    } else {
      upper = c.expected('“,”');
    }
    if (c.kind() === ']') c.advance();
    else c.unclosed(open, '[', ']', { alsoUnclosedAt: ['='] });
    return { range: range(open.start, c.prevEnd), lower, upper };
  }

  /** The text of a comment that follows offset `end` on the same line, trimmed. */
  private trailingComment(firstComment: number, end: number): string | undefined {
    const comments = this.scanner.comments;
    for (let i = firstComment; i < comments.length; i++) {
      const comment = comments[i];
      if (comment.range.start < end) continue;
      const between = this.text.slice(end, comment.range.start);
      return /[\r\n]/.test(between) ? undefined : comment.text.trim();
    }
    return undefined;
  }
}
