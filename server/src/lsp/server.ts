/**
 * The language server: wires the document manager, the two-stage analyzer, the worker and one handler per feature
 * to a connection. Every handler lives in features/ and calls the core; conversions live in toLsp.ts.
 */
import path from 'node:path';
import {
  CodeActionKind,
  CodeLensRefreshRequest,
  DidChangeConfigurationNotification,
  MessageType,
  ShowMessageNotification,
  TextDocuments,
  TextDocumentSyncKind,
  type Connection,
  type DidChangeTextDocumentParams,
  type InitializeParams,
  type InitializeResult,
} from 'vscode-languageserver/node';
import { TextDocument } from 'vscode-languageserver-textdocument';
import { Analyzer } from './analyzer';
import type { ClientFlags, ServerContext } from './context';
import { defaultSettings, readSettings, type ServerSettings } from './settings';
import * as toLsp from './toLsp';
import { WorkerClient } from './workerClient';
import { registerCodeActions } from './features/codeAction';
import { registerCodeLens, showFiguresCommand } from './features/codeLens';
import { registerCommands } from './features/commands';
import { registerCompletion } from './features/completion';
import { registerDefinition } from './features/definition';
import { registerDocumentSymbols } from './features/documentSymbol';
import { registerFolding } from './features/foldingRange';
import { registerFormatting } from './features/formatting';
import { registerHover } from './features/hover';
import { registerReferences } from './features/references';
import { registerRename } from './features/rename';
import { registerSemanticTokens } from './features/semanticTokens';
import { registerSignatureHelp, signatureTriggers } from './features/signatureHelp';

export const languageId = 'kernwright';

/** Only kernel files are analysed, whatever else a client may open. */
export function isKernelDocument(doc: TextDocument): boolean {
  return doc.languageId === languageId || doc.uri.toLowerCase().endsWith('.kw');
}

/**
 * The connection as the document manager sees it, with every didChange checked first: a change without an integer
 * version (or without a list of changes) cannot be ordered against the analyses in flight, so it is ignored, the
 * document keeps its last consistent text and version, and the client is told in the log (a notification has no
 * answer to carry an error).
 */
function withCheckedChanges(connection: Connection): Connection {
  const onDidChangeTextDocument: Connection['onDidChangeTextDocument'] = (handler) =>
    connection.onDidChangeTextDocument((params) => {
      const p = params as Partial<DidChangeTextDocumentParams> | null | undefined;
      const version: unknown = p?.textDocument?.version;
      const uri: unknown = p?.textDocument?.uri;
      if (typeof uri !== 'string' || !Number.isInteger(version) || !Array.isArray(p?.contentChanges)) {
        const what = typeof uri === 'string' ? uri : 'a document';
        const why = !Number.isInteger(version) ? `its version is ${JSON.stringify(version) ?? 'missing'}, not an integer` : 'it is malformed';
        connection.console.error(`Kernwright: ignored a change to ${what}: ${why}; the server keeps the last text it had (close and reopen the file to resynchronise).`);
        return;
      }
      return handler(params);
    });
  return new Proxy(connection, {
    get: (target, key, receiver) => (key === 'onDidChangeTextDocument' ? onDidChangeTextDocument : Reflect.get(target, key, receiver)),
  });
}

