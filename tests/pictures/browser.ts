/**
 * Headless Chromium for the picture tests, through playwright-core and Debian's /usr/bin/chromium (never a
 * downloaded browser). `chromiumMissing()` says what is absent so that a test file can skip with a clear message;
 * `servePages` serves fixed pages from 127.0.0.1 (so that the browser's request interception sees every request);
 * `openGuarded` opens a page that aborts and records any request other than the page itself and records every
 * console error and page error.
 */
import { existsSync, mkdtempSync, rmSync } from 'node:fs';
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import { createRequire } from 'node:module';
import os from 'node:os';
import path from 'node:path';
import type { BrowserContext, Page } from 'playwright-core';

export const chromiumPath = process.env.KERNWRIGHT_CHROMIUM ?? '/usr/bin/chromium';
const require = createRequire(import.meta.url);

export function chromiumMissing(): string | null {
  const missing: string[] = [];
  if (!existsSync(chromiumPath)) missing.push(`${chromiumPath} (apt-get install chromium fonts-dejavu-core)`);
  try {
    require.resolve('playwright-core');
  } catch {
    missing.push('playwright-core (npm install)');
  }
  return missing.length > 0 ? missing.join(', ') : null;
}

export interface Browser {
  readonly context: BrowserContext;
  close(): Promise<void>;
}

export async function launchChromium(): Promise<Browser> {
  const { chromium } = await import('playwright-core');
  const profile = mkdtempSync(path.join(os.tmpdir(), 'kw-pictures-profile-'));
  const context = await chromium.launchPersistentContext(profile, {
    executablePath: chromiumPath,
    headless: true,
    args: ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking',
      '--disable-component-update', '--disable-sync'],
  });
  return {
    context,
    async close() {
      await context.close();
      rmSync(profile, { recursive: true, force: true });
    },
  };
}

export interface GuardedPage {
  readonly page: Page;
  /** Requests other than the page itself (each was aborted). */
  readonly requests: string[];
  /** Console errors and uncaught page errors. */
  readonly errors: string[];
}

/**
 * A new page at the given viewport and colour scheme, opened on `url` (with `init`, a script run before the page's
 * own). Every request other than `url` is aborted
 * and recorded (a `request` listener records too, as a second net for requests routing does not see).
 */
export async function openGuarded(browser: Browser, url: string, viewport: { width: number; height: number }, colorScheme: 'light' | 'dark',
  init?: string): Promise<GuardedPage> {
  const page = await browser.context.newPage();
  await page.setViewportSize(viewport);
  await page.emulateMedia({ colorScheme });
  const requests: string[] = [];
  const errors: string[] = [];
  const record = (u: string) => {
    if (u !== url && !requests.includes(u)) requests.push(u);
  };
  page.on('console', (m) => {
    if (m.type() === 'error') errors.push(m.text());
  });
  page.on('pageerror', (e) => errors.push(e.message));
  page.on('request', (r) => record(r.url()));
  await page.route('**', (route) => {
    const u = route.request().url();
    if (u === url) return route.continue();
    record(u);
    return route.abort();
  });
  if (init) await page.addInitScript({ content: init });
  await page.goto(url, { waitUntil: 'load' });
  return { page, requests, errors };
}

export interface PageServer {
  url(name: string): string;
  close(): Promise<void>;
}

/** Serves `pages` (name → HTML) at http://127.0.0.1:PORT/NAME; anything else is a 404. */
export async function servePages(pages: ReadonlyMap<string, string>): Promise<PageServer> {
  const server = http.createServer((req, res) => {
    const name = decodeURIComponent((req.url ?? '/').slice(1));
    const body = pages.get(name);
    if (body === undefined) {
      res.writeHead(404, { 'content-type': 'text/plain' });
      res.end('not found');
      return;
    }
    res.writeHead(200, { 'content-type': 'text/html; charset=utf-8' });
    res.end(body);
  });
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const port = (server.address() as AddressInfo).port;
  return {
    url: (name) => `http://127.0.0.1:${port}/${encodeURIComponent(name)}`,
    // The browser keeps its connections alive: drop them, or close() would wait for them to time out.
    close: () => new Promise<void>((resolve) => {
      server.close(() => resolve());
      server.closeAllConnections();
    }),
  };
}

/**
 * Evaluates a JavaScript expression in the page. Written as text because the tests are compiled without the DOM
 * library: the browser's `document` and `window` exist only on the page side.
 */
export async function evalIn<T>(page: Page, expression: string): Promise<T> {
  return (await page.evaluate(expression)) as T;
}
