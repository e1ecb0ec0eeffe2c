/** Folding: multi-line declarations and comment blocks. */
import type { FoldingRange, FoldingRangeParams } from 'vscode-languageserver/node';
import { foldingRegions } from '@kernwright/core';
import { documentOf, guard, type ServerContext } from '../context';
import * as toLsp from '../toLsp';

export function registerFolding(ctx: ServerContext): void {
  ctx.connection.onFoldingRanges(guard(ctx, 'folding', [] as FoldingRange[], (params: FoldingRangeParams) => {
    const st = documentOf(ctx, params);
    if (!st) return [];
    return foldingRegions(st.quick.source).map((r) => toLsp.foldingRange(st.index, r)).filter((r): r is FoldingRange => r !== null);
  }));
}
