/**
 * The spectrum view's panel: one webview beside the editor that shows the pictures of one kernel of one .kw file.
 * It follows the kernel under the cursor, follows the active .kw editor, and redraws after edits (debounced); while
 * the server still analyses the latest edit it shows the last complete figures and asks again shortly. Rendering
 * happens here in the extension host (vega in Node); the webview only receives finished HTML and SVG.
 */
import * as crypto from 'node:crypto';
import * as vscode from 'vscode';
import { kernelAtOffset, kernelNamed, type GetKernelData, type KernelDataReply } from './kernelData';
import { showMessage, type ShowMessage } from './viewContent';
import { spectrumViewHtml } from './viewHtml';

export interface SpectrumViewOptions {
  /** Pause after an edit before asking the server again, in ms (default 400). */
  readonly debounceMs?: number;
  /** Cells per axis of the heat maps (default 40). */
  readonly points?: number;
  /** Pause between asks while the server's analysis is pending, in ms (default 700; at most 40 asks). */
  readonly pollMs?: number;
}

const languageId = 'kernwright';
const viewType = 'kernwright.spectrum';

function fileLabel(uri: string): string {
  try {
    return vscode.workspace.asRelativePath(vscode.Uri.parse(uri), false);
  } catch {
    return uri;
  }
}

export class SpectrumPanel implements vscode.Disposable {
  private panel: vscode.WebviewPanel | null = null;
  private listeners: vscode.Disposable[] = [];
  private uri: string | null = null;
  /** The kernel asked for by name (command argument, code lens) until the cursor moves. */
  private wanted: string | null = null;
  private reply: KernelDataReply | null = null;
  private lastShown: ShowMessage | null = null;
  private readonly rendered = new Map<string, ShowMessage>();
  private requestSeq = 0;
  private renderSeq = 0;
  private polls = 0;
  private editTimer: ReturnType<typeof setTimeout> | undefined;
  private cursorTimer: ReturnType<typeof setTimeout> | undefined;
  private pollTimer: ReturnType<typeof setTimeout> | undefined;

  constructor(private readonly getKernelData: GetKernelData, private readonly options: SpectrumViewOptions = {}) {}

  /** Opens (or reveals) the view on a document and, optionally, a kernel by name. */
  async open(uri?: string | vscode.Uri, kernel?: string): Promise<void> {
    const target = uri !== undefined ? uri.toString() : this.activeKernelDocument()?.uri.toString();
    if (!target) {
      void vscode.window.showInformationMessage('Open a Kernwright (.kw) file to see the spectrum of its kernels.');
      return;
    }
    this.ensurePanel();
    this.uri = target;
    this.wanted = typeof kernel === 'string' && kernel !== '' ? kernel : null;
    await this.refresh();
  }

  dispose(): void {
    this.panel?.dispose();
    this.cleanUp();
  }

  private activeKernelDocument(): vscode.TextDocument | undefined {
    const doc = vscode.window.activeTextEditor?.document;
    return doc?.languageId === languageId ? doc : undefined;
  }

  private ensurePanel(): void {
    if (this.panel) {
      this.panel.reveal(vscode.ViewColumn.Beside, true);
      return;
    }
    const panel = vscode.window.createWebviewPanel(
      viewType,
      'Kernel spectrum',
      { viewColumn: vscode.ViewColumn.Beside, preserveFocus: true },
      { enableScripts: true, enableCommandUris: false, enableForms: false, localResourceRoots: [], retainContextWhenHidden: false },
    );
    panel.webview.html = spectrumViewHtml({ nonce: crypto.randomBytes(18).toString('base64') });
    this.panel = panel;
    this.listeners = [
      panel.onDidDispose(() => this.cleanUp()),
      panel.webview.onDidReceiveMessage((m: { type?: unknown }) => {
        if (m?.type === 'ready' && this.lastShown) void panel.webview.postMessage(this.lastShown);
      }),
      vscode.window.onDidChangeTextEditorSelection((e) => this.onSelection(e)),
      vscode.window.onDidChangeActiveTextEditor((editor) => this.onActiveEditor(editor)),
      vscode.workspace.onDidChangeTextDocument((e) => this.onEdit(e)),
    ];
  }

