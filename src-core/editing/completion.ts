/**
 * Completion candidates as plain data: declaration keywords at the start of a line, claim names after `expect`,
 * and inside expressions the parameters in scope, the file's constants, helpers and kernels, the built-in
 * functions (with their signatures) and constants, and the word operators.
 */
import type { SourceFile } from '../syntax/ast';
import type { FileModel } from '../semantics/model';
import { builtinConstants, builtinFunctions } from '../semantics/builtins';
import { expectationInfo } from '../semantics/expectations';
import { printExpr } from '../syntax/printer';
import { formatComplex } from '../semantics/values';
import { declarationAt } from './nodeAt';

export type CompletionKind =
  | 'keyword' | 'operator' | 'parameter' | 'constant' | 'helper' | 'kernel'
  | 'builtin-function' | 'builtin-constant' | 'expectation';

export interface CompletionCandidate {
  readonly label: string;
  readonly kind: CompletionKind;
  /** One line shown next to the label (a signature, a value). */
  readonly detail?: string;
  /** Markdown. */
  readonly documentation?: string;
  /** Text to insert, in snippet syntax (`$1`, `${1:t}`, `$0`) when `snippet` is true. */
  readonly insertText?: string;
  readonly snippet?: boolean;
  /** Lower sorts first. */
  readonly rank: number;
}

export type CompletionContext = 'declaration' | 'kernel-domain' | 'expectation' | 'expression' | 'none';

const declarationSnippets: readonly CompletionCandidate[] = [
  { label: 'kernel', kind: 'keyword', detail: 'kernel NAME(t, s) = expr', insertText: 'kernel ${1:name}(${2:t}, ${3:s}) = $0', snippet: true, rank: 0 },
  { label: 'const', kind: 'keyword', detail: 'const NAME = expr', insertText: 'const ${1:name} = $0', snippet: true, rank: 0 },
  { label: 'fn', kind: 'keyword', detail: 'fn NAME(x) = expr', insertText: 'fn ${1:name}(${2:x}) = $0', snippet: true, rank: 0 },
  { label: 'domain', kind: 'keyword', detail: 'domain [a, b]', insertText: 'domain [${1:0}, ${2:1}]$0', snippet: true, rank: 0 },
  { label: 'expect', kind: 'keyword', detail: 'expect claim, ...', insertText: 'expect ', rank: 0 },
];

/** The text of the line of `offset` up to `offset`. */
function linePrefix(text: string, offset: number): string {
  let start = offset;
  while (start > 0 && text[start - 1] !== '\n' && text[start - 1] !== '\r') start--;
  return text.slice(start, offset);
}

/** Which kind of completion fits at `offset`. */
export function completionContext(text: string, offset: number): CompletionContext {
  const prefix = linePrefix(text, offset);
  if (prefix.includes('#')) return 'none';
  if (/^[\p{L}_]*$/u.test(prefix)) return 'declaration';
  // After `expect` (at column 0 or indented), in the name part of an item: at its start or in its first word.
  const clause = /^\s*expect\b(.*)$/u.exec(prefix);
  if (clause) {
    const lastItem = clause[1].split(',').pop() ?? '';
    if (/^\s*[\p{L}_-]*$/u.test(lastItem) && (clause[1].length === 0 || /^\s/u.test(clause[1]) || clause[1].includes(','))) {
      return 'expectation';
    }
    return 'expression';
  }
  if (/^\s*$/u.test(prefix)) return 'expression';
  // Inside a declaration's header: after `kernel`/`fn`/`const` and before the name is complete, nothing to offer.
  if (/^(kernel|fn|const)\s+[\p{L}\p{M}\p{Nd}_]*$/u.test(prefix)) return 'none';
  // Between a kernel's parameters and its `=`: the `on [a, b]` of an own domain.
  if (/^kernel\s+[\p{L}_][\p{L}\p{M}\p{Nd}_]*\s*\([^)]*\)\s*[\p{L}]*$/u.test(prefix)) return 'kernel-domain';
  // Parameter lists are new names.
  if (/^(kernel|fn)\s+[\p{L}\p{M}\p{Nd}_]+\s*\([^)=]*$/u.test(prefix)) return 'none';
  if (/[\d.]$/u.test(prefix) && !/[\p{L}_][\p{L}\p{M}\p{Nd}_]*$/u.test(prefix)) return 'none';
  return 'expression';
}

