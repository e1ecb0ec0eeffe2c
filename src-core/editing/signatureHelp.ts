/**
 * Signature help: which function call the cursor is inside and which argument it is at. Read from the text
 * (backwards from the cursor, skipping comments and balanced brackets) rather than from the tree, so that it works
 * on the half-typed calls that the parser has to recover from.
 */
import type { SourceFile } from '../syntax/ast';
import type { FileModel } from '../semantics/model';
import { builtinFunctions, isBuiltinFunction } from '../semantics/builtins';
import { printExpr } from '../syntax/printer';

export interface SignatureInfo {
  /** e.g. `gaussian(x, width)` */
  readonly label: string;
  /** The parameters' labels, each a substring of `label`. */
  readonly parameters: readonly string[];
  readonly activeParameter: number;
  /** Markdown. */
  readonly documentation: string;
}

/** How far back the search for an open call goes. */
const maxLookBack = 4000;

function isNamePart(ch: string): boolean {
  return /[\p{L}\p{M}\p{Nd}_]/u.test(ch);
}

/** The callee and argument index of the innermost open call at `offset`, from the text alone. */
export function openCallAt(source: SourceFile, offset: number): { callee: string; argument: number } | null {
  const text = source.text;
  const stop = Math.max(0, offset - maxLookBack);
  const comments = source.comments.filter((c) => c.range.end > stop && c.range.start < offset);
  const inComment = (o: number) => comments.find((c) => c.range.start <= o && o < c.range.end);
  let depth = 0;
  let commas = 0;
  for (let o = offset - 1; o >= stop; o--) {
    const comment = inComment(o);
    if (comment) {
      o = comment.range.start;
      continue;
    }
    const ch = text[o];
    if (ch === ')' || ch === ']') depth++;
    else if (ch === '[') {
      if (depth === 0) return null;
      depth--;
    } else if (ch === '(') {
      if (depth > 0) {
        depth--;
        continue;
      }
      let end = o;
      while (end > 0 && /\s/u.test(text[end - 1]) && text[end - 1] !== '\n') end--;
      let start = end;
      while (start > 0 && isNamePart(text[start - 1])) start--;
      if (start === end) return null;
      // `fn name(` and `kernel name(` declare parameters; they are not calls.
      let lineStart = start;
      while (lineStart > 0 && text[lineStart - 1] !== '\n' && text[lineStart - 1] !== '\r') lineStart--;
      if (/^(fn|kernel)\s+$/u.test(text.slice(lineStart, start))) return null;
      return { callee: text.slice(start, end), argument: commas };
    } else if (ch === ',' && depth === 0) commas++;
    else if (ch === '=' && depth === 0 && text[o - 1] !== '<' && text[o - 1] !== '>' && text[o - 1] !== '!' && text[o + 1] !== '=') return null;
    else if ((ch === '\n' || ch === '\r') && o + 1 < text.length && !/[ \t]/u.test(text[o + 1]) && o + 1 < offset) {
      // The line after this break starts at column 0: a new declaration, which no call spans.
      return null;
    }
  }
  return null;
}

function build(name: string, params: readonly string[], argument: number, documentation: string): SignatureInfo {
  return {
    label: `${name}(${params.join(', ')})`,
    parameters: params,
    activeParameter: Math.min(argument, Math.max(0, params.length - 1)),
    documentation,
  };
}

/** The signature of the call around `offset`, or null outside calls. */
export function signatureAt(source: SourceFile, model: FileModel, offset: number): SignatureInfo | null {
  const call = openCallAt(source, offset);
  if (!call) return null;
  const sym = model.symbols.get(call.callee);
  if (sym?.kind === 'fn') {
    return build(sym.name, sym.params, call.argument, '```kernwright\n' + `fn ${sym.name}(${sym.params.join(', ')}) = ${printExpr(sym.decl.body)}` + '\n```');
  }
  if (sym?.kind === 'kernel') {
    const params = sym.decl.params.map((p) => p.text);
    return build(sym.name, params.length === 2 ? params : ['t', 's'], call.argument, `Kernel ${sym.name}: its value K(t, s).`);
  }
  if (isBuiltinFunction(call.callee)) {
    const b = builtinFunctions[call.callee];
    const inner = /\((.*)\)/u.exec(b.signature)?.[1] ?? '';
    let params = inner.split(',').map((p) => p.trim()).filter(Boolean);
    if (b.maxArgs === Infinity) {
      // min(x, y, ...): every argument from the second on is one more of the same.
      params = params.filter((p) => p !== '...');
      const shown = Math.max(params.length, call.argument + 1);
      const names = Array.from({ length: shown }, (_, k) => (k < params.length ? params[k] : `z${k - params.length + 1}`));
      return { ...build(b.name, [...names], call.argument, b.description), label: `${b.name}(${names.join(', ')}, ...)` };
    }
    return build(b.name, params, call.argument, b.description);
  }
  return null;
}