  private cleanUp(): void {
    for (const l of this.listeners) l.dispose();
    this.listeners = [];
    for (const t of [this.editTimer, this.cursorTimer, this.pollTimer]) if (t) clearTimeout(t);
    this.panel = null;
    this.reply = null;
    this.lastShown = null;
    this.rendered.clear();
    this.requestSeq++;
    this.renderSeq++;
  }

  private onSelection(e: vscode.TextEditorSelectionChangeEvent): void {
    if (!this.panel || !this.reply || e.textEditor.document.uri.toString() !== this.uri) return;
    const k = kernelAtOffset(this.reply.kernels, e.textEditor.document.offsetAt(e.selections[0].active));
    if (!k || k.report.name === this.lastShown?.kernel) return;
    this.wanted = k.report.name;
    if (this.cursorTimer) clearTimeout(this.cursorTimer);
    this.cursorTimer = setTimeout(() => void this.showCurrent(), 120);
  }

  private onActiveEditor(editor: vscode.TextEditor | undefined): void {
    if (!this.panel || editor?.document.languageId !== languageId) return;
    const uri = editor.document.uri.toString();
    if (uri === this.uri) return;
    this.uri = uri;
    this.wanted = null;
    void this.refresh();
  }

  private onEdit(e: vscode.TextDocumentChangeEvent): void {
    if (!this.panel || e.document.uri.toString() !== this.uri || e.contentChanges.length === 0) return;
    if (this.editTimer) clearTimeout(this.editTimer);
    this.editTimer = setTimeout(() => void this.refresh(), this.options.debounceMs ?? 400);
  }

  private post(message: ShowMessage | { type: 'status'; text: string }): void {
    if (message.type === 'show') this.lastShown = message;
    void this.panel?.webview.postMessage(message);
  }

  /** Asks the server for the document's kernels and shows the wanted one. */
  private async refresh(fromPoll = false): Promise<void> {
    const uri = this.uri;
    if (!this.panel || !uri) return;
    if (!fromPoll) this.polls = 0;
    if (this.pollTimer) clearTimeout(this.pollTimer);
    const seq = ++this.requestSeq;
    let reply: KernelDataReply | null;
    try {
      reply = await this.getKernelData({ uri, points: this.options.points ?? 40 });
    } catch (error) {
      if (seq === this.requestSeq) this.post({ type: 'status', text: `The language server did not answer: ${error instanceof Error ? error.message : String(error)}` });
      return;
    }
    if (seq !== this.requestSeq || !this.panel) return;
    this.reply = reply;
    this.rendered.clear();
    await this.showCurrent();
    if (reply?.pending && this.polls < 40) {
      this.polls++;
      this.pollTimer = setTimeout(() => void this.refresh(true), this.options.pollMs ?? 700);
    }
  }

  /** Renders (or takes from the cache) the wanted kernel of the latest reply and posts it. */
  private async showCurrent(): Promise<void> {
    const panel = this.panel;
    const reply = this.reply;
    if (!panel || !this.uri) return;
    if (!reply || reply.kernels.length === 0) {
      this.post({ type: 'status', text: `${fileLabel(this.uri)} declares no kernel (yet).` });
      return;
    }
    const editor = vscode.window.visibleTextEditors.find((e) => e.document.uri.toString() === this.uri);
    const data = (this.wanted ? kernelNamed(reply.kernels, this.wanted) : null)
      ?? (editor ? kernelAtOffset(reply.kernels, editor.document.offsetAt(editor.selection.active)) : null)
      ?? reply.kernels[0];
    const name = data.report.name;
    const seq = ++this.renderSeq;
    let message = this.rendered.get(name);
    if (!message) {
      try {
        message = await showMessage(data, fileLabel(this.uri), reply.pending);
      } catch (error) {
        if (seq === this.renderSeq) this.post({ type: 'status', text: `Could not draw kernel ${name}: ${error instanceof Error ? error.message : String(error)}` });
        return;
      }
      if (reply === this.reply) this.rendered.set(name, message);
    }
    if (seq !== this.renderSeq || panel !== this.panel) return;
    panel.title = `Spectrum: ${name}`;
    this.post(message);
  }
}
