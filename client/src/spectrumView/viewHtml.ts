/**
 * The spectrum view's page: a strict content security policy (nothing may load; the one inline style and the one
 * inline script run by nonce), styles that take the editor theme's fonts and colours from its --vscode-* variables,
 * and a few lines of script that put the HTML the extension posts into the page. Pure: a string out, no vscode.
 *
 * Messages, extension → view:
 *   {type: 'show', kernel, html, status}   replace the content with one kernel's section (rendered SVG and tables)
 *   {type: 'status', text}                 replace the status line only
 * view → extension:
 *   {type: 'ready'}                        the page has loaded (or reloaded after being hidden): post the content
 * The last content is kept with the webview state, so the view shows it at once when it is shown again.
 */
import { escapeHtml, figureCss } from '@kernwright/core';

/** The policy: no network, no other origin, no plug-ins; images only as data: URLs. */
export function spectrumViewCsp(nonce: string): string {
  return [
    "default-src 'none'",
    'img-src data:',
    `style-src 'nonce-${nonce}'`,
    `script-src 'nonce-${nonce}'`,
    "base-uri 'none'",
    "form-action 'none'",
  ].join('; ');
}

/** The editor theme behind the figure styles' variables (with fall-backs for themes that lack one). */
export const editorThemeCss = `
:root {
  --kw-bg: var(--vscode-editor-background);
  --kw-fg: var(--vscode-editor-foreground);
  --kw-muted: var(--vscode-descriptionForeground);
  --kw-border: var(--vscode-widget-border, var(--vscode-panel-border, rgba(128, 128, 128, 0.35)));
  --kw-card: var(--vscode-editorWidget-background, var(--vscode-editor-background));
  --kw-good: var(--vscode-testing-iconPassed, var(--vscode-charts-green));
  --kw-bad: var(--vscode-errorForeground);
  --kw-undecided: var(--vscode-editorWarning-foreground);
  --kw-font: var(--vscode-font-family);
  --kw-mono: var(--vscode-editor-font-family);
}
body {
  margin: 0;
  padding: 4px 16px 24px;
  background: var(--kw-bg);
  color: var(--kw-fg);
  font-family: var(--kw-font);
  font-size: var(--vscode-font-size, 13px);
  line-height: 1.45;
}
#status { margin: 8px 0 0; color: var(--kw-muted); font-size: 0.92em; min-height: 1.2em; }
#content .kw-kernel { margin-top: 8px; border-top: none; padding-top: 0; }
a { color: var(--vscode-textLink-foreground); }
:focus-visible { outline: 1px solid var(--vscode-focusBorder); outline-offset: 1px; }
`;

/** The script, run once when the page loads. Only `innerHTML` of content the extension rendered; no eval. */
export const viewScript = `
(function () {
  const vscode = acquireVsCodeApi();
  const content = document.getElementById('content');
  const status = document.getElementById('status');
  let current = null;
  function show(m) {
    const keep = m.kernel === current ? window.scrollY : 0;
    content.innerHTML = m.html;
    current = m.kernel;
    status.textContent = typeof m.status === 'string' ? m.status : '';
    window.scrollTo(0, keep);
  }
  const saved = vscode.getState();
  if (saved && typeof saved.html === 'string') show(saved);
  window.addEventListener('message', function (event) {
    const m = event.data;
    if (!m || typeof m !== 'object') return;
    if (m.type === 'show' && typeof m.html === 'string' && typeof m.kernel === 'string') {
      show(m);
      vscode.setState({ html: m.html, kernel: m.kernel, status: m.status });
    } else if (m.type === 'status' && typeof m.text === 'string') {
      status.textContent = m.text;
    }
  });
  vscode.postMessage({ type: 'ready' });
})();
`;

export interface ViewPageOptions {
  /** A fresh random string per page (letters and digits). */
  readonly nonce: string;
  /** Shown until the first content arrives. */
  readonly waiting?: string;
}

export function spectrumViewHtml(options: ViewPageOptions): string {
  const { nonce } = options;
  if (!/^[A-Za-z0-9+/=]{16,}$/.test(nonce)) throw new Error('the nonce must be at least 16 letters or digits');
  return [
    '<!DOCTYPE html>',
    '<html lang="en">',
    '<head>',
    '<meta charset="utf-8">',
    `<meta http-equiv="Content-Security-Policy" content="${spectrumViewCsp(nonce)}">`,
    '<meta name="viewport" content="width=device-width, initial-scale=1">',
    '<title>Kernel spectrum</title>',
    `<style nonce="${nonce}">${editorThemeCss}${figureCss}</style>`,
    '</head>',
    '<body>',
    `<p id="status" role="status" aria-live="polite">${escapeHtml(options.waiting ?? 'Waiting for the analysis…')}</p>`,
    '<main id="content"></main>',
    `<script nonce="${nonce}">${viewScript}</script>`,
    '</body>',
    '</html>',
    '',
  ].join('\n');
}
