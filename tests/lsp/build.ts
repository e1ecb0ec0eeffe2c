/** Builds the bundles the LSP tests run (server/dist/server.js and worker.js only). Writes are atomic (see build.mjs). */
import { execFileSync } from 'node:child_process';
import path from 'node:path';
import { root } from './lspClient';

export function buildBundles(): void {
  execFileSync(process.execPath, [path.join(root, 'scripts', 'build.mjs'), 'server.js', 'worker.js'], { cwd: root, stdio: 'inherit' });
}
