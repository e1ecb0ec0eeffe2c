/**
 * The spectrum view's webview page in headless Chromium, as VS Code would host it: the page from `spectrumViewHtml`
 * with a stand-in for `acquireVsCodeApi`, the editor theme's --vscode-* variables set on the root element (as VS Code
 * sets them), and the message the extension posts for a kernel (rendered in Node from sample data, the examples'
 * analysis). It must say it is ready, show the kernel with the engine's eigenvalues, take the theme's colours and
 * fonts, keep its state, raise no error under its strict content security policy and make no request.
 * Screenshots (dark and light themes, 1280 × 800 and 420 × 900) go to test-artifacts/pictures/.
 *
 * Skipped, with a message, when /usr/bin/chromium or playwright-core is missing.
 */
import { mkdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { analyzeText, fileKernelPictureData, type KernelPictureData } from '@kernwright/core';
import { showMessage, type ShowMessage } from '../../client/src/spectrumView/viewContent';
import { spectrumViewCsp, spectrumViewHtml } from '../../client/src/spectrumView/viewHtml';
import { chromiumMissing, evalIn, launchChromium, openGuarded, servePages, type Browser, type PageServer } from './browser';
import { countMarks, drawnEigenvalues } from './pictureMarks';

const repo = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..', '..');
const artifacts = path.join(repo, 'test-artifacts', 'pictures');
const nonce = 'k3rnWr1ghtT3stN0nce42xyz';

const missing = chromiumMissing();
if (missing) console.warn(`tests/pictures/spectrumView.test.ts skipped: missing ${missing}`);

/** A stand-in for the webview API: records posted messages and keeps the state on the window. */
const vscodeApi = `
  window.__posted = [];
  window.__state = undefined;
  window.acquireVsCodeApi = () => ({
    postMessage: (m) => window.__posted.push(m),
    getState: () => window.__state,
    setState: (s) => { window.__state = s; },
  });
`;

/** A few of the variables VS Code sets on a webview's root element, for a dark and a light theme. */
const themes = {
  dark: {
    '--vscode-editor-background': '#1f1f1f', '--vscode-editor-foreground': '#cccccc', '--vscode-descriptionForeground': '#9d9d9d',
    '--vscode-widget-border': '#313131', '--vscode-editorWidget-background': '#202020', '--vscode-errorForeground': '#f85149',
    '--vscode-testing-iconPassed': '#73c991', '--vscode-editorWarning-foreground': '#cca700',
    '--vscode-font-family': '"DejaVu Sans", sans-serif', '--vscode-font-size': '13px', '--vscode-editor-font-family': '"DejaVu Sans Mono", monospace',
  },
  light: {
    '--vscode-editor-background': '#ffffff', '--vscode-editor-foreground': '#3b3b3b', '--vscode-descriptionForeground': '#717171',
    '--vscode-widget-border': '#e5e5e5', '--vscode-editorWidget-background': '#f8f8f8', '--vscode-errorForeground': '#e51400',
    '--vscode-testing-iconPassed': '#388a34', '--vscode-editorWarning-foreground': '#bf8803',
    '--vscode-font-family': '"DejaVu Serif", serif', '--vscode-font-size': '13px', '--vscode-editor-font-family': '"DejaVu Sans Mono", monospace',
  },
} as const;

function setTheme(theme: Readonly<Record<string, string>>): string {
  return `(() => { for (const [k, v] of Object.entries(${JSON.stringify(theme)})) document.documentElement.style.setProperty(k, v); })()`;
}

function post(message: unknown): string {
  return `window.postMessage(${JSON.stringify(message)}, '*')`;
}

function kernelOf(file: string, name: string): KernelPictureData {
  const analysis = analyzeText(readFileSync(path.join(repo, file), 'utf8'), { eigenCount: 8, timeBudgetMs: 400 });
  const data = fileKernelPictureData(analysis, { points: 40 }).find((k) => k.report.name === name);
  if (!data) throw new Error(`no kernel ${name} in ${file}`);
  return data;
}

describe('the spectrum view page (no browser)', () => {
  it('declares a strict policy: nothing loads, style and script only by nonce', () => {
    const csp = spectrumViewCsp(nonce);
    expect(csp).toContain("default-src 'none'");
    expect(csp).toContain('img-src data:');
    expect(csp).toContain(`style-src 'nonce-${nonce}'`);
    expect(csp).toContain(`script-src 'nonce-${nonce}'`);
    expect(csp).not.toMatch(/unsafe|https?:|\*/);
    const html = spectrumViewHtml({ nonce });
    expect(html).toContain(`content="${csp}"`);
    expect(html.match(/<style nonce=/g)).toHaveLength(1);
    expect(html.match(/<script nonce=/g)).toHaveLength(1);
    expect(html).not.toMatch(/\sstyle="/);
  });

  it('refuses a nonce that is too short', () => {
    expect(() => spectrumViewHtml({ nonce: 'abc' })).toThrow(/nonce/);
  });
});

describe.skipIf(missing !== null)('the spectrum view in Chromium', () => {
  let browser: Browser;
  let server: PageServer;
  const shown = new Map<string, { data: KernelPictureData; message: ShowMessage }>();

  beforeAll(async () => {
    mkdirSync(artifacts, { recursive: true });
    for (const [file, name] of [['examples/pollen-dispersal.kw', 'breezy'], ['examples/coherent-beam.kw', 'coherence']] as const) {
      const data = kernelOf(file, name);
      const warnings: string[] = [];
      const message = await showMessage(data, file, false, { onWarning: (w) => warnings.push(w) });
      expect(warnings).toEqual([]);
      shown.set(name, { data, message });
    }
    server = await servePages(new Map([['view.html', spectrumViewHtml({ nonce })]]));
    browser = await launchChromium();
  });

  afterAll(async () => {
    await browser?.close();
    await server?.close();
  });

  for (const [name, scheme] of [['breezy', 'dark'], ['coherence', 'light']] as const) {
    it(`shows ${name} in a ${scheme} theme, as the extension posts it`, async () => {
      const { data, message } = shown.get(name)!;
      const url = server.url('view.html');
      for (const viewport of [{ width: 1280, height: 800 }, { width: 420, height: 900 }]) {
        const { page, requests, errors } = await openGuarded(browser, url, viewport, scheme, vscodeApi);
        try {
          await evalIn(page, setTheme(themes[scheme]));
          expect(await evalIn<unknown[]>(page, 'window.__posted')).toEqual([{ type: 'ready' }]);
          await evalIn(page, post(message));
          await page.waitForSelector('#content section.kw-kernel figure.kw-figure');
          expect(await page.textContent('#content h2')).toContain(name);
          expect(await page.textContent('#status')).toBe(message.status);
          // The engine's eigenvalues, all of them, with their values.
          const drawn = await drawnEigenvalues(page, '#content');
          const engine = data.report.spectrum!.eigenvalues;
          expect(drawn.map((d) => d?.re)).toEqual(engine.map((e) => e.re));
          expect(await countMarks(page, '#content', 'kernel_cells')).toBe((data.samples!.im ? 2 : 1) * 40 * 40);
          // The theme's colours and fonts, not the page's own.
          const look = await evalIn<{ bg: string; fg: string; font: string; axis: string }>(page, `(() => ({
            bg: getComputedStyle(document.body).backgroundColor,
            fg: getComputedStyle(document.body).color,
            font: getComputedStyle(document.body).fontFamily,
            axis: getComputedStyle(document.querySelector('#content .role-axis-title text')).fill,
          }))()`);
          expect(look.bg).toBe(scheme === 'dark' ? 'rgb(31, 31, 31)' : 'rgb(255, 255, 255)');
          expect(look.fg).toBe(scheme === 'dark' ? 'rgb(204, 204, 204)' : 'rgb(59, 59, 59)');
          expect(look.font).toContain(scheme === 'dark' ? 'DejaVu Sans' : 'DejaVu Serif');
          expect(look.axis).toBe(look.fg);
          // The content is kept for when the view is shown again.
          expect(await evalIn<{ kernel: string } | undefined>(page, 'window.__state')).toMatchObject({ kernel: name });
          expect(await evalIn<number>(page, 'document.documentElement.scrollWidth')).toBeLessThanOrEqual(viewport.width);
          await page.screenshot({ path: path.join(artifacts, `view-${name}-${viewport.width}x${viewport.height}-${scheme}.png`) });
          expect(requests).toEqual([]);
          expect(errors).toEqual([]);
        } finally {
          await page.close();
        }
      }
    });
  }

  it('a status message replaces the status line only', async () => {
    const { page, errors } = await openGuarded(browser, server.url('view.html'), { width: 800, height: 600 }, 'dark', vscodeApi);
    await evalIn(page, post(shown.get('breezy')!.message));
    await page.waitForSelector('#content figure');
    await evalIn(page, post({ type: 'status', text: 'The language server did not answer.' }));
    await page.waitForFunction('document.getElementById("status").textContent === "The language server did not answer."');
    expect(await page.$$eval('#content figure', (f) => f.length)).toBeGreaterThan(0);
    expect(errors).toEqual([]);
    await page.close();
  });

  it('the policy is enforced: an inline style attribute in posted content is refused (and the test sees it)', async () => {
    const { page, errors } = await openGuarded(browser, server.url('view.html'), { width: 800, height: 600 }, 'dark', vscodeApi);
    await evalIn(page, post({ type: 'show', kernel: 'x', status: '', html: '<p id="red" style="color: rgb(255, 0, 0)">red?</p>' }));
    await page.waitForSelector('#red');
    const colour = await evalIn<string>(page, 'getComputedStyle(document.getElementById("red")).color');
    expect(colour).not.toBe('rgb(255, 0, 0)');
    await page.waitForTimeout(200);
    expect(errors.join('\n')).toMatch(/Content Security Policy/i);
    await page.close();
  });
});
