/** Find references (and document highlights) of constants, helpers, kernels and parameters. */
import type { DocumentHighlightParams, Location, ReferenceParams } from 'vscode-languageserver/node';
import { referencesAt } from '@kernwright/core';
import { documentOf, guard, type ServerContext } from '../context';
import * as toLsp from '../toLsp';

export function registerReferences(ctx: ServerContext): void {
  ctx.connection.onReferences(guard(ctx, 'references', [] as Location[], (params: ReferenceParams) => {
    const st = documentOf(ctx, params);
    if (!st) return [];
    const ranges = referencesAt(st.quick.source, st.quick.model, toLsp.offset(st.index, params.position), params.context?.includeDeclaration ?? true);
    return (ranges ?? []).map((r) => toLsp.location(st.index, st.uri, r));
  }));
  ctx.connection.onDocumentHighlight(guard(ctx, 'highlight', null, (params: DocumentHighlightParams) => {
    const st = documentOf(ctx, params);
    if (!st) return null;
    const ranges = referencesAt(st.quick.source, st.quick.model, toLsp.offset(st.index, params.position), true);
    return ranges ? toLsp.highlights(st.index, ranges) : null;
  }));
}
