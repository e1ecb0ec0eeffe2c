/**
 * One kernel as an HTML section: its name and domain, its properties as the checks judged them (a sign and a word
 * for each, never colour alone), notes (diagnostics, or why nothing could be drawn), and its figures in a grid that
 * flows from several columns on a wide window to one on a narrow one.
 */
import type { RenderedFigure } from '../plots/plotTypes';
import { escapeHtml, slug } from './escape';
import { figureHtml } from './figureHtml';

/** A property verdict: `holds` true, false, or null when undecided; `figure` the number behind it, with its error. */
export interface SectionProperty {
  readonly name: string;
  readonly holds: boolean | null;
  readonly figure?: string;
}

export interface KernelSection {
  readonly name: string;
  readonly domain: readonly [number, number] | null;
  readonly unit: string | null;
  readonly complex: boolean;
  readonly properties: readonly SectionProperty[];
  /** One line each: diagnostics of the kernel, or why a picture is missing. */
  readonly notes: readonly string[];
  readonly figures: readonly RenderedFigure[];
}

/** The id of a kernel's section (an anchor for the table of contents). */
export function sectionId(name: string, index: number): string {
  return `kernel-${index + 1}-${slug(name)}`;
}

function propertyHtml(p: SectionProperty): string {
  const state = p.holds === true ? 'holds' : p.holds === false ? 'fails' : 'undecided';
  const sign = p.holds === true ? '✓' : p.holds === false ? '✗' : '?';
  const word = p.holds === true ? '' : p.holds === false ? 'not ' : 'undecided: ';
  const figure = p.figure ? ` <span class="kw-figure-text">(${escapeHtml(p.figure)})</span>` : '';
  return `<li class="kw-property kw-${state}"><span class="kw-sign" aria-hidden="true">${sign}</span> ${escapeHtml(word + p.name)}${figure}</li>`;
}

function domainText(section: KernelSection): string {
  if (!section.domain) return 'no valid domain';
  const unit = section.unit ? ` ${section.unit}` : '';
  return `on [${section.domain[0]}, ${section.domain[1]}]${unit} · ${section.complex ? 'complex' : 'real'} kernel`;
}

export function kernelSectionHtml(section: KernelSection, index: number): string {
  const id = sectionId(section.name, index);
  const out = [
    `<section class="kw-kernel" id="${id}" aria-labelledby="${id}-title">`,
    `<header class="kw-kernel-head">`,
    `<h2 id="${id}-title"><span class="kw-kernel-word">kernel</span> ${escapeHtml(section.name)}</h2>`,
    `<p class="kw-domain">${escapeHtml(domainText(section))}</p>`,
    `</header>`,
  ];
  if (section.properties.length > 0) out.push(`<ul class="kw-properties">${section.properties.map(propertyHtml).join('')}</ul>`);
  if (section.notes.length > 0) out.push(`<ul class="kw-notes">${section.notes.map((n) => `<li>${escapeHtml(n)}</li>`).join('')}</ul>`);
  if (section.figures.length > 0) {
    out.push('<div class="kw-figures">');
    section.figures.forEach((f, k) => out.push(figureHtml(f, `${id}-${k + 1}-${f.kind}`)));
    out.push('</div>');
  }
  out.push('</section>');
  return out.join('\n');
}
