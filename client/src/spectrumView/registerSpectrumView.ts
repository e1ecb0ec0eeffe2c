/**
 * Registers the spectrum view: the command `kernwright.showSpectrum` [uri?, kernel?] opens a webview beside the
 * editor with the pictures of a kernel (the one named, else the one under the cursor), which then follows the
 * cursor and the file as it changes.
 *
 * Wiring, in the extension's activate():
 *   registerSpectrumView(context, (params) => client.sendRequest(kernelDataRequest, params));
 * where the language server answers `kernwright/kernelData` {uri, points?} with a KernelDataReply (kernelData.ts).
 */
import * as vscode from 'vscode';
import type { GetKernelData } from './kernelData';
import { SpectrumPanel, type SpectrumViewOptions } from './spectrumPanel';

export const showSpectrumCommand = 'kernwright.showSpectrum';

export function registerSpectrumView(context: vscode.ExtensionContext, getKernelData: GetKernelData, options: SpectrumViewOptions = {}): vscode.Disposable {
  const panel = new SpectrumPanel(getKernelData, options);
  const command = vscode.commands.registerCommand(showSpectrumCommand, (uri?: string | vscode.Uri, kernel?: string) => panel.open(uri, kernel));
  const registration = vscode.Disposable.from(command, panel);
  context.subscriptions.push(registration);
  return registration;
}
