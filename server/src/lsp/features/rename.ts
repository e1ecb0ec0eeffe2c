/** Rename of constants, helpers, kernels and parameters, refused with a reason when the new name would clash. */
import { ResponseError, type PrepareRenameParams, type RenameParams } from 'vscode-languageserver/node';
import { renameAt, renameTargetAt } from '@kernwright/core';
import { documentOf, guard, type ServerContext } from '../context';
import * as toLsp from '../toLsp';

export function registerRename(ctx: ServerContext): void {
  ctx.connection.onPrepareRename(guard(ctx, 'prepare rename', null, (params: PrepareRenameParams) => {
    const st = documentOf(ctx, params);
    if (!st) return null;
    const t = renameTargetAt(st.quick.source, st.quick.model, toLsp.offset(st.index, params.position));
    return t ? toLsp.renameTarget(st.index, t) : null;
  }));
  ctx.connection.onRenameRequest(async (params: RenameParams) => {
    const result = await guard(ctx, 'rename', null, (p: RenameParams) => {
      const st = documentOf(ctx, p);
      if (!st || typeof p.newName !== 'string') return null;
      const r = renameAt(st.quick.source, st.quick.model, toLsp.offset(st.index, p.position), p.newName);
      return 'error' in r ? new ResponseError(-32602, r.error) : toLsp.workspaceEdit(st.index, st.uri, r.edits);
    })(params);
    if (result instanceof ResponseError) throw result;
    return result;
  });
}
