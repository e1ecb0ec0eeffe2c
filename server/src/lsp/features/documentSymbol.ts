/** The outline: domain, constants, helpers, kernels with their claims. */
import type { DocumentSymbol, DocumentSymbolParams } from 'vscode-languageserver/node';
import { outline } from '@kernwright/core';
import { documentOf, guard, type ServerContext } from '../context';
import * as toLsp from '../toLsp';

export function registerDocumentSymbols(ctx: ServerContext): void {
  ctx.connection.onDocumentSymbol(guard(ctx, 'document symbols', [] as DocumentSymbol[], (params: DocumentSymbolParams) => {
    const st = documentOf(ctx, params);
    return st ? outline(st.quick.source).map((item) => toLsp.documentSymbol(st.index, item)) : [];
  }));
}
