/**
 * Kernwright's own requests and commands:
 * - `kernwright/figures` {uri, kernel?} → {text}: the full figures of one kernel (or all) as plain text;
 * - `kernwright/reanalyse` {uri?} → null: recompute every open file from scratch (the kernel cache is cleared);
 * - `kernwright/analysisState` {uri} → {version, numericVersion, pending, state, elapsedMs}: where the analysis of a
 *   file stands (elapsedMs: the worker's time for the latest complete result);
 * - `kernwright/kernelData` {uri, points?} → {uri, version, pending, kernels}: every kernel's report with the samples
 *   its pictures need (the spectrum view in the extension draws them);
 * - `workspace/executeCommand` `kernwright.showFigures` [uri, kernel], for clients other than our VS Code
 *   extension (which shows the figures itself): answers the text and shows it as a message.
 */
import { MessageType, ShowMessageNotification, type ExecuteCommandParams } from 'vscode-languageserver/node';
import { fileKernelPictureData, kernelFiguresText } from '@kernwright/core';
import { guard, type ServerContext } from '../context';
import type { WorkerClient } from '../workerClient';
import { showFiguresCommand } from './codeLens';

export const figuresRequest = 'kernwright/figures';
export const reanalyseRequest = 'kernwright/reanalyse';
export const analysisStateRequest = 'kernwright/analysisState';
export const crashWorkerTestRequest = 'kernwright/test/crashWorker';
export const kernelDataRequest = 'kernwright/kernelData';

function figures(ctx: ServerContext, uri: unknown, kernel: unknown): string | null {
  if (typeof uri !== 'string') return null;
  const st = ctx.analyzer.get(uri);
  if (!st) return null;
  const reports = st.kernels().filter((k) => typeof kernel !== 'string' || k.name === kernel);
  if (reports.length === 0) return null;
  const note = st.numericsState() === 'pending' ? '\n(the analysis of the latest edit is still running)' : '';
  return reports.map(kernelFiguresText).join('\n\n') + note;
}

export function registerCommands(ctx: ServerContext, worker: WorkerClient): void {
  const c = ctx.connection;
  c.onRequest(figuresRequest, guard(ctx, figuresRequest, null, (p: { uri?: unknown; kernel?: unknown } | null) => {
    const text = figures(ctx, p?.uri, p?.kernel);
    return text === null ? null : { text };
  }));
  c.onRequest(reanalyseRequest, guard(ctx, reanalyseRequest, null, () => {
    ctx.analyzer.reanalyseAll(true);
    return null;
  }));
  c.onRequest(kernelDataRequest, guard(ctx, kernelDataRequest, null, (p: { uri?: unknown; points?: unknown } | null) => {
    const st = typeof p?.uri === 'string' ? ctx.analyzer.get(p.uri) : undefined;
    if (!st) return null;
    const points = typeof p?.points === 'number' && Number.isFinite(p.points) ? Math.max(8, Math.min(96, Math.round(p.points))) : 40;
    return { uri: p!.uri, version: st.version, pending: st.pending, kernels: fileKernelPictureData(st.view(), { points }) };
  }));
  c.onRequest(analysisStateRequest, guard(ctx, analysisStateRequest, null, (p: { uri?: unknown } | null) => {
    const st = typeof p?.uri === 'string' ? ctx.analyzer.get(p.uri) : undefined;
    if (!st) return null;
    return { version: st.version, numericVersion: st.numeric?.version ?? null, pending: st.pending, state: st.numericsState(), elapsedMs: st.numeric?.elapsedMs ?? null };
  }));
  if (process.env.KERNWRIGHT_LSP_TEST_HOOKS === '1') {
    c.onRequest(crashWorkerTestRequest, () => {
      worker.crashForTest();
      return null;
    });
  }
  c.onExecuteCommand(guard(ctx, 'execute command', null, (p: ExecuteCommandParams) => {
    if (p.command !== showFiguresCommand) return null;
    const [uri, kernel] = p.arguments ?? [];
    const text = figures(ctx, uri, kernel);
    if (text !== null) void c.sendNotification(ShowMessageNotification.type, { type: MessageType.Info, message: text });
    return text;
  }));
}
