/**
 * What the view shows for one kernel: its section (heading, property verdicts, figures with their tables) rendered in
 * the extension host (vega in Node, like the command line's report), as an HTML fragment to post to the webview.
 * Pure of vscode; the renderer is the server's (client → server → core).
 */
import { kernelSectionHtml, type KernelPictureData } from '@kernwright/core';
import { renderKernelSection } from '../../../server/src/pictures/kernelPictures';

export interface ViewContentOptions {
  /** Leading eigenfunctions to draw (default 4). */
  readonly eigenfunctions?: number;
  /** Receives rendering warnings (by default dropped). */
  readonly onWarning?: (message: string) => void;
}

/** The message that shows a kernel: the fragment and a status line. */
export interface ShowMessage {
  readonly type: 'show';
  readonly kernel: string;
  readonly html: string;
  readonly status: string;
}

export async function kernelViewHtml(data: KernelPictureData, options: ViewContentOptions = {}): Promise<string> {
  const section = await renderKernelSection(data, options);
  return kernelSectionHtml(section, 0);
}

/** The status line above a kernel's section. */
export function viewStatus(file: string, pending: boolean): string {
  const base = `${file} · follows the kernel under the cursor`;
  return pending ? `${base} · the latest edit is still being analysed; showing the last complete figures` : base;
}

export async function showMessage(data: KernelPictureData, file: string, pending: boolean, options: ViewContentOptions = {}): Promise<ShowMessage> {
  return { type: 'show', kernel: data.report.name, html: await kernelViewHtml(data, options), status: viewStatus(file, pending) };
}
