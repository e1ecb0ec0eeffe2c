/**
 * An SVG document prepared for inlining into a page that holds many of them: every `id` (legend gradients, clip
 * paths) and every reference to one (`url(#…)`, `href="#…"`) gets a prefix unique to the figure, because ids are
 * page-wide and two figures would otherwise share one gradient; the root gets an accessible name; any XML prolog or
 * doctype is dropped.
 */
import { escapeHtml } from './escape';

export function inlineSvg(svg: string, prefix: string, label: string): string {
  let out = svg.replace(/^\s*<\?xml[^>]*\?>\s*/, '').replace(/^\s*<!DOCTYPE[^>]*>\s*/i, '');
  out = out
    .replace(/\bid="([^"]+)"/g, (_m, id: string) => `id="${prefix}-${id}"`)
    .replace(/url\(#([^)]+)\)/g, (_m, id: string) => `url(#${prefix}-${id})`)
    .replace(/\b(xlink:href|href)="#([^"]+)"/g, (_m, attr: string, id: string) => `${attr}="#${prefix}-${id}"`);
  return out.replace(/^<svg\b/, `<svg role="img" aria-label="${escapeHtml(label)}"`);
}
