// Builds the installable VS Code extension: bundles everything (scripts/build.mjs), copies the language server and
// its worker next to the extension's entry (client/dist/), and packs client/ with @vscode/vsce into
// dist/kernwright-vscode-<version>.vsix (or the path given as the first argument). The .vsix is self-contained: it
// needs neither this repository nor npm.
import { execFileSync } from 'node:child_process';
import { copyFileSync, mkdirSync, readFileSync, renameSync } from 'node:fs';
import { createRequire } from 'node:module';
import { fileURLToPath } from 'node:url';
import path from 'node:path';

const root = path.dirname(path.dirname(fileURLToPath(import.meta.url)));
const client = path.join(root, 'client');
const require = createRequire(import.meta.url);

execFileSync(process.execPath, [path.join(root, 'scripts', 'build.mjs'), 'server.js', 'worker.js', 'extension.js'], { stdio: 'inherit' });
mkdirSync(path.join(client, 'dist'), { recursive: true });
for (const file of ['server.js', 'worker.js']) {
  // Copied under a temporary name and renamed, so that a packaging run at the same time never zips half a file.
  const target = path.join(client, 'dist', file);
  copyFileSync(path.join(root, 'server', 'dist', file), `${target}.${process.pid}.tmp`);
  renameSync(`${target}.${process.pid}.tmp`, target);
}

const { name, version } = JSON.parse(readFileSync(path.join(client, 'package.json'), 'utf8'));
const out = process.argv[2] ? path.resolve(process.argv[2]) : path.join(root, 'dist', `${name}-${version}.vsix`);
mkdirSync(path.dirname(out), { recursive: true });
const vsce = path.join(path.dirname(require.resolve('@vscode/vsce/package.json')), 'vsce');
execFileSync(process.execPath, [vsce, 'package', '--no-dependencies', '--allow-missing-repository', '--out', out], {
  cwd: client,
  stdio: 'inherit',
});
console.log(out);
