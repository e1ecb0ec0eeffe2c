/** Code lens: one line above each kernel with its norm, leading eigenvalue and property marks; click for all figures. */
import type { CodeLens, CodeLensParams } from 'vscode-languageserver/node';
import { kernelLensTitle } from '@kernwright/core';
import { documentOf, guard, type ServerContext } from '../context';
import * as toLsp from '../toLsp';

export const showFiguresCommand = 'kernwright.showFigures';

export function registerCodeLens(ctx: ServerContext): void {
  ctx.connection.onCodeLens(guard(ctx, 'code lens', [] as CodeLens[], (params: CodeLensParams) => {
    const st = documentOf(ctx, params);
    if (!st || !ctx.settings().codeLens.enabled) return [];
    const state = st.numericsState();
    return st.kernels().map((k) => {
      const title = k.spectrum ? kernelLensTitle(k)
        : state === 'pending' ? 'Kernwright: analysing…'
          : state === 'off' ? 'Kernwright: numerical analysis off'
            : 'Kernwright: no spectrum (see the diagnostics)';
      return toLsp.codeLens(st.index, { start: k.range.start, end: k.nameRange.end }, title, showFiguresCommand, [st.uri, k.name]);
    });
  }));
}
