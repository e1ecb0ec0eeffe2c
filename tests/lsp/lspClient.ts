/**
 * A small LSP client for the tests: spawns the real bundled server (`node server/dist/server.js --stdio`), speaks
 * JSON-RPC with vscode-languageserver-protocol, records every publishDiagnostics, and offers helpers to open and edit
 * documents and to wait for the diagnostics of a given version.
 */
import { spawn, type ChildProcessWithoutNullStreams } from 'node:child_process';
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { pathToFileURL } from 'node:url';
import {
  createProtocolConnection,
  StreamMessageReader,
  StreamMessageWriter,
  type Diagnostic,
  type InitializeResult,
  type ProtocolConnection,
  type PublishDiagnosticsParams,
} from 'vscode-languageserver-protocol/node';

export const root = path.resolve(__dirname, '..', '..');
export const serverScript = path.join(root, 'server', 'dist', 'server.js');

export interface Published {
  readonly uri: string;
  readonly version: number | undefined;
  readonly diagnostics: Diagnostic[];
  readonly at: number;
}

export interface StartOptions {
  readonly settings?: unknown;
  readonly env?: Record<string, string>;
  /** Client capabilities beyond the defaults. */
  readonly capabilities?: Record<string, unknown>;
  readonly initializationOptions?: Record<string, unknown>;
}

export class TestClient {
  readonly published: Published[] = [];
  readonly messages: { type: number; message: string }[] = [];
  readonly logs: string[] = [];
  private readonly versions = new Map<string, number>();
  private readonly texts = new Map<string, string>();
  private listeners: (() => void)[] = [];
  settings: unknown = {};
  /** How many work-done progress tokens the server asked for. */
  progressCreated = 0;
  exited = false;
  stderr = '';

  private constructor(readonly process: ChildProcessWithoutNullStreams, readonly connection: ProtocolConnection) {}

  static async start(options: StartOptions = {}): Promise<TestClient> {
    const child = spawn(process.execPath, [serverScript, '--stdio'], {
      cwd: root,
      env: { ...process.env, ...(options.env ?? {}) },
      stdio: 'pipe',
    });
    const connection = createProtocolConnection(new StreamMessageReader(child.stdout), new StreamMessageWriter(child.stdin));
    const client = new TestClient(child, connection);
    client.settings = options.settings ?? {};
    child.stderr.on('data', (d: Buffer) => (client.stderr += d.toString()));
    child.on('exit', () => {
      client.exited = true;
      client.notify();
    });
    connection.onNotification('textDocument/publishDiagnostics', (p: PublishDiagnosticsParams) => {
      client.published.push({ uri: p.uri, version: p.version, diagnostics: p.diagnostics, at: performance.now() });
      client.notify();
    });
    connection.onNotification('window/showMessage', (p: { type: number; message: string }) => {
      client.messages.push(p);
      client.notify();
    });
    connection.onNotification('window/logMessage', (p: { message: string }) => {
      client.logs.push(p.message);
    });
    connection.onRequest('workspace/configuration', (p: { items: { section?: string }[] }) =>
      p.items.map((i) => (i.section === 'kernwright' ? client.settings : null)));
    connection.onRequest('window/workDoneProgress/create', () => {
      client.progressCreated++;
      return null;
    });
    connection.onRequest('workspace/codeLens/refresh', () => null);
    connection.onRequest('client/registerCapability', () => null);
    connection.onNotification('$/progress', () => undefined);
    connection.listen();
    await connection.sendRequest('initialize', {
      processId: process.pid,
      rootUri: pathToFileURL(root).href,
      capabilities: {
        workspace: { configuration: true, didChangeConfiguration: { dynamicRegistration: true }, codeLens: { refreshSupport: true } },
        window: { workDoneProgress: true },
        textDocument: { completion: { completionItem: { snippetSupport: true } } },
        ...(options.capabilities ?? {}),
      },
      initializationOptions: options.initializationOptions ?? {},
    }) as InitializeResult;
    await connection.sendNotification('initialized', {});
    return client;
  }

  private notify(): void {
    const ls = this.listeners;
    this.listeners = [];
    for (const l of ls) l();
  }

  /** Resolves when `test()` holds, checked after every notification; rejects after `timeoutMs`. */
  async until<T>(test: () => T | undefined | null | false, timeoutMs = 30_000, what = 'condition'): Promise<T> {
    const deadline = Date.now() + timeoutMs;
    for (;;) {
      const v = test();
      if (v) return v;
      if (this.exited) throw new Error(`server exited while waiting for ${what}; stderr: ${this.stderr}`);
      const left = deadline - Date.now();
      if (left <= 0) throw new Error(`timed out waiting for ${what}`);
      await new Promise<void>((resolve) => {
        const timer = setTimeout(resolve, Math.min(left, 200));
        this.listeners.push(() => {
          clearTimeout(timer);
          resolve();
        });
      });
    }
  }

