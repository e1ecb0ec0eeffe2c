// Bundles one TypeScript entry for Node with esbuild, as the bench and fuzz runners need it: platform node, CommonJS,
// inline source maps, '@kernwright/core' aliased to src-core/index.ts (so no build of the core is needed first).
import { build } from 'esbuild';
import { fileURLToPath } from 'node:url';
import path from 'node:path';

export const root = path.dirname(path.dirname(fileURLToPath(import.meta.url)));

export function bundleTs(entry, outfile) {
  return build({
    entryPoints: [entry],
    outfile,
    bundle: true,
    platform: 'node',
    target: 'node20',
    format: 'cjs',
    sourcemap: 'inline',
    logLevel: 'warning',
    alias: { '@kernwright/core': path.join(root, 'src-core', 'index.ts') },
  });
}
