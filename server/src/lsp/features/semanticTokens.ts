/** Semantic tokens: parameters, constants, helpers, kernels and built-ins told apart, which the grammar cannot do. */
import { SemanticTokensBuilder, type SemanticTokensParams } from 'vscode-languageserver/node';
import { semanticTokens } from '@kernwright/core';
import { documentOf, guard, type ServerContext } from '../context';
import * as toLsp from '../toLsp';

export function registerSemanticTokens(ctx: ServerContext): void {
  ctx.connection.languages.semanticTokens.on(guard(ctx, 'semantic tokens', { data: [] as number[] }, (params: SemanticTokensParams) => {
    const st = documentOf(ctx, params);
    if (!st) return { data: [] };
    const builder = new SemanticTokensBuilder();
    for (const t of semanticTokens(st.quick.source, st.quick.model)) {
      const s = toLsp.semanticToken(st.index, t.range, t.cls, t.declaration);
      builder.push(s.line, s.character, s.length, s.type, s.modifiers);
    }
    return builder.build();
  }));
}
