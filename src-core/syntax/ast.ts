/**
 * The syntax tree of a kernel file (`.kw`). Every node carries its source range; a piece that is missing in the text
 * becomes an `ErrorExpr` (or an empty name) so that later layers always get a complete tree.
 */
import type { TextRange } from './textRange';
import type { Diagnostic } from '../diagnostics/types';

// ---------- expressions ----------

export type BinaryOp = '+' | '-' | '*' | '/' | '^' | '<' | '<=' | '>' | '>=' | '==' | '!=' | 'and' | 'or';
export type UnaryOp = '-' | '+' | 'not';

export interface NumberExpr {
  readonly kind: 'number';
  readonly range: TextRange;
  readonly value: number;
  /** The literal as written. */
  readonly raw: string;
}

/** A name: a variable, a constant, a built-in constant (`pi`, `e`, `i`) or a helper used as a value. */
export interface IdentExpr {
  readonly kind: 'ident';
  readonly range: TextRange;
  readonly name: string;
}

export interface UnaryExpr {
  readonly kind: 'unary';
  readonly range: TextRange;
  readonly op: UnaryOp;
  readonly opRange: TextRange;
  readonly operand: Expr;
}

export interface BinaryExpr {
  readonly kind: 'binary';
  readonly range: TextRange;
  readonly op: BinaryOp;
  readonly opRange: TextRange;
  readonly left: Expr;
  readonly right: Expr;
}

export interface CallExpr {
  readonly kind: 'call';
  readonly range: TextRange;
  readonly callee: string;
  readonly calleeRange: TextRange;
  readonly args: readonly Expr[];
}

/** `test ? then : otherwise` */
export interface CondExpr {
  readonly kind: 'cond';
  readonly range: TextRange;
  readonly test: Expr;
  readonly then: Expr;
  readonly otherwise: Expr;
}

/** Parenthesised expression, kept so that ranges and formatting stay faithful. */
export interface ParenExpr {
  readonly kind: 'paren';
  readonly range: TextRange;
  readonly inner: Expr;
}

/** A missing or unparseable piece; a diagnostic has been reported for it. */
export interface ErrorExpr {
  readonly kind: 'error';
  readonly range: TextRange;
}

export type Expr = NumberExpr | IdentExpr | UnaryExpr | BinaryExpr | CallExpr | CondExpr | ParenExpr | ErrorExpr;

// ---------- declarations ----------

export interface Name {
  /** Empty when the name is missing in the text. */
  readonly text: string;
  readonly range: TextRange;
}

/** `[lower, upper]` */
export interface Interval {
  readonly range: TextRange;
  readonly lower: Expr;
  readonly upper: Expr;
}

/** `domain [a, b]`: the default domain of the kernels that follow and precede it. */
export interface DomainDecl {
  readonly kind: 'domain';
  readonly range: TextRange;
  readonly keywordRange: TextRange;
  readonly interval: Interval;
}

/** `const name = expr   # unit note` */
export interface ConstDecl {
  readonly kind: 'const';
  readonly range: TextRange;
  readonly keywordRange: TextRange;
  readonly name: Name;
  readonly value: Expr;
  /** The text of a trailing `#` comment on the declaration's last line (a unit or a note), if any. */
  readonly note?: string;
}

/** `fn name(x, y) = expr` */
export interface FnDecl {
  readonly kind: 'fn';
  readonly range: TextRange;
  readonly keywordRange: TextRange;
  readonly name: Name;
  readonly params: readonly Name[];
  readonly body: Expr;
}

export type ExpectationName =
  | 'hermitian'
  | 'positive'
  | 'continuous'
  | 'bounded'
  | 'hilbert-schmidt'
  | 'norm'
  | 'rank'
  | 'resolvent';

export type ExpectationOp = '<' | '<=' | '=';

/** One claim in an `expect` list, e.g. `hermitian`, `norm <= 2`, `rank = 3`, `resolvent 0.5`. */
export interface Expectation {
  readonly range: TextRange;
  /** As written; may be an unknown name (reported by the semantic layer). */
  readonly name: string;
  readonly nameRange: TextRange;
  readonly op?: ExpectationOp;
  readonly opRange?: TextRange;
  readonly value?: Expr;
}

/** `expect a, b, norm <= 2`: a list of claims about the kernel declared just before. */
export interface ExpectClause {
  readonly range: TextRange;
  readonly keywordRange: TextRange;
  readonly items: readonly Expectation[];
}

/** `kernel name(t, s) [on [a, b]] = expr`, followed by zero or more `expect` clauses. */
export interface KernelDecl {
  readonly kind: 'kernel';
  readonly range: TextRange;
  readonly keywordRange: TextRange;
  readonly name: Name;
  readonly params: readonly Name[];
  readonly domain?: Interval;
  readonly body: Expr;
  readonly expects: readonly ExpectClause[];
}

export type Declaration = DomainDecl | ConstDecl | FnDecl | KernelDecl;

export interface Comment {
  readonly range: TextRange;
  /** Text after the `#`. */
  readonly text: string;
}

export interface SourceFile {
  readonly text: string;
  readonly declarations: readonly Declaration[];
  readonly comments: readonly Comment[];
  /** Syntax diagnostics, in source order. */
  readonly diagnostics: readonly Diagnostic[];
}
