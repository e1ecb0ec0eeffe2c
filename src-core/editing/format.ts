/**
 * The canonical layout of a kernel file:
 *
 * - one declaration per line, keywords at column 0, expressions printed by `printExpr` (single spaces around
 *   binary operators, the fewest parentheses), `expect` clauses on their own lines indented by two spaces;
 * - a line longer than `maxWidth` is broken before a `+` or `-` of the outermost sum that has one, each
 *   continuation line indented by four spaces (an indented line continues the declaration, so the meaning stays);
 * - every comment is kept: full-line comments where they were (at the indentation of what follows them), the
 *   comment at the end of a declaration's or a clause's last line stays there, and comments from inside a
 *   declaration that is joined onto one line move just above it; trailing comments of neighbouring lines are
 *   aligned;
 * - runs of blank lines become one blank line; no blank lines at the start; exactly one line end at the end; the
 *   file's line ends (\n or \r\n) and a byte-order mark are kept.
 *
 * A file with syntax errors is not formatted (null): its tree may be incomplete, and text would be lost.
 * Formatting is idempotent: formatting a formatted file changes nothing.
 */
import type { Comment, Declaration, Expectation, SourceFile } from '../syntax/ast';
import { LineIndex, type TextRange } from '../syntax/textRange';
import { printExpr } from '../syntax/printer';
import type { TextEdit } from '../diagnostics/types';

export interface FormatOptions {
  /** Lines longer than this are broken inside sums (default 100). */
  readonly maxWidth?: number;
}

const expectIndent = '  ';
const continuationIndent = '    ';
/** Trailing comments of lines up to this long are aligned with their neighbours. */
const alignLimit = 60;

interface OutputLine {
  readonly code: string;
  readonly comment?: string;
  readonly blankBefore?: boolean;
}

interface Piece {
  readonly end: number;
  readonly indent: string;
  readonly lines: string[];
  readonly leading: string[];
  trailing?: string;
}

function printItem(item: Expectation): string {
  const op = item.op ? ` ${item.op}` : '';
  const value = item.value ? ` ${printExpr(item.value)}` : '';
  return `${item.name}${op}${value}`;
}

/** Splits `prefix + expr` into lines no longer than `maxWidth` where a sum allows it. */
export function breakLine(prefix: string, expr: string, maxWidth: number): string[] {
  const whole = prefix + expr;
  if (whole.length <= maxWidth) return [whole];
  // Candidate break points: before ` + ` / ` - ` at the shallowest bracket depth that has any.
  const byDepth = new Map<number, number[]>();
  let depth = 0;
  for (let i = 0; i < expr.length; i++) {
    const ch = expr[i];
    if (ch === '(' || ch === '[') depth++;
    else if (ch === ')' || ch === ']') depth--;
    else if (ch === ' ' && (expr[i + 1] === '+' || expr[i + 1] === '-') && expr[i + 2] === ' ') {
      const list = byDepth.get(depth) ?? [];
      list.push(i);
      byDepth.set(depth, list);
    }
  }
  if (byDepth.size === 0) return [whole];
  const cuts = byDepth.get(Math.min(...byDepth.keys()))!;
  const segments: string[] = [];
  let from = 0;
  for (const c of cuts) {
    segments.push(expr.slice(from, c));
    from = c + 1; // drop the space before the operator
  }
  segments.push(expr.slice(from));
  const lines: string[] = [];
  let current = prefix + segments[0];
  for (const seg of segments.slice(1)) {
    if (current.length + 1 + seg.length > maxWidth) {
      lines.push(current);
      current = continuationIndent + seg;
    } else current += ` ${seg}`;
  }
  lines.push(current);
  return lines;
}

function declarationPieces(decl: Declaration, maxWidth: number): Piece[] {
  const p = (e: Parameters<typeof printExpr>[0]) => printExpr(e);
  const piece = (end: number, indent: string, lines: string[]): Piece => ({ end, indent, lines, leading: [] });
  switch (decl.kind) {
    case 'domain':
      return [piece(decl.range.end, '', [`domain [${p(decl.interval.lower)}, ${p(decl.interval.upper)}]`])];
    case 'const':
      return [piece(decl.range.end, '', breakLine(`const ${decl.name.text} = `, p(decl.value), maxWidth))];
    case 'fn': {
      const head = `fn ${decl.name.text}(${decl.params.map((x) => x.text).join(', ')}) = `;
      return [piece(decl.range.end, '', breakLine(head, p(decl.body), maxWidth))];
    }
    case 'kernel': {
      const on = decl.domain ? ` on [${p(decl.domain.lower)}, ${p(decl.domain.upper)}]` : '';
      const head = `kernel ${decl.name.text}(${decl.params.map((x) => x.text).join(', ')})${on} = `;
      const pieces = [piece(decl.body.range.end, '', breakLine(head, p(decl.body), maxWidth))];
      for (const clause of decl.expects) {
        pieces.push(piece(clause.range.end, expectIndent, [`${expectIndent}expect ${clause.items.map(printItem).join(', ')}`]));
      }
      return pieces;
    }
  }
}

function commentText(c: Comment): string {
  return `#${c.text.replace(/\s+$/u, '')}`;
}

