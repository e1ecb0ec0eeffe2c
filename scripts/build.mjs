// Bundles the command-line program, the language server (and its analysis worker) and the VS Code client
// with esbuild. Run by `npm install` (root `prepare`) so that `npx kernwright` works right after install.
// Outputs are written to a temporary file and renamed into place, so that a test or a running server never reads
// a half-written bundle while another build runs.
import { build } from 'esbuild';
import { existsSync, mkdirSync, renameSync, writeFileSync } from 'node:fs';
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
  write: false,
  alias: {
    '@kernwright/core': r('src-core/index.ts'),
    // vega's optional canvas renderer awaits at module top level, which CommonJS bundles cannot do; we render SVG only.
    'vega-canvas': r('server/src/pictures/noCanvas.ts'),
  },
};

const entries = [
  { in: 'server/src/cli/main.ts', out: 'server/dist/cli.js' },
  { in: 'server/src/lsp/main.ts', out: 'server/dist/server.js' },
  { in: 'server/src/lsp/worker.ts', out: 'server/dist/worker.js' },
  { in: 'server/src/cli/checkWorker.ts', out: 'server/dist/checkWorker.js' },
  { in: 'client/src/extension.ts', out: 'client/dist/extension.js', external: ['vscode'] },
];

function writeAtomically(file, contents) {
  mkdirSync(path.dirname(file), { recursive: true });
  const temporary = `${file}.${process.pid}.tmp`;
  writeFileSync(temporary, contents);
  renameSync(temporary, file);
}

// `node scripts/build.mjs server.js worker.js` builds only the entries whose output path contains one of the words.
const only = process.argv.slice(2);
const chosen = entries.filter((e) => existsSync(r(e.in)) && (only.length === 0 || only.some((w) => e.out.includes(w))));
// Each entry is written as soon as it is built; one that fails does not keep the others from being written.
const results = await Promise.allSettled(
  chosen.map(async (e) => {
    const result = await build({ ...common, entryPoints: [r(e.in)], outfile: r(e.out), ...(e.external ? { external: e.external } : {}) });
    for (const file of result.outputFiles) writeAtomically(file.path, file.contents);
  }),
);
const failed = results.filter((x) => x.status === 'rejected');
if (failed.length > 0) {
  for (const f of failed) console.error(f.reason instanceof Error ? f.reason.message : String(f.reason));
  process.exit(1);
}
