/**
 * Tokens the kernel format rejects, and what the parser says about them: characters that start no token (KW101),
 * malformed numbers (KW108) and forms borrowed from programming languages that a kernel expression must not hold
 * (KW105: assignments, strings, arrays, objects, property access, %, factorials, ranges, &&, ||, =>, **).
 * Each message names the form and hints at what to write instead.
 */
import type { ErrorExpr } from './ast';
import { makeDiagnostic } from '../diagnostics/make';
import { shortened, type Cursor, type CursorKind } from './cursor';
import { range, type TextRange } from './textRange';

export interface RejectedForm {
  readonly form: string;
  /** Starts with a space, as the catalogue template expects. */
  readonly hint: string;
}

const arrayForm: RejectedForm = { form: 'An array or index', hint: ' Use ( ) for grouping and f(x) for calls.' };
const objectForm: RejectedForm = { form: 'An object', hint: ' Kernel expressions are plain arithmetic; use ( ) for grouping.' };

/** Forms rejected wherever they appear in an expression. */
const formsAnywhere = new Map<CursorKind, RejectedForm>([
  ['string', { form: 'A string', hint: ' Kernel expressions hold only numbers and names.' }],
  ['[', arrayForm],
  ['{', objectForm],
  ['.', { form: 'Property access', hint: ' Names hold only letters, digits and _; call functions directly, e.g. exp(t).' }],
  ['%', { form: 'The remainder operator %', hint: ' Write a - b*floor(a/b) for the remainder.' }],
  [';', { form: 'A semicolon', hint: ' Write one declaration per line.' }],
  ['&&', { form: 'The operator &&', hint: ' Write and.' }],
  ['||', { form: 'The operator ||', hint: ' Write or.' }],
  ['=>', { form: 'An arrow function', hint: ' Declare a helper with fn name(x) = expression.' }],
  ['**', { form: 'The operator **', hint: ' Write ^ for powers.' }],
]);

/** Forms rejected where an operator is expected, that is, right after a complete operand. */
const formsAfterOperand = new Map<CursorKind, RejectedForm>([
  ['=', { form: 'An assignment', hint: ' Write == to compare.' }],
  ['!', { form: 'A factorial', hint: ' Write the product out, or use a helper function.' }],
  [']', arrayForm],
  ['}', objectForm],
  [':', { form: 'A range', hint: ' Write c ? a : b for a choice; intervals are written [a, b] after domain or on.' }],
]);

/** Forms rejected where an operand is expected. */
const formsAsOperand = new Map<CursorKind, RejectedForm>([
  ['!', { form: 'The operator !', hint: ' Write not.' }],
]);

export const chainedComparison: RejectedForm = {
  form: 'A chained comparison',
  hint: ' Join two comparisons with and, e.g. 0 < t and t < 1.',
};

/** Characters that look like operators of other notations, with what to write instead. */
const characterHints = new Map<string, string>([
  ['&', ' Write and.'],
  ['|', ' Write or.'],
  ['×', ' Write * for multiplication.'],
  ['·', ' Write * for multiplication.'],
  ['⋅', ' Write * for multiplication.'],
  ['∙', ' Write * for multiplication.'],
  ['÷', ' Write / for division.'],
  ['−', ' Write - (the ASCII minus sign).'],
  ['–', ' Write - (the ASCII minus sign).'],
  ['—', ' Write - (the ASCII minus sign).'],
  ['≤', ' Write <=.'],
  ['≥', ' Write >=.'],
  ['≠', ' Write !=.'],
  ['²', ' Write ^2.'],
  ['³', ' Write ^3.'],
  ['√', ' Write sqrt(x).'],
  ['“', ' Kernel expressions hold only numbers and names.'],
  ['”', ' Kernel expressions hold only numbers and names.'],
]);

const invisible = /^[\p{C}\p{Z}]$/u;

/** A character as shown in a message: itself, or its code point when it cannot be seen. */
export function shownCharacter(char: string): string {
  const cp = char.codePointAt(0) ?? 0;
  return invisible.test(char) ? `U+${cp.toString(16).toUpperCase().padStart(4, '0')}` : char;
}

/**
 * If the current token is rejected at this `position`, reports it, skips the rest of the declaration and returns
 * the error node that replaces the text from `from`; otherwise returns undefined and consumes nothing.
 */
export function rejectToken(c: Cursor, position: 'operand' | 'operator', from: number): ErrorExpr | undefined {
  const kind = c.kind();
  const at = c.tokenRange;
  if (kind === 'unknown') {
    const char = c.tokenText;
    const hint = characterHints.get(char) ?? '';
    return c.fail(makeDiagnostic('unexpected-character', at, { char: shownCharacter(char), hint }), from);
  }
  if (kind === 'badNumber') {
    return c.fail(makeDiagnostic('invalid-number', at, { text: shortened(c.tokenText, 40) }), from);
  }
  const form =
    formsAnywhere.get(kind) ?? (position === 'operator' ? formsAfterOperand : formsAsOperand).get(kind);
  if (!form) return undefined;
  return c.fail(makeDiagnostic('form-not-allowed', extentOfForm(c, kind, at), { ...form }), from);
}

/** The tokens a rejected form spans: a bracket with its contents, a dot with the name after it, else one token. */
function extentOfForm(c: Cursor, kind: CursorKind, at: TextRange): TextRange {
  if (kind === '[') return range(at.start, c.consumeBalanced('[', ']'));
  if (kind === '{') return range(at.start, c.consumeBalanced('{', '}'));
  if (kind === '.') {
    c.advance();
    if (c.kind() === 'ident' && c.tokenRange.start === at.end) c.advance();
    return range(at.start, c.prevEnd);
  }
  return at;
}
