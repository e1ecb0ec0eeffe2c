/**
 * Neovim (headless, 0.7 or later) as an independent LSP client of the bundled server: diagnostics of both stages,
 * a hover with the kernel's figures, and a quick fix applied through the protocol (tests/e2e/neovim/drive.lua).
 * Skipped, with a message, when `nvim` is not installed (tests/e2e/setup.sh installs it).
 */
import { execFileSync, spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, writeFileSync, mkdirSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';

const root = path.resolve(__dirname, '..', '..');
const nvim = spawnSync('nvim', ['--version'], { encoding: 'utf8' });
const available = nvim.status === 0;
if (!available) console.warn('tests/e2e/neovim.test.ts skipped: `nvim` not found (run tests/e2e/setup.sh to install it)');

describe.skipIf(!available)('Neovim as an LSP client', () => {
  beforeAll(() => {
    execFileSync(process.execPath, [path.join(root, 'scripts', 'build.mjs'), 'server.js', 'worker.js'], { cwd: root, stdio: 'inherit' });
  });

  it('shows both stages of diagnostics, hovers a kernel and applies a quick fix', () => {
    const dir = mkdtempSync(path.join(os.tmpdir(), 'kw-nvim-'));
    const home = path.join(dir, 'home');
    mkdirSync(home);
    const file = path.join(dir, 'gauge.kw');
    writeFileSync(file, [
      '# Invented scenario: a fictional gauge line, with a misspelt constant and a false claim.',
      'domain [0, 1]',
      'const width = 0.5',
      'kernel gauge(t, s) = exp(-abs(t - s) / widht)',
      'kernel channel(t, s) = exp(-t) * s',
      '  expect hermitian',
      '',
    ].join('\n'));
    const out = path.join(dir, 'results.json');
    const run = spawnSync('nvim', ['--headless', '-u', 'NONE', '-i', 'NONE', '-n', '-c', `luafile ${path.join(__dirname, 'neovim', 'drive.lua')}`], {
      encoding: 'utf8',
      timeout: 150_000,
      input: '',
      env: {
        ...process.env,
        HOME: home, XDG_CONFIG_HOME: path.join(home, 'config'), XDG_DATA_HOME: path.join(home, 'data'),
        XDG_STATE_HOME: path.join(home, 'state'), XDG_CACHE_HOME: path.join(home, 'cache'),
        KW_SERVER: path.join(root, 'server', 'dist', 'server.js'), KW_FILE: file, KW_OUT: out, KW_NODE: process.execPath,
      },
    });
    const results = JSON.parse(readFileSync(out, 'utf8')) as {
      ok: boolean; error?: string; first: string[]; second: string[]; hover: string; actions: string[]; applied: string; after: string[]; text: string;
    };
    expect(results.error ?? '', run.stderr).toBe('');
    expect(results.ok).toBe(true);
    expect(results.first).toContain('KW201');
    expect(results.first).not.toContain('KW601');
    expect(results.second).toContain('KW601');
    expect(results.hover).toContain('kernel channel(t, s)');
    expect(results.hover).toMatch(/\| ‖T‖ \| [\d.e-]+ ± [\d.e-]+ in /u);
    expect(results.hover).toMatch(/\| λ₁ \| [\d.e-]+ ± [\d.e-]+ \|/u);
    expect(results.actions).toContain('Change to “width”');
    expect(results.after).not.toContain('KW201');
    expect(results.text).toContain('exp(-abs(t - s) / width)');
  }, 180_000);
});
