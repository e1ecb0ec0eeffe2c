/** Hover: the core's markdown for the name under the cursor (kernel figures, constant values, claims, built-ins). */
import type { HoverParams } from 'vscode-languageserver/node';
import { hoverAt } from '@kernwright/core';
import { documentOf, guard, type ServerContext } from '../context';
import * as toLsp from '../toLsp';

export function registerHover(ctx: ServerContext): void {
  ctx.connection.onHover(guard(ctx, 'hover', null, (params: HoverParams) => {
    const st = documentOf(ctx, params);
    if (!st) return null;
    const h = hoverAt(st.view(), toLsp.offset(st.index, params.position), {
      numerics: st.numericsState(),
      eigenvalues: Math.min(4, ctx.settings().numerics.eigenvalueCount),
    });
    return h ? toLsp.hover(st.index, h) : null;
  }));
}