/** The canonical text of a parsed file, or null when it has syntax errors. */
export function formatSource(source: SourceFile, options: FormatOptions = {}): string | null {
  if (source.diagnostics.some((d) => d.severity === 'error')) return null;
  const maxWidth = options.maxWidth ?? 100;
  const text = source.text;
  const eol = text.includes('\r\n') ? '\r\n' : '\n';
  const bom = text.charCodeAt(0) === 0xfeff ? '\ufeff' : '';
  const index = new LineIndex(text);
  const line = (offset: number) => index.position(offset).line;
  const isFullLine = (c: Comment) => text.slice(index.lineStart(line(c.range.start)), c.range.start).trim() === '';
  const blankLines = new Set<number>();
  for (let l = 0; l < index.lineCount; l++) {
    const start = index.lineStart(l);
    const end = l + 1 < index.lineCount ? index.lineStart(l + 1) : text.length;
    if (text.slice(start, end).replace(/^\ufeff/u, '').trim() === '') blankLines.add(l);
  }

  const out: OutputLine[] = [];
  let lastLine = -1;
  const blankSince = (firstLine: number) => {
    if (lastLine < 0) return false;
    for (let l = lastLine + 1; l < firstLine; l++) if (blankLines.has(l)) return true;
    return false;
  };
  const comments = [...source.comments].sort((a, b) => a.range.start - b.range.start);
  let ci = 0;

  for (const decl of source.declarations) {
    const first = line(decl.range.start);
    const last = line(decl.range.end);
    // Full-line comments before this declaration.
    while (ci < comments.length && line(comments[ci].range.start) < first) {
      const c = comments[ci++];
      const l = line(c.range.start);
      out.push({ code: commentText(c), blankBefore: blankSince(l) });
      lastLine = l;
    }
    const pieces = declarationPieces(decl, maxWidth);
    while (ci < comments.length && line(comments[ci].range.start) <= last) {
      const c = comments[ci++];
      const l = line(c.range.start);
      const target = pieces.find((p) => line(p.end) >= l) ?? pieces[pieces.length - 1];
      if (!isFullLine(c) && line(target.end) === l && c.range.start >= target.end) target.trailing = commentText(c);
      else target.leading.push(commentText(c));
    }
    let blank = blankSince(first);
    for (const p of pieces) {
      for (const lead of p.leading) {
        out.push({ code: p.indent + lead, blankBefore: blank });
        blank = false;
      }
      p.lines.forEach((code, k) => {
        const trailing = k === p.lines.length - 1 ? p.trailing : undefined;
        out.push({ code, ...(trailing ? { comment: trailing } : {}), blankBefore: blank });
        blank = false;
      });
    }
    lastLine = last;
  }
  while (ci < comments.length) {
    const c = comments[ci++];
    const l = line(c.range.start);
    out.push({ code: commentText(c), blankBefore: blankSince(l) });
    lastLine = l;
  }

  // Align trailing comments of neighbouring short lines.
  const rendered: string[] = [];
  for (let i = 0; i < out.length; ) {
    let j = i;
    const aligned = (o: OutputLine) => o.comment !== undefined && o.code.length <= alignLimit;
    if (aligned(out[i])) {
      while (j + 1 < out.length && aligned(out[j + 1]) && !out[j + 1].blankBefore) j++;
    }
    const column = Math.max(...out.slice(i, j + 1).map((o) => o.code.length)) + 2;
    for (let k = i; k <= j; k++) {
      const o = out[k];
      if (o.blankBefore && rendered.length > 0) rendered.push('');
      if (o.comment === undefined) rendered.push(o.code);
      else if (aligned(o)) rendered.push(o.code.padEnd(column) + o.comment);
      else rendered.push(`${o.code}  ${o.comment}`);
    }
    i = j + 1;
  }
  return rendered.length === 0 ? bom : bom + rendered.join(eol) + eol;
}

/** One edit that turns `before` into `after` (the changed middle), or none when they are equal. */
export function minimalEdit(before: string, after: string): TextEdit[] {
  if (before === after) return [];
  let start = 0;
  const limit = Math.min(before.length, after.length);
  while (start < limit && before.charCodeAt(start) === after.charCodeAt(start)) start++;
  let endBefore = before.length;
  let endAfter = after.length;
  while (endBefore > start && endAfter > start && before.charCodeAt(endBefore - 1) === after.charCodeAt(endAfter - 1)) {
    endBefore--;
    endAfter--;
  }
  // Never split a surrogate pair or a \r\n.
  while (start > 0 && (isLowSurrogate(before.charCodeAt(start)) || (before[start - 1] === '\r' && before[start] === '\n'))) start--;
  const range: TextRange = { start, end: endBefore };
  return [{ range, newText: after.slice(start, endAfter) }];
}

function isLowSurrogate(c: number): boolean {
  return c >= 0xdc00 && c <= 0xdfff;
}

/** The edits that format `source`, or null when it cannot be formatted (syntax errors). */
export function formatEdits(source: SourceFile, options: FormatOptions = {}): TextEdit[] | null {
  const formatted = formatSource(source, options);
  return formatted === null ? null : minimalEdit(source.text, formatted);
}
