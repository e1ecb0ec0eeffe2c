/**
 * The data the spectrum view draws, as the language server sends it: the reply of the custom request
 * `kernwright/kernelData` {uri, points?} → KernelDataReply | null, built on the server by the core's
 * `fileKernelPictureData(analysis, {points})` from the document's latest analysis. Pure: no vscode here.
 */
import type { KernelPictureData } from '@kernwright/core';

/** The request's method name. */
export const kernelDataRequest = 'kernwright/kernelData';

export interface KernelDataParams {
  /** The document, as a URI string. */
  readonly uri: string;
  /** Cells per axis of the sampled square (the view asks for 40: small enough to render while typing). */
  readonly points?: number;
}

export interface KernelDataReply {
  readonly uri: string;
  /** The document version the kernels were read from (null if unknown). */
  readonly version: number | null;
  /** True while the numerical analysis of a newer edit is still running (ask again shortly). */
  readonly pending: boolean;
  /** Every kernel of the file, in declaration order. */
  readonly kernels: readonly KernelPictureData[];
}

/** How the view asks for the data: the extension passes a function that sends the request to its language client. */
export type GetKernelData = (params: KernelDataParams) => Promise<KernelDataReply | null>;

/**
 * The kernel whose declaration holds `offset` (UTF-16 code units, as `TextDocument.offsetAt` counts); between
 * declarations, the nearest one above; before the first, the first. Null when there is no kernel.
 */
export function kernelAtOffset(kernels: readonly KernelPictureData[], offset: number): KernelPictureData | null {
  if (kernels.length === 0) return null;
  let best: KernelPictureData | null = null;
  for (const k of kernels) {
    const { start, end } = k.report.range;
    if (offset >= start && offset <= end) return k;
    if (start <= offset && (best === null || start > best.report.range.start)) best = k;
  }
  return best ?? kernels.reduce((a, b) => (b.report.range.start < a.report.range.start ? b : a));
}

/** The kernel called `name`, or null. */
export function kernelNamed(kernels: readonly KernelPictureData[], name: string): KernelPictureData | null {
  return kernels.find((k) => k.report.name === name) ?? null;
}