export function startServer(connection: Connection, workerScript = path.join(__dirname, 'worker.js')): void {
  let settings: ServerSettings = defaultSettings;
  const client: ClientFlags = { snippets: false, configuration: false, workDoneProgress: false, codeLensRefresh: false, showsFigures: false };
  let dynamicConfiguration = false;
  let restartNoticeShown = false;
  const log = (message: string) => connection.console.log(message);

  const worker = new WorkerClient({
    script: workerScript,
    onRestart: (reason, stopped) => {
      // A stopped kernel is reported on its name (KW406/KW407): the log says why, and no notice interrupts the user.
      if (stopped) {
        log(`Kernwright: ${reason}; the analysis worker was restarted and the files it held are analysed again without “${stopped.name}”.`);
        return;
      }
      const message = `Kernwright: the analysis worker stopped (${reason}) and was restarted; open files are analysed again.`;
      log(message);
      if (!restartNoticeShown) {
        restartNoticeShown = true;
        void connection.sendNotification(ShowMessageNotification.type, { type: MessageType.Warning, message });
      }
    },
  });
  const analyzer = new Analyzer({
    connection,
    worker,
    settings: () => settings,
    progressSupported: () => client.workDoneProgress,
    onNumericResult: () => {
      if (client.codeLensRefresh) void connection.sendRequest(CodeLensRefreshRequest.type).catch(() => undefined);
    },
    log,
  });
  const ctx: ServerContext = { connection, analyzer, client, settings: () => settings, log };

  connection.onInitialize((params: InitializeParams): InitializeResult => {
    const caps = params.capabilities ?? {};
    client.snippets = caps.textDocument?.completion?.completionItem?.snippetSupport === true;
    client.configuration = caps.workspace?.configuration === true;
    client.workDoneProgress = caps.window?.workDoneProgress === true;
    client.codeLensRefresh = caps.workspace?.codeLens?.refreshSupport === true;
    dynamicConfiguration = caps.workspace?.didChangeConfiguration?.dynamicRegistration === true;
    const init = (params.initializationOptions ?? {}) as { showsFigures?: unknown; settings?: unknown };
    client.showsFigures = init.showsFigures === true;
    if (init.settings !== undefined) settings = readSettings(init.settings);
    worker.start();
    return {
      capabilities: {
        textDocumentSync: TextDocumentSyncKind.Incremental,
        hoverProvider: true,
        codeLensProvider: { resolveProvider: false },
        codeActionProvider: { codeActionKinds: [CodeActionKind.QuickFix] },
        completionProvider: { resolveProvider: false },
        signatureHelpProvider: { triggerCharacters: signatureTriggers },
        definitionProvider: true,
        referencesProvider: true,
        documentHighlightProvider: true,
        renameProvider: { prepareProvider: true },
        documentSymbolProvider: true,
        foldingRangeProvider: true,
        documentFormattingProvider: true,
        semanticTokensProvider: { legend: toLsp.semanticLegend, full: true },
        ...(client.showsFigures ? {} : { executeCommandProvider: { commands: [showFiguresCommand] } }),
      },
      serverInfo: { name: 'kernwright', version: '0.1.0' },
    };
  });

  const pullSettings = async (pushed?: unknown): Promise<void> => {
    const before = JSON.stringify(settings);
    if (client.configuration) {
      try {
        const [section] = (await connection.workspace.getConfiguration([{ section: 'kernwright' }])) as unknown[];
        settings = readSettings(section);
      } catch (error) {
        log(`Kernwright: could not read the settings: ${error instanceof Error ? error.message : String(error)}`);
      }
    } else if (pushed !== undefined) {
      settings = readSettings((pushed as { kernwright?: unknown } | null)?.kernwright);
    }
    if (JSON.stringify(settings) !== before) analyzer.reanalyseAll(false);
  };

  connection.onInitialized(() => {
    if (dynamicConfiguration) void connection.client.register(DidChangeConfigurationNotification.type, { section: 'kernwright' });
    void pullSettings();
  });
  connection.onDidChangeConfiguration((change) => void pullSettings(change?.settings));

  const documents = new TextDocuments(TextDocument);
  documents.onDidChangeContent((e) => {
    if (!isKernelDocument(e.document)) return;
    try {
      analyzer.update(e.document.uri, e.document.version, e.document.getText());
    } catch (error) {
      log(`Kernwright: analysis of ${e.document.uri} failed: ${error instanceof Error ? error.stack ?? error.message : String(error)}`);
    }
  });
  documents.onDidClose((e) => analyzer.close(e.document.uri));
  documents.listen(withCheckedChanges(connection));

  registerHover(ctx);
  registerCodeLens(ctx);
  registerCodeActions(ctx);
  registerCompletion(ctx);
  registerSignatureHelp(ctx);
  registerDefinition(ctx);
  registerReferences(ctx);
  registerRename(ctx);
  registerDocumentSymbols(ctx);
  registerFolding(ctx);
  registerFormatting(ctx);
  registerSemanticTokens(ctx);
  registerCommands(ctx, worker);

  connection.onShutdown(() => {
    analyzer.dispose();
    worker.dispose();
  });
  connection.listen();
}
