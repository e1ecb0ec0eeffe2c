/**
 * The one place where core data (offsets, plain objects) becomes LSP types (lines and characters, protocol enums).
 * Small functions, one per shape; nothing else in the server builds protocol objects from core data by hand.
 */
import {
  CodeAction,
  CodeActionKind,
  CompletionItemKind,
  DocumentHighlightKind,
  DiagnosticSeverity,
  DiagnosticTag,
  DocumentSymbol,
  FoldingRangeKind,
  InsertTextFormat,
  MarkupKind,
  SymbolKind,
  type CodeLens,
  type CompletionItem,
  type Diagnostic as LspDiagnostic,
  type DocumentHighlight,
  type FoldingRange,
  type Hover,
  type Location,
  type Range,
  type SignatureHelp,
  type TextEdit as LspTextEdit,
  type WorkspaceEdit,
} from 'vscode-languageserver/node';
import type {
  CompletionCandidate,
  CompletionKind,
  Diagnostic,
  Fix,
  FoldingRegion,
  HoverResult,
  LineIndex,
  OutlineItem,
  OutlineKind,
  RenameTarget,
  SemanticClass,
  Severity,
  SignatureInfo,
  TextEdit,
  TextRange,
} from '@kernwright/core';

export function range(index: LineIndex, r: TextRange): Range {
  return index.toLineColumn(r);
}

export function offset(index: LineIndex, position: { line: number; character: number }): number {
  return index.offset(position);
}

const severities: Readonly<Record<Severity, DiagnosticSeverity>> = {
  error: DiagnosticSeverity.Error,
  warning: DiagnosticSeverity.Warning,
  info: DiagnosticSeverity.Information,
  hint: DiagnosticSeverity.Hint,
};

export function diagnostic(index: LineIndex, uri: string, d: Diagnostic): LspDiagnostic {
  const out: LspDiagnostic = {
    range: range(index, d.range),
    severity: severities[d.severity],
    code: d.code,
    source: 'kernwright',
    message: d.message,
  };
  if (d.tags?.includes('unnecessary')) out.tags = [DiagnosticTag.Unnecessary];
  if (d.related && d.related.length > 0) {
    out.relatedInformation = d.related.map((r) => ({ location: { uri, range: range(index, r.range) }, message: r.message }));
  }
  return out;
}

export function textEdit(index: LineIndex, e: TextEdit): LspTextEdit {
  return { range: range(index, e.range), newText: e.newText };
}

export function workspaceEdit(index: LineIndex, uri: string, edits: readonly TextEdit[], version?: number): WorkspaceEdit {
  const lsp = edits.map((e) => textEdit(index, e));
  if (version === undefined) return { changes: { [uri]: lsp } };
  return { documentChanges: [{ textDocument: { uri, version }, edits: lsp }] };
}

export function codeAction(index: LineIndex, uri: string, fix: Fix, diagnostic: LspDiagnostic): CodeAction {
  const action = CodeAction.create(fix.title, workspaceEdit(index, uri, fix.edits), CodeActionKind.QuickFix);
  action.diagnostics = [diagnostic];
  if (fix.preferred) action.isPreferred = true;
  return action;
}

export function hover(index: LineIndex, h: HoverResult): Hover {
  return { contents: { kind: MarkupKind.Markdown, value: h.markdown }, range: range(index, h.range) };
}

const completionKinds: Readonly<Record<CompletionKind, CompletionItemKind>> = {
  keyword: CompletionItemKind.Keyword,
  operator: CompletionItemKind.Operator,
  parameter: CompletionItemKind.Variable,
  constant: CompletionItemKind.Constant,
  helper: CompletionItemKind.Function,
  kernel: CompletionItemKind.Class,
  'builtin-function': CompletionItemKind.Function,
  'builtin-constant': CompletionItemKind.Constant,
  expectation: CompletionItemKind.EnumMember,
};

