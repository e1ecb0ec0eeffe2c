/**
 * What every feature handler gets: the connection, the documents' states, the settings and a guard that turns any
 * failure into a logged message and an empty answer, so that no request can bring the server down.
 */
import type { Connection } from 'vscode-languageserver/node';
import type { Analyzer } from './analyzer';
import type { DocumentState } from './documentState';
import type { ServerSettings } from './settings';

export interface ClientFlags {
  snippets: boolean;
  configuration: boolean;
  workDoneProgress: boolean;
  codeLensRefresh: boolean;
  /** The client runs the `kernwright.showFigures` command itself (our VS Code extension). */
  showsFigures: boolean;
}

export interface ServerContext {
  readonly connection: Connection;
  readonly analyzer: Analyzer;
  readonly client: ClientFlags;
  settings(): ServerSettings;
  log(message: string): void;
}

/** The state of an open kernel document, or undefined for anything else. */
export function documentOf(ctx: ServerContext, params: unknown): DocumentState | undefined {
  const uri = (params as { textDocument?: { uri?: unknown } } | null | undefined)?.textDocument?.uri;
  return typeof uri === 'string' ? ctx.analyzer.get(uri) : undefined;
}

/** Wraps a handler: a thrown error is logged and answered with `fallback`. */
export function guard<P, R>(ctx: ServerContext, name: string, fallback: R, handler: (params: P) => R | Promise<R>): (params: P) => Promise<R> {
  return async (params: P) => {
    try {
      return await handler(params);
    } catch (error) {
      ctx.log(`Kernwright: ${name} failed: ${error instanceof Error ? error.stack ?? error.message : String(error)}`);
      return fallback;
    }
  };
}
