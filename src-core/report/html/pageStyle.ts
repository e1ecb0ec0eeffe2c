/**
 * The style of the pictures' pages. `figureCss` lays out sections and figures and restyles the SVG text and axes
 * through a handful of custom properties (--kw-fg, --kw-muted, --kw-border, --kw-card, --kw-bg, --kw-good,
 * --kw-bad, --kw-font); `standaloneThemeCss` gives them light and dark values by `prefers-color-scheme` for the
 * HTML report, while the editor view maps them to the editor theme's variables instead.
 *
 * SVG presentation attributes (fill="#7f7f7f") yield to any CSS rule, which is how axis labels, ticks, legend
 * text and the legend symbols of the black overlay marks take the page's colours here. The heat-map colours and the curve colours stay as drawn: they were
 * chosen to read on both backgrounds (see plots/palette.ts).
 */

export const standaloneThemeCss = `
:root {
  color-scheme: light dark;
  --kw-bg: #fbfbf9;
  --kw-fg: #1d2126;
  --kw-muted: #5b6470;
  --kw-border: #d5d9de;
  --kw-card: #ffffff;
  --kw-good: #1d7a46;
  --kw-bad: #b3261e;
  --kw-undecided: #8a5a00;
  --kw-font: system-ui, -apple-system, "Segoe UI", "DejaVu Sans", Roboto, sans-serif;
  --kw-mono: ui-monospace, "DejaVu Sans Mono", Menlo, Consolas, monospace;
}
@media (prefers-color-scheme: dark) {
  :root {
    --kw-bg: #15171b;
    --kw-fg: #e3e6ea;
    --kw-muted: #a3abb5;
    --kw-border: #353a42;
    --kw-card: #1d2026;
    --kw-good: #5cc78b;
    --kw-bad: #ff8a80;
    --kw-undecided: #e6b85c;
  }
}
body {
  margin: 0;
  background: var(--kw-bg);
  color: var(--kw-fg);
  font: 15px/1.45 var(--kw-font);
}
.kw-page { max-width: 1400px; margin: 0 auto; padding: 20px 24px 48px; }
.kw-page > header h1 { font-size: 1.5rem; margin: 0 0 4px; font-weight: 600; }
.kw-page > header p { margin: 0; color: var(--kw-muted); }
.kw-toc { margin: 14px 0 4px; padding: 0; list-style: none; display: flex; flex-wrap: wrap; gap: 6px 14px; }
.kw-toc a { color: inherit; }
a:focus-visible { outline: 2px solid currentColor; outline-offset: 2px; }
@media (max-width: 520px) {
  .kw-page { padding: 12px 10px 32px; }
  body { font-size: 14px; }
}
`;

export const figureCss = `
.kw-kernel { margin-top: 28px; border-top: 1px solid var(--kw-border); padding-top: 12px; }
.kw-kernel-head { display: flex; flex-wrap: wrap; align-items: baseline; gap: 4px 14px; }
.kw-kernel h2 { font-size: 1.25rem; margin: 0; font-weight: 600; overflow-wrap: anywhere; }
.kw-kernel-word { color: var(--kw-muted); font-weight: normal; }
.kw-domain { margin: 0; color: var(--kw-muted); }
.kw-properties, .kw-notes { list-style: none; padding: 0; margin: 8px 0 0; display: flex; flex-wrap: wrap; gap: 6px 8px; }
.kw-property { border: 1px solid var(--kw-border); border-radius: 999px; padding: 1px 10px; font-size: 0.9em; }
.kw-property .kw-sign { font-weight: 700; }
.kw-holds .kw-sign { color: var(--kw-good); }
.kw-fails .kw-sign { color: var(--kw-bad); }
.kw-undecided .kw-sign { color: var(--kw-undecided); }
.kw-figure-text { color: var(--kw-muted); }
.kw-notes { display: block; }
.kw-notes li { color: var(--kw-muted); font-size: 0.9em; margin: 2px 0; }
.kw-figures {
  display: grid;
  grid-template-columns: repeat(auto-fill, minmax(min(100%, 340px), 1fr));
  gap: 14px;
  margin-top: 12px;
  align-items: start;
}
.kw-figure {
  margin: 0;
  padding: 10px 12px 12px;
  border: 1px solid var(--kw-border);
  border-radius: 8px;
  background: var(--kw-card);
  min-width: 0;
}
.kw-figure h3 { font-size: 1rem; font-weight: 600; margin: 0 0 6px; }
.kw-plot svg { display: block; max-width: 100%; height: auto; margin: 0 auto; }
.kw-plot svg text { fill: var(--kw-fg); font-family: var(--kw-font); }
.kw-plot svg .role-axis-label text, .kw-plot svg .role-legend-label text { fill: var(--kw-muted); }
.kw-plot svg .role-axis-domain line, .kw-plot svg .role-axis-tick line { stroke: var(--kw-muted); }
.kw-plot svg .role-axis-grid line { stroke: var(--kw-muted); }
.kw-plot svg .role-legend-symbol path[stroke="#7f7f7f"] { stroke: var(--kw-muted); }
.kw-plot svg .role-legend-symbol path[fill="#000000"] { fill: var(--kw-fg); }
.kw-plot svg .role-legend-symbol path[stroke="#000000"] { stroke: var(--kw-fg); }
.kw-figure figcaption { font-size: 0.86em; color: var(--kw-muted); margin-top: 6px; }
.kw-table { border-collapse: collapse; margin-top: 8px; font-size: 0.84em; width: 100%; }
.kw-table th, .kw-table td { text-align: left; padding: 2px 8px 2px 0; border-bottom: 1px solid var(--kw-border); vertical-align: top; }
.kw-table thead th { color: var(--kw-muted); font-weight: normal; }
.kw-table tbody th { font-weight: normal; white-space: nowrap; }
.kw-table td { font-family: var(--kw-mono); font-size: 0.95em; overflow-wrap: anywhere; }
.kw-details { margin-top: 8px; font-size: 0.9em; }
.kw-details summary { cursor: pointer; color: var(--kw-muted); }
.kw-details .kw-table { margin-top: 4px; }
`;
