/**
 * The packaged extension in a real VS Code: builds the .vsix (npm run package), installs it into code-server 4.100.3
 * (VS Code 1.100 in the browser), opens kernel files in headless Chromium through playwright-core, and checks what a
 * user sees: squiggles, the problems list, the code lens, and a hover with the norm and eigenvalues. Screenshots go
 * to test-artifacts/vscode-*.png.
 *
 * Skipped, with a message, when code-server (.cache/e2e/cs, installed by tests/e2e/setup.sh), /usr/bin/chromium or
 * playwright-core is missing.
 */
import { execFileSync, spawn, type ChildProcess } from 'node:child_process';
import { copyFileSync, existsSync, mkdirSync, mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import net from 'node:net';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';

const root = path.resolve(__dirname, '..', '..');
const e2e = process.env.KERNWRIGHT_E2E_DIR ?? path.join(root, '.cache', 'e2e');
const codeServer = path.join(e2e, 'cs', 'node_modules', '.bin', 'code-server');
const chromiumPath = '/usr/bin/chromium';
const artifacts = path.join(root, 'test-artifacts');

function playwrightAvailable(): boolean {
  try {
    require.resolve('playwright-core');
    return true;
  } catch {
    return false;
  }
}

const missing = [
  existsSync(codeServer) ? null : `code-server (${codeServer})`,
  existsSync(chromiumPath) ? null : chromiumPath,
  playwrightAvailable() ? null : 'playwright-core',
].filter(Boolean);
if (missing.length > 0) console.warn(`tests/e2e/vscode.test.ts skipped: missing ${missing.join(', ')} (run tests/e2e/setup.sh)`);

function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const server = net.createServer();
    server.once('error', reject);
    server.listen(0, '127.0.0.1', () => {
      const port = (server.address() as net.AddressInfo).port;
      server.close(() => resolve(port));
    });
  });
}

async function waitForHealth(port: number, timeoutMs: number): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    try {
      const r = await fetch(`http://127.0.0.1:${port}/healthz`);
      if (r.ok) return;
    } catch {
      // not up yet
    }
    await new Promise((r) => setTimeout(r, 250));
  }
  throw new Error(`code-server did not answer on port ${port}`);
}

