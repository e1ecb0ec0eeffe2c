/** Formatting to the canonical layout; a file with syntax errors is left as it is. */
import type { DocumentFormattingParams, TextEdit } from 'vscode-languageserver/node';
import { formatEdits } from '@kernwright/core';
import { documentOf, guard, type ServerContext } from '../context';
import * as toLsp from '../toLsp';

export function registerFormatting(ctx: ServerContext): void {
  ctx.connection.onDocumentFormatting(guard(ctx, 'formatting', [] as TextEdit[], (params: DocumentFormattingParams) => {
    const st = documentOf(ctx, params);
    if (!st) return [];
    return (formatEdits(st.quick.source) ?? []).map((e) => toLsp.textEdit(st.index, e));
  }));
}
