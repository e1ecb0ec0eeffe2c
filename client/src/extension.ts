/**
 * The Kernwright extension: starts the bundled language server (dist/server.js, over IPC) for `kernwright`
 * documents, adds its commands and the spectrum view (pictures of the kernel under the cursor). Everything else (diagnostics, hovers, lenses, fixes, formatting) comes from the
 * server.
 */
import * as path from 'node:path';
import * as vscode from 'vscode';
import { LanguageClient, TransportKind, type LanguageClientOptions, type ServerOptions } from 'vscode-languageclient/node';
import { kernelDataRequest, registerSpectrumView, type KernelDataParams, type KernelDataReply } from './spectrumView';

let client: LanguageClient | undefined;

export async function activate(context: vscode.ExtensionContext): Promise<void> {
  const serverModule = context.asAbsolutePath(path.join('dist', 'server.js'));
  const serverOptions: ServerOptions = {
    run: { module: serverModule, transport: TransportKind.ipc },
    debug: { module: serverModule, transport: TransportKind.ipc, options: { execArgv: ['--nolazy', '--inspect=6019'] } },
  };
  const clientOptions: LanguageClientOptions = {
    documentSelector: [{ language: 'kernwright' }],
    initializationOptions: { showsFigures: true },
  };
  const figures = vscode.window.createOutputChannel('Kernwright figures');
  const lc = new LanguageClient('kernwright', 'Kernwright', serverOptions, clientOptions);
  client = lc;

  context.subscriptions.push(
    figures,
    vscode.commands.registerCommand('kernwright.showFigures', async (uri?: string, kernel?: string) => {
      const target = uri ?? vscode.window.activeTextEditor?.document.uri.toString();
      if (!target) return;
      const answer = await lc.sendRequest<{ text: string } | null>('kernwright/figures', { uri: target, kernel });
      figures.clear();
      figures.appendLine(answer?.text ?? 'No kernel figures for this file yet.');
      figures.show(true);
      // The summary above a kernel opens its pictures too.
      if (kernel) await vscode.commands.executeCommand('kernwright.showSpectrum', target, kernel);
    }),
    vscode.commands.registerCommand('kernwright.reanalyse', async () => {
      await lc.sendRequest('kernwright/reanalyse', {});
    }),
  );
  registerSpectrumView(context, (params: KernelDataParams) => lc.sendRequest<KernelDataReply | null>(kernelDataRequest, params));
  await lc.start();
}

export async function deactivate(): Promise<void> {
  await client?.stop();
  client = undefined;
}
