/**
 * The pictures of one kernel, rendered: its figure specifications from the core (`kernelFigures`) turned into SVG,
 * with the section data the HTML layout needs (properties, notes). Used by `kernwright report`, by the editor's
 * spectrum view, and ready for `kernwright compare` to draw a kernel before and after a change.
 */
import {
  kernelFigures,
  propertyMarks,
  type KernelFigureOptions,
  type KernelPictureData,
  type KernelSection,
  type RenderedFigure,
} from '@kernwright/core';
import { renderSvg, type RenderOptions } from './renderSvg';

export interface KernelPictureOptions extends KernelFigureOptions, RenderOptions {
  /** Lines shown under the kernel's heading (its diagnostics, say). */
  readonly notes?: readonly string[];
}

/** Renders every figure of the kernel (one after the other: vega's views are cheap but not free). */
export async function renderKernelFigures(data: KernelPictureData, options: KernelFigureOptions & RenderOptions = {}): Promise<RenderedFigure[]> {
  const out: RenderedFigure[] = [];
  for (const f of kernelFigures(data, options)) {
    out.push({ kind: f.kind, title: f.title, caption: f.caption, svg: await renderSvg(f.spec, options), tables: f.tables });
  }
  return out;
}

/** Why a kernel has no pictures (or fewer than usual), in one line; null when it has its spectrum. */
export function missingPicturesNote(data: KernelPictureData): string | null {
  if (!data.samples) return 'No pictures: the definition has errors or no valid domain (see the diagnostics).';
  if (!data.report.spectrum) return 'Only the kernel is drawn: its spectrum was not computed (see the diagnostics).';
  return null;
}

/** One kernel's section of a page: heading data, property verdicts, notes, and its rendered figures. */
export async function renderKernelSection(data: KernelPictureData, options: KernelPictureOptions = {}): Promise<KernelSection> {
  const missing = missingPicturesNote(data);
  return {
    name: data.report.name,
    domain: data.report.domain,
    unit: data.axes.unit,
    complex: data.report.complex,
    properties: propertyMarks(data.report),
    notes: [...(options.notes ?? []), ...(missing ? [missing] : [])],
    figures: await renderKernelFigures(data, options),
  };
}