export function completionItem(c: CompletionCandidate, snippets: boolean): CompletionItem {
  const item: CompletionItem = { label: c.label, kind: completionKinds[c.kind], sortText: `${c.rank}_${c.label}` };
  if (c.detail) item.detail = c.detail;
  if (c.documentation) item.documentation = { kind: MarkupKind.Markdown, value: c.documentation };
  if (c.insertText !== undefined) {
    if (c.snippet && snippets) {
      item.insertText = c.insertText;
      item.insertTextFormat = InsertTextFormat.Snippet;
    } else if (!c.snippet) {
      item.insertText = c.insertText;
    }
  }
  return item;
}

export function signatureHelp(s: SignatureInfo): SignatureHelp {
  return {
    signatures: [{
      label: s.label,
      documentation: { kind: MarkupKind.Markdown, value: s.documentation },
      parameters: s.parameters.map((p) => ({ label: p })),
    }],
    activeSignature: 0,
    activeParameter: s.activeParameter,
  };
}

export function location(index: LineIndex, uri: string, r: TextRange): Location {
  return { uri, range: range(index, r) };
}

/** The declaration first (written), then the uses (read). */
export function highlights(index: LineIndex, ranges: readonly TextRange[]): DocumentHighlight[] {
  return ranges.map((r, k) => ({ range: range(index, r), kind: k === 0 ? DocumentHighlightKind.Write : DocumentHighlightKind.Read }));
}

export function renameTarget(index: LineIndex, t: RenameTarget): { range: Range; placeholder: string } {
  return { range: range(index, t.range), placeholder: t.placeholder };
}

/** A lens over `r` that runs `command` with `args` when clicked. */
export function codeLens(index: LineIndex, r: TextRange, title: string, command: string, args: unknown[]): CodeLens {
  return { range: range(index, r), command: { title, command, arguments: args } };
}

const symbolKinds: Readonly<Record<OutlineKind, SymbolKind>> = {
  domain: SymbolKind.Namespace,
  constant: SymbolKind.Constant,
  helper: SymbolKind.Function,
  kernel: SymbolKind.Class,
  expectation: SymbolKind.Property,
};

export function documentSymbol(index: LineIndex, item: OutlineItem): DocumentSymbol {
  return DocumentSymbol.create(
    item.name,
    item.detail,
    symbolKinds[item.kind],
    range(index, item.range),
    range(index, item.selectionRange),
    item.children.map((c) => documentSymbol(index, c)),
  );
}

export function foldingRange(index: LineIndex, region: FoldingRegion): FoldingRange | null {
  const startLine = index.position(region.start).line;
  const endLine = index.position(region.end).line;
  if (endLine <= startLine) return null;
  return { startLine, endLine, kind: region.kind === 'comment' ? FoldingRangeKind.Comment : FoldingRangeKind.Region };
}

/** The legend of semantic tokens: standard LSP token types and modifiers. */
export const semanticLegend = {
  tokenTypes: ['parameter', 'variable', 'function', 'class', 'enumMember'],
  tokenModifiers: ['declaration', 'readonly', 'defaultLibrary'],
};

const semanticTypes: Readonly<Record<SemanticClass, { type: number; modifiers: number }>> = {
  parameter: { type: 0, modifiers: 0 },
  constant: { type: 1, modifiers: 0b010 },
  helper: { type: 2, modifiers: 0 },
  kernel: { type: 3, modifiers: 0 },
  'builtin-function': { type: 2, modifiers: 0b100 },
  'builtin-constant': { type: 1, modifiers: 0b110 },
  expectation: { type: 4, modifiers: 0 },
};

/** A semantic token as (line, character, length, type, modifiers), ready for a tokens builder. */
export function semanticToken(index: LineIndex, r: TextRange, cls: SemanticClass, declaration: boolean) {
  const p = index.position(r.start);
  const t = semanticTypes[cls];
  return { line: p.line, character: p.character, length: r.end - r.start, type: t.type, modifiers: t.modifiers | (declaration ? 1 : 0) };
}
