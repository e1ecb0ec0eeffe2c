/**
 * Entry point of the bundled language server (server/dist/server.js): `--stdio`, `--node-ipc` or `--socket=N`,
 * as vscode-languageserver reads them from the command line. A last-resort handler logs unexpected errors instead
 * of ending the process.
 */
import { createConnection, ProposedFeatures } from 'vscode-languageserver/node';
import { startServer } from './server';

const connection = createConnection(ProposedFeatures.all);

process.on('uncaughtException', (error) => {
  try {
    connection.console.error(`Kernwright: unexpected error: ${error.stack ?? error.message}`);
  } catch {
    // the connection itself is gone; nothing left to tell
  }
});
process.on('unhandledRejection', (reason) => {
  try {
    connection.console.error(`Kernwright: unexpected rejection: ${reason instanceof Error ? reason.stack ?? reason.message : String(reason)}`);
  } catch {
    // as above
  }
});

startServer(connection);
