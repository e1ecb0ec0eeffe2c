/**
 * What the pictures of a file's kernels are drawn from: each kernel's report, its samples and its axis names. This
 * is the whole reply of the editor's kernel-data request, and the input of `kernelFigures`.
 */
import type { FileAnalysis } from '../../analysis/types';
import { axisNames, domainUnit } from './domainUnit';
import { defaultSamplePoints, kernelSamples } from './kernelSamples';
import type { KernelPictureData } from './plotTypes';

export interface PictureDataOptions {
  /** Cells per axis of the sampled square (default 48). */
  readonly points?: number;
}

/** The picture data of the kernel called `name`, or null when the file has no such kernel. */
export function kernelPictureData(analysis: FileAnalysis, name: string, options: PictureDataOptions = {}): KernelPictureData | null {
  const report = analysis.kernels.find((k) => k.name === name);
  if (!report) return null;
  const symbol = analysis.model.kernels.find((k) => k.name === name) ?? null;
  const unit = symbol ? domainUnit(analysis.source, analysis.model, symbol) : null;
  return {
    report,
    samples: symbol ? kernelSamples(symbol, options.points ?? defaultSamplePoints) : null,
    axes: axisNames(unit),
  };
}

/** The picture data of every kernel of the file, in the order they are declared. */
export function fileKernelPictureData(analysis: FileAnalysis, options: PictureDataOptions = {}): KernelPictureData[] {
  const seen = new Set<string>();
  const out: KernelPictureData[] = [];
  for (const k of analysis.kernels) {
    if (seen.has(k.name)) continue;
    seen.add(k.name);
    const data = kernelPictureData(analysis, k.name, options);
    if (data) out.push(data);
  }
  return out;
}