  /** Polls an asynchronous test every 25 ms until it holds. */
  async poll<T>(test: () => Promise<T | undefined | null | false>, timeoutMs = 30_000, what = 'condition'): Promise<T> {
    const deadline = Date.now() + timeoutMs;
    for (;;) {
      const v = await test();
      if (v) return v;
      if (this.exited) throw new Error(`server exited while waiting for ${what}; stderr: ${this.stderr}`);
      if (Date.now() > deadline) throw new Error(`timed out waiting for ${what}`);
      await new Promise((r) => setTimeout(r, 25));
    }
  }

  uriOf(file: string): string {
    return pathToFileURL(path.resolve(root, file)).href;
  }

  version(uri: string): number {
    return this.versions.get(uri) ?? 0;
  }

  text(uri: string): string {
    return this.texts.get(uri) ?? '';
  }

  async open(uri: string, text: string, languageId = 'kernwright'): Promise<void> {
    this.versions.set(uri, 1);
    this.texts.set(uri, text);
    await this.connection.sendNotification('textDocument/didOpen', { textDocument: { uri, languageId, version: 1, text } });
  }

  async openFile(file: string): Promise<string> {
    const uri = this.uriOf(file);
    await this.open(uri, readFileSync(path.resolve(root, file), 'utf8'));
    return uri;
  }

  /** Replaces the whole text (a full-document change). */
  async replace(uri: string, text: string): Promise<number> {
    const version = this.version(uri) + 1;
    this.versions.set(uri, version);
    this.texts.set(uri, text);
    await this.connection.sendNotification('textDocument/didChange', { textDocument: { uri, version }, contentChanges: [{ text }] });
    return version;
  }

  /** Applies LSP text edits to our copy and sends them as incremental changes (last edit first). */
  async applyEdits(uri: string, edits: { range: { start: Pos; end: Pos }; newText: string }[]): Promise<number> {
    let text = this.text(uri);
    const sorted = [...edits].sort((a, b) => comparePos(b.range.start, a.range.start));
    for (const e of sorted) text = applyEdit(text, e);
    const version = this.version(uri) + 1;
    this.versions.set(uri, version);
    this.texts.set(uri, text);
    await this.connection.sendNotification('textDocument/didChange', {
      textDocument: { uri, version },
      contentChanges: sorted.map((e) => ({ range: e.range, text: e.newText })),
    });
    return version;
  }

  async close(uri: string): Promise<void> {
    await this.connection.sendNotification('textDocument/didClose', { textDocument: { uri } });
  }

  /** All publications for `uri` at `version`. */
  publicationsAt(uri: string, version: number): Published[] {
    return this.published.filter((p) => p.uri === uri && p.version === version);
  }

  /** Waits until the numerical stage of `uri` at its current version is done; returns the final diagnostics. */
  async settled(uri: string, timeoutMs = 60_000): Promise<Diagnostic[]> {
    const version = this.version(uri);
    const deadline = Date.now() + timeoutMs;
    for (;;) {
      const state = await this.connection.sendRequest('kernwright/analysisState', { uri }) as
        { version: number; numericVersion: number | null; pending: boolean; state: string } | null;
      if (state && state.version === version && !state.pending && (state.numericVersion === version || state.state === 'off')) break;
      if (Date.now() > deadline) throw new Error(`analysis of ${uri} did not settle: ${JSON.stringify(state)}`);
      await new Promise((r) => setTimeout(r, 25));
    }
    const pubs = this.publicationsAt(uri, version);
    return pubs[pubs.length - 1]?.diagnostics ?? [];
  }

  async request<R>(method: string, params: unknown): Promise<R> {
    return (await this.connection.sendRequest(method, params)) as R;
  }

  async stop(): Promise<void> {
    if (this.exited) return;
    try {
      await Promise.race([this.connection.sendRequest('shutdown'), new Promise((r) => setTimeout(r, 3000))]);
      await this.connection.sendNotification('exit');
    } catch {
      // already gone
    }
    await Promise.race([new Promise((r) => this.process.once('exit', r)), new Promise((r) => setTimeout(r, 3000))]);
    if (!this.exited) this.process.kill();
    this.connection.dispose();
  }
}

export interface Pos {
  line: number;
  character: number;
}

export function comparePos(a: Pos, b: Pos): number {
  return a.line - b.line || a.character - b.character;
}

export function offsetAt(text: string, pos: Pos): number {
  let line = 0;
  let i = 0;
  while (line < pos.line && i < text.length) {
    if (text[i] === '\n') line++;
    i++;
  }
  return Math.min(i + pos.character, text.length);
}

export function positionAt(text: string, offset: number): Pos {
  const before = text.slice(0, offset);
  const line = before.split('\n').length - 1;
  return { line, character: offset - (before.lastIndexOf('\n') + 1) };
}

export function applyEdit(text: string, e: { range: { start: Pos; end: Pos }; newText: string }): string {
  return text.slice(0, offsetAt(text, e.range.start)) + e.newText + text.slice(offsetAt(text, e.range.end));
}

/** The position of the first occurrence of `needle` (plus `delta` characters) in `text`. */
export function find(text: string, needle: string, delta = 0, occurrence = 0): Pos {
  let at = -1;
  for (let k = 0; k <= occurrence; k++) {
    at = text.indexOf(needle, at + 1);
    if (at < 0) throw new Error(`“${needle}” not found`);
  }
  return positionAt(text, at + delta);
}
