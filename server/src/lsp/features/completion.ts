/** Completion: keywords, claim names after `expect`, and names in expressions, from the core's candidates. */
import type { CompletionItem, CompletionParams } from 'vscode-languageserver/node';
import { completionsAt } from '@kernwright/core';
import { documentOf, guard, type ServerContext } from '../context';
import * as toLsp from '../toLsp';

export function registerCompletion(ctx: ServerContext): void {
  ctx.connection.onCompletion(guard(ctx, 'completion', [] as CompletionItem[], (params: CompletionParams) => {
    const st = documentOf(ctx, params);
    if (!st) return [];
    const offset = toLsp.offset(st.index, params.position);
    return completionsAt(st.quick.source, st.quick.model, offset).map((c) => toLsp.completionItem(c, ctx.client.snippets));
  }));
}
