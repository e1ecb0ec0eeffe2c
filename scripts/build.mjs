// Bundles the command-line program, the language server (and its analysis worker) and the VS Code client
// with esbuild. Run by `npm install` (root `prepare`) so that `npx kernwright` works right after install.
import { build } from 'esbuild';
import { existsSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import path from 'node:path';

const root = path.dirname(path.dirname(fileURLToPath(import.meta.url)));
const r = (p) => path.join(root, p);
const common = {
  bundle: true,
  platform: 'node',
  target: 'node20',
  format: 'cjs',
  sourcemap: true,
  logLevel: 'warning',
  alias: { '@kernwright/core': r('src-core/index.ts') },
};

const entries = [
  { in: 'server/src/cli/main.ts', out: 'server/dist/cli.js' },
  { in: 'server/src/lsp/main.ts', out: 'server/dist/server.js' },
  { in: 'server/src/lsp/worker.ts', out: 'server/dist/worker.js' },
  { in: 'server/src/cli/checkWorker.ts', out: 'server/dist/checkWorker.js' },
];
const jobs = entries
  .filter((e) => existsSync(r(e.in)))
  .map((e) => build({ ...common, entryPoints: [r(e.in)], outfile: r(e.out) }));
if (existsSync(r('client/src/extension.ts'))) {
  jobs.push(
    build({ ...common, entryPoints: [r('client/src/extension.ts')], outfile: r('client/dist/extension.js'), external: ['vscode'] }),
  );
}
await Promise.all(jobs);
