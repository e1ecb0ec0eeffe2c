/** Signature help inside calls of built-in functions, helpers and kernels. */
import type { SignatureHelpParams } from 'vscode-languageserver/node';
import { signatureAt } from '@kernwright/core';
import { documentOf, guard, type ServerContext } from '../context';
import * as toLsp from '../toLsp';

export const signatureTriggers = ['(', ','];

export function registerSignatureHelp(ctx: ServerContext): void {
  ctx.connection.onSignatureHelp(guard(ctx, 'signature help', null, (params: SignatureHelpParams) => {
    const st = documentOf(ctx, params);
    if (!st) return null;
    const s = signatureAt(st.quick.source, st.quick.model, toLsp.offset(st.index, params.position));
    return s ? toLsp.signatureHelp(s) : null;
  }));
}
