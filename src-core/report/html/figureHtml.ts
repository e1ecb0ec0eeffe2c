/**
 * One figure as an HTML fragment: a `<figure>` holding the title, the inline SVG, the caption and the table of the
 * numbers the picture shows (each already written with its error).
 */
import type { FigureTable, RenderedFigure } from '../plots/plotTypes';
import { escapeHtml } from './escape';
import { inlineSvg } from './inlineSvg';

/** Tables longer than this are folded into a <details> element (open it to read them; no script involved). */
export const foldedRows = 8;

export function tableHtml(table: FigureTable): string {
  const head = `<tr>${table.columns.map((c) => `<th scope="col">${escapeHtml(c)}</th>`).join('')}</tr>`;
  const body = table.rows
    .map((row) => `<tr>${row.map((cell, i) => (i === 0 ? `<th scope="row">${escapeHtml(cell)}</th>` : `<td>${escapeHtml(cell)}</td>`)).join('')}</tr>`)
    .join('\n');
  const html = `<table class="kw-table" aria-label="${escapeHtml(table.caption)}">\n<thead>${head}</thead>\n<tbody>\n${body}\n</tbody>\n</table>`;
  if (table.rows.length <= foldedRows) return html;
  return `<details class="kw-details">\n<summary>${escapeHtml(table.caption)}</summary>\n${html}\n</details>`;
}

/** `id` must be unique on the page (it prefixes the ids inside the SVG). */
export function figureHtml(figure: RenderedFigure, id: string): string {
  const parts = [
    `<figure class="kw-figure" id="${escapeHtml(id)}" data-kind="${escapeHtml(figure.kind)}">`,
    `<h3>${escapeHtml(figure.title)}</h3>`,
    `<div class="kw-plot">${inlineSvg(figure.svg, id, figure.title)}</div>`,
    `<figcaption>${escapeHtml(figure.caption)}</figcaption>`,
  ];
  for (const table of figure.tables) if (table.rows.length > 0) parts.push(tableHtml(table));
  parts.push('</figure>');
  return parts.join('\n');
}
