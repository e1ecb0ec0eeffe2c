/**
 * The “declare it” fix: appends claims to a kernel's expect clause, or, when the kernel has none, adds an indented
 * `expect` line right after the kernel's declaration (after a trailing comment on its last line, with the file's
 * own line ending).
 */
import type { KernelDecl } from '../syntax/ast';
import type { Fix } from '../diagnostics/types';

export const declarePropertyKind = 'declare-property';

function lineEnding(text: string): string {
  return text.includes('\r\n') ? '\r\n' : text.includes('\r') && !text.includes('\n') ? '\r' : '\n';
}

/** End of the line that holds `offset` (before its line break). */
function endOfLine(text: string, offset: number): number {
  let k = offset;
  while (k < text.length && text[k] !== '\n' && text[k] !== '\r') k++;
  return k;
}

export function declareClaimsFix(decl: KernelDecl, text: string, claims: readonly string[], preferred = true): Fix {
  const list = claims.join(', ');
  const title = `Declare ${claims.map((c) => `“${c}”`).join(', ')}`;
  const clause = decl.expects[decl.expects.length - 1];
  if (clause) {
    const last = clause.items[clause.items.length - 1];
    const at = last ? last.range.end : clause.keywordRange.end;
    const newText = last ? `, ${list}` : ` ${list}`;
    return { kind: declarePropertyKind, title, preferred, edits: [{ range: { start: at, end: at }, newText }] };
  }
  const at = endOfLine(text, decl.range.end);
  return {
    kind: declarePropertyKind, title, preferred,
    edits: [{ range: { start: at, end: at }, newText: `${lineEnding(text)}  expect ${list}` }],
  };
}