describe.skipIf(missing.length > 0)('the extension in VS Code (code-server)', () => {
  // A folder of its own for each run (made in beforeAll), so that runs started at the same time share nothing.
  let run = '';
  let env: NodeJS.ProcessEnv = {};
  let userData = '';
  let extensions = '';
  let folder = '';
  let server: ChildProcess | null = null;
  let port = 0;

  beforeAll(async () => {
    mkdirSync(path.join(e2e, 'runs'), { recursive: true });
    run = mkdtempSync(path.join(e2e, 'runs', 'run-'));
    env = {
      ...process.env,
      HOME: path.join(run, 'home'),
      XDG_CONFIG_HOME: path.join(run, 'xdg', 'config'),
      XDG_DATA_HOME: path.join(run, 'xdg', 'data'),
      XDG_CACHE_HOME: path.join(run, 'xdg', 'cache'),
      XDG_STATE_HOME: path.join(run, 'xdg', 'state'),
      PLAYWRIGHT_BROWSERS_PATH: path.join(e2e, 'xdg', 'pw'),
      PLAYWRIGHT_SKIP_BROWSER_DOWNLOAD: '1',
    };
    userData = path.join(run, 'user-data');
    extensions = path.join(run, 'extensions');
    folder = path.join(run, 'workspace');
    for (const d of ['home', 'xdg/config', 'xdg/data', 'xdg/cache', 'xdg/state', 'user-data/User', 'extensions', 'workspace', 'profile']) {
      mkdirSync(path.join(run, d), { recursive: true });
    }
    mkdirSync(artifacts, { recursive: true });
    const vsix = path.join(run, 'kernwright-vscode.vsix');
    execFileSync(process.execPath, [path.join(root, 'scripts', 'package.mjs'), vsix], { cwd: root, stdio: 'inherit' });
    copyFileSync(path.join(root, 'examples', 'broken', 'not-symmetric.kw'), path.join(folder, 'not-symmetric.kw'));
    copyFileSync(path.join(root, 'examples', 'soil-moisture.kw'), path.join(folder, 'soil-moisture.kw'));
    writeFileSync(path.join(userData, 'User', 'settings.json'), JSON.stringify({
      'workbench.startupEditor': 'none',
      'workbench.tips.enabled': false,
      'workbench.enableExperiments': false,
      'workbench.reduceMotion': 'on',
      'telemetry.telemetryLevel': 'off',
      'update.mode': 'none',
      'extensions.autoCheckUpdates': false,
      'extensions.autoUpdate': false,
      'security.workspace.trust.enabled': false,
      'editor.hover.delay': 100,
      'editor.hover.above': false,
      'editor.minimap.enabled': false,
      'window.restoreWindows': 'none',
      'chat.commandCenter.enabled': false,
      'git.enabled': false,
      'git.openRepositoryInParentFolders': 'never',
    }, null, 2));
    port = await freePort();
    const config = path.join(run, 'config.yaml');
    writeFileSync(config, `bind-addr: 127.0.0.1:${port}\nauth: none\ncert: false\n`);
    execFileSync(codeServer, ['--config', config, '--user-data-dir', userData, '--extensions-dir', extensions, '--install-extension', vsix, '--force'], {
      env, stdio: 'inherit', timeout: 180_000,
    });
    server = spawn(codeServer, [
      '--config', config, '--bind-addr', `127.0.0.1:${port}`, '--auth', 'none', '--disable-telemetry', '--disable-update-check',
      '--disable-workspace-trust', '--disable-getting-started-override', '--user-data-dir', userData, '--extensions-dir', extensions, folder,
    ], { env, detached: true, stdio: 'ignore' });
    await waitForHealth(port, 120_000);
  }, 600_000);

  afterAll(async () => {
    if (server?.pid) {
      try {
        process.kill(-server.pid, 'SIGTERM');
      } catch {
        // already gone
      }
      await new Promise((r) => setTimeout(r, 1000));
    }
    if (run) rmSync(run, { recursive: true, force: true, maxRetries: 5, retryDelay: 500 });
  });

  it('shows squiggles, problems, the code lens and a hover with the figures', async () => {
    const { chromium } = await import('playwright-core');
    const context = await chromium.launchPersistentContext(path.join(run, 'profile'), {
      executablePath: chromiumPath,
      headless: true,
      viewport: { width: 1360, height: 900 },
      args: ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking',
        '--disable-component-update', '--disable-sync'],
    });
    const page = context.pages()[0] ?? (await context.newPage());
    try {
      await page.goto(`http://127.0.0.1:${port}/?folder=${encodeURIComponent(folder)}`);
      await page.waitForSelector('.monaco-workbench', { timeout: 120_000 });

      const open = async (name: string) => {
        const row = page.locator('.explorer-folders-view .monaco-list-row', { hasText: name }).first();
        await row.waitFor({ timeout: 60_000 });
        await row.dblclick();
        await page.locator('.tab.active', { hasText: name }).waitFor({ timeout: 60_000 });
      };

      // A file with a failed claim: an error squiggle from the numerical stage, the code lens above the kernel.
      await open('not-symmetric.kw');
      await page.waitForSelector('.monaco-editor .squiggly-error', { timeout: 120_000 });
      const lens = page.locator('.monaco-editor .codelens-decoration', { hasText: '‖T‖' }).first();
      await lens.waitFor({ timeout: 120_000 });
      expect(await lens.innerText()).toMatch(/‖T‖ = [\d.e-]+ ± [\d.e-]+ · λ₁ = [\d.e-]+ ± /u);
      await page.screenshot({ path: path.join(artifacts, 'vscode-squiggles.png') });

      // The problems list.
      await page.keyboard.press('Control+Shift+M');
      const rows = page.locator('.markers-panel .monaco-list-row');
      await rows.first().waitFor({ timeout: 60_000 });
      const problems = (await rows.allInnerTexts()).join('\n');
      expect(problems).toContain('KW601');
      expect(problems).toContain('Claimed “hermitian”');
      await page.screenshot({ path: path.join(artifacts, 'vscode-problems.png') });

      // Clicking the code lens shows every figure of the kernel in the output channel.
      await page.locator('.monaco-editor .codelens-decoration a', { hasText: '‖T‖' }).first().click();
      // (The output view renders only the lines in sight, with no-break spaces: look for the norm with its error.)
      const output = page.locator('.panel .monaco-editor .view-lines', { hasText: /operator\snorm\s+0\.3796\d*\s±\s\d/u }).first();
      await output.waitFor({ timeout: 60_000 });
      const listing = (await output.innerText()).replace(/\u00a0/gu, ' ');
      expect(listing).toMatch(/operator norm\s+0\.3796\d* ± [\d.e-]+ in \[0\.3796\d*, 0\.3796\d*\]/u);
      expect(listing).toMatch(/λ₁\s+0\.26424\d* ± [\d.e-]+/u);
      await page.screenshot({ path: path.join(artifacts, 'vscode-figures.png') });
      await page.keyboard.press('Control+J'); // hide the panel again

      // Hover a kernel name: properties, norm with its bracket, eigenvalues with errors.
      await open('soil-moisture.kw');
      await page.locator('.monaco-editor .codelens-decoration', { hasText: '‖T‖' }).first().waitFor({ timeout: 120_000 });
      const name = page.locator('.monaco-editor .view-line span', { hasText: /^moisture_smooth$/u }).first();
      await name.waitFor({ timeout: 60_000 });
      const hoverBox = page.locator('.monaco-hover-content', { hasText: '‖T‖' }).first();
      for (let attempt = 0; attempt < 5 && !(await hoverBox.isVisible()); attempt++) {
        const box = (await name.boundingBox())!;
        await page.mouse.move(box.x + 5, box.y + box.height / 2);
        await page.mouse.move(box.x + box.width / 2, box.y + box.height / 2);
        await hoverBox.waitFor({ timeout: 10_000 }).catch(() => undefined);
      }
      const hover = await hoverBox.innerText();
      expect(hover).toContain('kernel moisture_smooth(t, s)');
      expect(hover).toMatch(/‖T‖\s+[\d.e-]+ ± [\d.e-]+ in \[/u);
      expect(hover).toMatch(/λ₁\s+[\d.e-]+ ± [\d.e-]+\s+λ₂\s+[\d.e-]+ ± /u);
      expect(hover).toContain('positive ✓');
      await page.screenshot({ path: path.join(artifacts, 'vscode-hover.png') });
    } catch (error) {
      await page.screenshot({ path: path.join(artifacts, 'vscode-failure.png') }).catch(() => undefined);
      throw error;
    } finally {
      await context.close();
    }
    // The extension host's log names no error of ours while the window was open (requests that race the shutdown
    // of the closing window are not ours to judge).
    const logs = readdirSync(path.join(userData, 'logs'), { recursive: true }).map(String).filter((f) => f.endsWith('remoteexthost.log'));
    const text = logs.map((f) => readFileSync(path.join(userData, 'logs', f), 'utf8').split('Extension host terminating')[0]).join('\n');
    expect(text).not.toMatch(/kernwright[^\n]*(Error|failed)/iu);
  }, 600_000);
});
