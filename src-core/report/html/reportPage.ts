/**
 * The self-contained HTML report of one kernel file: inline CSS and inline SVG only (no script, no external
 * request), a table of contents, one section per kernel. Readable at any width (the figure grid reflows) and in
 * light or dark mode (by `prefers-color-scheme`).
 */
import { escapeHtml } from './escape';
import { kernelSectionHtml, sectionId, type KernelSection } from './kernelSection';
import { figureCss, standaloneThemeCss } from './pageStyle';

export interface ReportPage {
  /** The file as the user named it. */
  readonly source: string;
  /** The program and its version, e.g. `kernwright 0.1.0`. */
  readonly generator: string;
  /** One line under the title (e.g. how many kernels, diagnostics). */
  readonly summary: string;
  readonly kernels: readonly KernelSection[];
}

/** The content security policy the page declares: nothing may load; only the inline style runs. */
export const reportContentSecurityPolicy = "default-src 'none'; style-src 'unsafe-inline'; img-src data:";

export function reportPageHtml(page: ReportPage): string {
  const toc = page.kernels.length > 1
    ? `<nav aria-label="Kernels"><ul class="kw-toc">${page.kernels
      .map((k, i) => `<li><a href="#${sectionId(k.name, i)}">${escapeHtml(k.name)}</a></li>`)
      .join('')}</ul></nav>`
    : '';
  return [
    '<!DOCTYPE html>',
    '<html lang="en">',
    '<head>',
    '<meta charset="utf-8">',
    `<meta http-equiv="Content-Security-Policy" content="${reportContentSecurityPolicy}">`,
    '<meta name="viewport" content="width=device-width, initial-scale=1">',
    '<meta name="color-scheme" content="light dark">',
    `<meta name="generator" content="${escapeHtml(page.generator)}">`,
    `<title>${escapeHtml(page.source)}: kernel pictures</title>`,
    `<style>${standaloneThemeCss}${figureCss}</style>`,
    '</head>',
    '<body>',
    '<main class="kw-page">',
    '<header>',
    `<h1>${escapeHtml(page.source)}</h1>`,
    `<p>${escapeHtml(page.summary)} · made by ${escapeHtml(page.generator)}</p>`,
    toc,
    '</header>',
    ...page.kernels.map((k, i) => kernelSectionHtml(k, i)),
    '</main>',
    '</body>',
    '</html>',
    '',
  ].join('\n');
}
