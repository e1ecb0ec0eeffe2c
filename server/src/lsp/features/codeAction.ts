/** Quick fixes: the text edits the core attaches to its diagnostics (symmetrize, swap the domain, did you mean, ...). */
import { CodeActionKind, type CodeAction, type CodeActionParams } from 'vscode-languageserver/node';
import { documentOf, guard, type ServerContext } from '../context';
import * as toLsp from '../toLsp';

export function registerCodeActions(ctx: ServerContext): void {
  ctx.connection.onCodeAction(guard(ctx, 'code action', [] as CodeAction[], (params: CodeActionParams) => {
    const st = documentOf(ctx, params);
    const only = params.context?.only;
    if (!st || (only && !only.some((k) => CodeActionKind.QuickFix.startsWith(k)))) return [];
    const start = toLsp.offset(st.index, params.range.start);
    const end = toLsp.offset(st.index, params.range.end);
    const actions: CodeAction[] = [];
    for (const d of st.diagnostics) {
      if (!d.fixes || d.range.start > end || d.range.end < start) continue;
      const lsp = toLsp.diagnostic(st.index, st.uri, d);
      for (const fix of d.fixes) actions.push(toLsp.codeAction(st.index, st.uri, fix, lsp));
    }
    return actions;
  }));
}
