// Runs the benchmarks: bundles each bench/*.ts with esbuild (platform node, CommonJS, '@kernwright/core' aliased to
// src-core/index.ts) into .cache/bench/, then loads each bundle in turn and awaits its exported `run()`.
// Usage: npm run bench [-- name-filter]   (only files whose name contains the filter run)
import { existsSync, mkdirSync, readdirSync } from 'node:fs';
import { createRequire } from 'node:module';
import path from 'node:path';
import { bundleTs, root } from './bundleTs.mjs';

const benchDir = path.join(root, 'bench');
const outDir = path.join(root, '.cache', 'bench');
const filter = process.argv[2] ?? '';
const require = createRequire(import.meta.url);

const names = existsSync(benchDir)
  ? readdirSync(benchDir)
      .filter((f) => f.endsWith('.ts') && !f.endsWith('.d.ts') && f.includes(filter))
      .sort()
  : [];
if (names.length === 0) {
  console.log(filter ? `no benchmark in bench/ matches '${filter}'` : 'no benchmarks in bench/');
  process.exit(0);
}

mkdirSync(outDir, { recursive: true });
let failed = 0;
for (const name of names) {
  const outfile = path.join(outDir, name.replace(/\.ts$/, '.cjs'));
  console.log(`\n== ${name}`);
  try {
    await bundleTs(path.join(benchDir, name), outfile);
    delete require.cache[outfile];
    const mod = require(outfile);
    if (typeof mod.run !== 'function') throw new Error(`${name} exports no run() function`);
    const started = performance.now();
    await mod.run();
    console.log(`-- ${name} done in ${((performance.now() - started) / 1000).toFixed(2)} s`);
  } catch (error) {
    failed++;
    console.error(`-- ${name} failed: ${error instanceof Error ? error.message : String(error)}`);
  }
}
process.exit(failed > 0 ? 1 : 0);
