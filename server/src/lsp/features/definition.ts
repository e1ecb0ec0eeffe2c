/** Go to definition of constants, helpers, kernels and parameters. */
import type { DefinitionParams } from 'vscode-languageserver/node';
import { definitionAt } from '@kernwright/core';
import { documentOf, guard, type ServerContext } from '../context';
import * as toLsp from '../toLsp';

export function registerDefinition(ctx: ServerContext): void {
  ctx.connection.onDefinition(guard(ctx, 'definition', null, (params: DefinitionParams) => {
    const st = documentOf(ctx, params);
    if (!st) return null;
    const r = definitionAt(st.quick.source, st.quick.model, toLsp.offset(st.index, params.position));
    return r ? toLsp.location(st.index, st.uri, r) : null;
  }));
}
