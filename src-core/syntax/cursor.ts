/**
 * A cursor over the tokens of one declaration: it hides the line structure from the grammar (the token that starts
 * the next declaration reads as `end`), remembers where the previous token ended, and implements the recovery rule
 * of the parser: the first error of a declaration is reported, the rest of the declaration is skipped, and every
 * later step of the same declaration reads `end` and reports nothing.
 */
import type { ErrorExpr } from './ast';
import type { Diagnostic } from '../diagnostics/types';
import { makeDiagnostic } from '../diagnostics/make';
import type { Scanner, TokenKind } from './scanner';
import { range, type TextRange } from './textRange';

export type CursorKind = TokenKind | 'end';

/** Source text as shown inside a message: cut to `maxLength` characters with an ellipsis. */
export function shortened(text: string, maxLength = 32): string {
  return text.length > maxLength ? `${text.slice(0, maxLength - 1)}…` : text;
}

/** How a found token is named in messages: “text”, shortened when long. */
export function quoted(text: string, maxLength = 32): string {
  return `“${shortened(text, maxLength)}”`;
}

export class Cursor {
  readonly diagnostics: Diagnostic[] = [];
  private readonly reportedStarts = new Set<number>();
  /** End offset of the last token consumed. */
  prevEnd = 0;
  /** The current declaration has had its error; everything else in it is skipped. */
  failed = false;

  /**
   * @param lineStructured true for kernel files (a column-0 line or an indented `expect` line ends the current
   * declaration); false for a lone expression, which ends only at the end of the text.
   */
  constructor(
    readonly scanner: Scanner,
    private readonly lineStructured: boolean,
  ) {}

  /** True when the current token starts the next declaration (or is the end of the text). */
  atBoundary(): boolean {
    const sc = this.scanner;
    if (sc.kind === 'eof') return true;
    if (!this.lineStructured || !sc.lineStart) return false;
    return !sc.indented || sc.isWord('expect');
  }

  /** The kind of the current token, `end` at the end of the declaration. */
  kind(): CursorKind {
    return this.atBoundary() ? 'end' : this.scanner.kind;
  }

  get tokenRange(): TextRange {
    return { start: this.scanner.start, end: this.scanner.end };
  }

  get tokenText(): string {
    return this.scanner.tokenText;
  }

  isWord(word: string): boolean {
    return !this.atBoundary() && this.scanner.isWord(word);
  }

  /** Where a missing piece would go: the current token, or just after the previous one at the end. */
  here(): number {
    return this.atBoundary() ? this.prevEnd : this.scanner.start;
  }

  advance(): void {
    this.prevEnd = this.scanner.end;
    this.scanner.next();
  }

  /** Starts a new declaration: its own error budget. */
  beginDeclaration(): void {
    this.failed = false;
  }

  /** How the current token is named in messages. */
  found(): string {
    return this.atBoundary() ? 'the end of the line' : quoted(this.tokenText);
  }

  /** Records a diagnostic unless this declaration already failed; at most one diagnostic per start offset. */
  report(diagnostic: Diagnostic | undefined): void {
    if (this.failed || !diagnostic) return;
    if (this.reportedStarts.has(diagnostic.range.start)) return;
    this.reportedStarts.add(diagnostic.range.start);
    this.diagnostics.push(diagnostic);
  }

  /**
   * Reports `diagnostic` (if it is the declaration's first), skips the rest of the declaration and returns the
   * error node that stands for the unreadable text from `from` to the end of what was skipped.
   */
  fail(diagnostic: Diagnostic | undefined, from = this.here()): ErrorExpr {
    this.report(diagnostic);
    this.failed = true;
    while (!this.atBoundary()) this.advance();
    return { kind: 'error', range: range(from, this.prevEnd) };
  }

  /** KW102: `what` was expected here. The range is the found token, or an empty range at the end. */
  expected(what: string, from = this.here()): ErrorExpr {
    if (this.failed) return this.fail(undefined, from);
    const at = this.atBoundary() ? range(this.prevEnd, this.prevEnd) : this.tokenRange;
    return this.fail(makeDiagnostic('expected-token', at, { expected: what, found: this.found() }), from);
  }

  /**
   * A bracket opened at `open` is not closed where expected: KW103 on the opening bracket when the declaration
   * ends (or a token in `alsoUnclosedAt` comes), otherwise KW102 (`expected`, by default the closing bracket) on
   * the token found instead.
   */
  unclosed(
    open: TextRange,
    openText: string,
    closeText: string,
    { expected = `“${closeText}”`, alsoUnclosedAt = [] }: { expected?: string; alsoUnclosedAt?: readonly CursorKind[] } = {},
  ): ErrorExpr {
    if (this.failed) return this.fail(undefined);
    const kind = this.kind();
    if (kind !== 'end' && !alsoUnclosedAt.includes(kind)) return this.expected(expected);
    return this.fail(
      makeDiagnostic('unclosed-bracket', open, { open: openText, close: closeText, found: this.found() }),
    );
  }

  /**
   * Consumes tokens from the current opening bracket to its matching closing one (or to the end of the
   * declaration) and returns the end of the matching bracket, or of the opening one when it is never closed.
   */
  consumeBalanced(open: CursorKind, close: CursorKind): number {
    const openEnd = this.scanner.end;
    let depth = 0;
    while (this.kind() !== 'end') {
      const kind = this.kind();
      this.advance();
      if (kind === open) depth++;
      else if (kind === close && --depth === 0) return this.prevEnd;
    }
    return openEnd;
  }

  /** KW111 when text is left after a complete declaration: the range covers all of it. */
  rejectTrailingText(what: string): void {
    if (this.failed || this.atBoundary()) return;
    const start = this.scanner.start;
    const found = this.found();
    while (!this.atBoundary()) this.advance();
    this.report(makeDiagnostic('trailing-text', range(start, this.prevEnd), { found, what }));
    this.failed = true;
  }

  /** Consumes the rest of the current physical line and returns the end of its last token. */
  consumeLine(): number {
    do this.advance();
    while (!this.atBoundary() && !this.scanner.lineStart);
    return this.prevEnd;
  }
}
