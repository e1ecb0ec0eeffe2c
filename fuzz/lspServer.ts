/**
 * The real language server for the long fuzz run: `node server/dist/server.js --stdio`, spoken to over JSON-RPC
 * (vscode-languageserver-protocol), as tests/lsp/lspClient.ts does in the suite. Records every publishDiagnostics
 * (with its version), the log messages, whether the process died, and its resident memory. Every request has a
 * timeout: a request the server never answers is reported, not waited for.
 */
import { spawn, type ChildProcessWithoutNullStreams } from 'node:child_process';
import { pathToFileURL } from 'node:url';
import path from 'node:path';
import {
  CancellationTokenSource,
  createProtocolConnection,
  StreamMessageReader,
  StreamMessageWriter,
  type ProtocolConnection,
} from 'vscode-languageserver-protocol/node';
import { MemoryWatch } from './childProcess';
import type { LspRange } from './textLines';

export interface LspDiagnostic {
  readonly code?: string | number;
  readonly range: LspRange;
  readonly message: string;
  readonly relatedInformation?: { location: { uri: string; range: LspRange } }[];
}

export interface Publication {
  readonly version: number | undefined;
  readonly diagnostics: LspDiagnostic[];
}

export type Answer<R> =
  | { readonly kind: 'result'; readonly value: R }
  | { readonly kind: 'error'; readonly code: number; readonly message: string }
  | { readonly kind: 'timeout' };

export class FuzzServer {
  /** Every publication per uri, oldest first (trimmed to the last few). */
  readonly published = new Map<string, Publication[]>();
  readonly logs: string[] = [];
  exited = false;
  exitCode: number | null = null;
  stderr = '';
  readonly memory: MemoryWatch;

  private constructor(readonly process: ChildProcessWithoutNullStreams, readonly connection: ProtocolConnection) {
    this.memory = new MemoryWatch(process, 200);
  }

  static async start(root: string, settings: unknown): Promise<FuzzServer> {
    const child = spawn(process.execPath, [path.join(root, 'server', 'dist', 'server.js'), '--stdio'], { cwd: root, stdio: 'pipe' });
    const connection = createProtocolConnection(new StreamMessageReader(child.stdout), new StreamMessageWriter(child.stdin));
    const server = new FuzzServer(child, connection);
    child.stderr.on('data', (d: Buffer) => {
      server.stderr = (server.stderr + d.toString()).slice(-20_000);
    });
    child.on('exit', (code) => {
      server.exited = true;
      server.exitCode = code;
    });
    connection.onError(() => undefined);
    connection.onClose(() => undefined);
    connection.onNotification('textDocument/publishDiagnostics', (p: { uri: string; version?: number; diagnostics: LspDiagnostic[] }) => {
      const list = server.published.get(p.uri) ?? [];
      list.push({ version: p.version, diagnostics: p.diagnostics });
      if (list.length > 20) list.splice(0, list.length - 20);
      server.published.set(p.uri, list);
    });
    connection.onNotification('window/logMessage', (p: { message: string }) => {
      server.logs.push(p.message);
    });
    connection.onNotification('window/showMessage', () => undefined);
    connection.onNotification('$/progress', () => undefined);
    connection.onRequest('workspace/configuration', (p: { items: { section?: string }[] }) =>
      p.items.map((i) => (i.section === 'kernwright' ? settings : null)));
    connection.onRequest('window/workDoneProgress/create', () => null);
    connection.onRequest('workspace/codeLens/refresh', () => null);
    connection.onRequest('workspace/semanticTokens/refresh', () => null);
    connection.onRequest('client/registerCapability', () => null);
    connection.listen();
    const init = await server.request('initialize', {
      processId: process.pid,
      rootUri: pathToFileURL(root).href,
      capabilities: {
        workspace: { configuration: true, didChangeConfiguration: { dynamicRegistration: true }, codeLens: { refreshSupport: true } },
        window: { workDoneProgress: true },
        textDocument: { completion: { completionItem: { snippetSupport: true } }, publishDiagnostics: { versionSupport: true } },
      },
      initializationOptions: {},
    }, 30_000);
    if (init.kind !== 'result') throw new Error(`the server did not answer initialize: ${JSON.stringify(init)}; stderr: ${server.stderr}`);
    await connection.sendNotification('initialized', {});
    return server;
  }

  /** A request with a timeout; with `cancelAfterMs`, a $/cancelRequest follows after that many milliseconds. */
  async request<R>(method: string, params: unknown, timeoutMs: number, cancelAfterMs?: number): Promise<Answer<R>> {
    if (this.exited) return { kind: 'timeout' };
    const source = new CancellationTokenSource();
    let timer: NodeJS.Timeout | undefined;
    const timeout = new Promise<Answer<R>>((resolve) => {
      timer = setTimeout(() => resolve({ kind: 'timeout' }), timeoutMs);
    });
    if (cancelAfterMs !== undefined) setTimeout(() => source.cancel(), cancelAfterMs);
    const answer = this.connection.sendRequest(method, params, source.token).then(
      (value) => ({ kind: 'result', value: value as R }) as Answer<R>,
      (error: { code?: number; message?: string }) => ({ kind: 'error', code: error?.code ?? 0, message: error?.message ?? String(error) }) as Answer<R>,
    );
    try {
      return await Promise.race([answer, timeout]);
    } finally {
      clearTimeout(timer);
      source.dispose();
    }
  }

  notify(method: string, params: unknown): void {
    if (!this.exited) void this.connection.sendNotification(method, params).catch(() => undefined);
  }

  async stop(): Promise<void> {
    this.memory.stop();
    if (this.exited) return;
    await this.request('shutdown', null, 5000);
    this.notify('exit', null);
    await Promise.race([new Promise((r) => this.process.once('exit', r)), new Promise((r) => setTimeout(r, 3000))]);
    if (!this.exited) this.process.kill('SIGKILL');
    this.connection.dispose();
  }
}
