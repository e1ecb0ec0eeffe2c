// The long fuzz run (see fuzz/run.ts and DEVELOPERS.md, "Fuzzing"): bundles fuzz/run.ts with esbuild (platform node,
// CommonJS, '@kernwright/core' aliased to src-core/index.ts) into .cache/fuzz/run.cjs, as bench.mjs does for
// bench/*.ts, and runs it from the repository root with the given options. It drives the built bundles in
// server/dist/, so run `node scripts/build.mjs` first.
// Usage: npm run fuzz [-- --docs N --lsp-minutes M --seed S --part cli|lsp|all]
import { spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, readdirSync, statSync } from 'node:fs';
import path from 'node:path';
import { bundleTs, root } from './bundleTs.mjs';

const outDir = path.join(root, '.cache', 'fuzz');
const outfile = path.join(outDir, 'run.cjs');

// The run checks codes against the catalogue of the tree it is bundled from; bundles older than the sources would
// make every new code look unknown.
function newestMtime(dir) {
  let newest = 0;
  for (const entry of readdirSync(dir, { withFileTypes: true })) {
    const full = path.join(dir, entry.name);
    if (entry.isDirectory()) newest = Math.max(newest, newestMtime(full));
    else if (entry.name.endsWith('.ts')) newest = Math.max(newest, statSync(full).mtimeMs);
  }
  return newest;
}
const sources = Math.max(newestMtime(path.join(root, 'src-core')), newestMtime(path.join(root, 'server', 'src')));
for (const bundle of ['cli.js', 'server.js', 'worker.js']) {
  const file = path.join(root, 'server', 'dist', bundle);
  if (existsSync(file) && statSync(file).mtimeMs < sources) {
    console.warn(`fuzz: server/dist/${bundle} is older than the sources: run node scripts/build.mjs first`);
  }
}

mkdirSync(outDir, { recursive: true });
await bundleTs(path.join(root, 'fuzz', 'run.ts'), outfile);
const result = spawnSync(process.execPath, ['--enable-source-maps', outfile, ...process.argv.slice(2)], { cwd: root, stdio: 'inherit' });
process.exit(result.status ?? 2);