function expressionCandidates(source: SourceFile, model: FileModel, offset: number, prefix: string): CompletionCandidate[] {
  const out: CompletionCandidate[] = [];
  let decl = declarationAt(source, offset);
  if (!decl) {
    // Typing at the end of a declaration: the last declaration that starts before the offset.
    for (const d of source.declarations) if (d.range.start <= offset) decl = d;
  }
  if (decl && (decl.kind === 'fn' || decl.kind === 'kernel')) {
    const inBody = offset > decl.body.range.start || offset >= decl.range.end || /=\s*[^=]*$/u.test(prefix);
    if (inBody) {
      decl.params.forEach((p, k) => {
        if (p.text === '') return;
        const role = decl.kind === 'kernel' ? (k === 0 ? 'output point' : k === 1 ? 'integration point' : 'parameter') : 'parameter';
        out.push({ label: p.text, kind: 'parameter', detail: `${role} of ${decl.name.text}`, rank: 0 });
      });
    }
  }
  for (const sym of model.symbols.values()) {
    if (decl && decl.kind !== 'domain' && sym.nameRange.start === decl.name.range.start) continue; // no self-reference
    if (sym.kind === 'const') {
      out.push({
        label: sym.name, kind: 'constant', rank: 1,
        detail: sym.value ? `= ${formatComplex(sym.value)}` : `= ${printExpr(sym.decl.value)}`,
        ...(sym.decl.note ? { documentation: sym.decl.note.trim() } : {}),
      });
    } else if (sym.kind === 'fn') {
      const params = sym.params.map((p, k) => `\${${k + 1}:${p}}`).join(', ');
      out.push({
        label: sym.name, kind: 'helper', rank: 1, detail: `${sym.name}(${sym.params.join(', ')})`,
        documentation: '```kernwright\n' + `fn ${sym.name}(${sym.params.join(', ')}) = ${printExpr(sym.decl.body)}` + '\n```',
        insertText: `${sym.name}(${params})`, snippet: true,
      });
    } else {
      out.push({ label: sym.name, kind: 'kernel', rank: 2, detail: `kernel ${sym.name}(t, s)`, insertText: `${sym.name}(\${1:t}, \${2:s})`, snippet: true });
    }
  }
  for (const b of Object.values(builtinFunctions)) {
    const args = b.maxArgs === 1 ? '${1:x}' : '${1:x}, ${2:y}';
    out.push({ label: b.name, kind: 'builtin-function', rank: 3, detail: b.signature, documentation: b.description, insertText: `${b.name}(${args})`, snippet: true });
  }
  for (const c of Object.values(builtinConstants)) {
    out.push({ label: c.name, kind: 'builtin-constant', rank: 3, detail: formatComplex({ re: c.re, im: c.im }), documentation: c.description });
  }
  for (const op of ['and', 'or', 'not']) out.push({ label: op, kind: 'operator', rank: 4 });
  return out;
}

function expectationCandidates(): CompletionCandidate[] {
  return Object.values(expectationInfo).map((info) => {
    const insertText = info.form === 'bound' ? `${info.name} <= \${1:1}` : info.form === 'count' ? `${info.name} = \${1:1}`
      : info.form === 'point' ? `${info.name} \${1:0.5}` : info.name;
    return {
      label: info.name, kind: 'expectation' as const, rank: 0, documentation: info.description,
      detail: info.form === 'flag' ? 'property' : info.form === 'bound' ? 'norm < x, norm <= x' : info.form === 'count' ? 'rank = n, rank <= n' : 'resolvent μ',
      insertText, snippet: info.form !== 'flag',
    };
  });
}

/** The completion candidates at `offset`. */
export function completionsAt(source: SourceFile, model: FileModel, offset: number): CompletionCandidate[] {
  const text = source.text;
  const o = Math.max(0, Math.min(offset, text.length));
  const context = completionContext(text, o);
  if (context === 'declaration') return [...declarationSnippets];
  if (context === 'expectation') return expectationCandidates();
  if (context === 'kernel-domain') {
    return [{ label: 'on', kind: 'keyword', rank: 0, detail: 'on [a, b]: the kernel’s own domain', insertText: 'on [${1:0}, ${2:1}] = $0', snippet: true }];
  }
  if (context === 'expression') return expressionCandidates(source, model, o, linePrefix(text, o));
  return [];
}
