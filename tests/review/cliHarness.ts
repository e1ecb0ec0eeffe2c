/**
 * Runs the command-line program as a user runs it. The program is bundled exactly as scripts/build.mjs bundles it
 * (server/src/cli/main.ts → cli.js and checkWorker.ts → checkWorker.js, side by side) but into a folder of this
 * test file's own, so that test files running at the same time never read a bundle another one is rewriting.
 */
import { spawnSync, type SpawnSyncOptions } from 'node:child_process';
import * as fs from 'node:fs';
import * as os from 'node:os';
import * as path from 'node:path';
import { fileURLToPath } from 'node:url';
import { build } from 'esbuild';
import { expect } from 'vitest';

export const repo = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..', '..');

export interface Run {
  readonly status: number | null;
  readonly stdout: string;
  readonly stderr: string;
}

export interface Harness {
  readonly cli: string;
  readonly dir: string;
  run(cwd: string, args: readonly string[], options?: { env?: NodeJS.ProcessEnv; input?: string }): Run;
  dispose(): void;
}

export async function bundleCli(): Promise<Harness> {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'kw-bundle-'));
  const common = {
    bundle: true,
    platform: 'node' as const,
    target: 'node20',
    format: 'cjs' as const,
    logLevel: 'warning' as const,
    alias: {
      '@kernwright/core': path.join(repo, 'src-core', 'index.ts'),
      // as in scripts/build.mjs: vega's optional canvas renderer cannot be bundled as CommonJS, and only SVG is drawn
      'vega-canvas': path.join(repo, 'server', 'src', 'pictures', 'noCanvas.ts'),
    },
  };
  await build({ ...common, entryPoints: [path.join(repo, 'server/src/cli/main.ts')], outfile: path.join(dir, 'cli.js') });
  await build({ ...common, entryPoints: [path.join(repo, 'server/src/cli/checkWorker.ts')], outfile: path.join(dir, 'checkWorker.js') });
  const cli = path.join(dir, 'cli.js');
  return {
    cli,
    dir,
    run(cwd, args, options = {}) {
      const spawnOptions: SpawnSyncOptions = {
        cwd,
        encoding: 'utf8',
        timeout: 300_000,
        env: { ...process.env, NO_COLOR: undefined, FORCE_COLOR: undefined, ...options.env },
        input: options.input,
      };
      const r = spawnSync(process.execPath, [cli, ...args], spawnOptions);
      return { status: r.status, stdout: String(r.stdout), stderr: String(r.stderr) };
    },
    dispose() {
      fs.rmSync(dir, { recursive: true, force: true });
    },
  };
}

/** A one-line error on stderr with the documented exit code, nothing on stdout and no stack trace. */
export function expectCleanFailure(r: Run, status: number, pattern: RegExp): void {
  expect(r.status).toBe(status);
  expect(r.stdout).toBe('');
  const lines = r.stderr.trimEnd().split('\n');
  for (const line of lines) expect(line).toMatch(/^kernwright: /);
  expect(r.stderr).toMatch(pattern);
  expect(r.stderr).not.toMatch(/\n\s+at .+\(.+:\d+:\d+\)/);
}

export function writeTree(root: string, files: Readonly<Record<string, string | Uint8Array>>): void {
  for (const [rel, content] of Object.entries(files)) {
    const file = path.join(root, rel);
    fs.mkdirSync(path.dirname(file), { recursive: true });
    fs.writeFileSync(file, content);
  }
}

export function fixture(name: string, version: 'old' | 'new'): string {
  return fs.readFileSync(path.join(repo, 'tests', 'review', 'fixtures', name, `${version}.kw`), 'utf8');
}
