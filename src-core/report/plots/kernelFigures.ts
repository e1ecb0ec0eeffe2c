/**
 * All pictures of one kernel, in reading order: K on its square (Re and Im for a complex kernel), the Hermitian
 * defect when K is not Hermitian, the eigenvalues (by index for a Hermitian kernel, in the complex plane otherwise),
 * the share of the trace for a positive kernel, and the leading eigenfunctions. A picture whose data is missing
 * (a kernel with errors, a spectrum that was not computed) is simply not drawn.
 */
import { eigenfunctionFigure, defaultEigenfunctionCount } from './eigenfunctionCurves';
import { eigenvalueComplexFigure } from './eigenvalueComplexPlot';
import { eigenvalueIndexFigure } from './eigenvalueIndexPlot';
import { hermitianDefectFigure } from './hermitianDefect';
import { kernelHeatmapFigures } from './kernelHeatmap';
import type { KernelPictureData, PlotFigure } from './plotTypes';
import { traceShareFigure } from './traceShare';

export interface KernelFigureOptions {
  /** How many leading eigenfunctions to draw (default 4, at most 4). */
  readonly eigenfunctions?: number;
}

/** True when the eigenvalues are drawn by index (real spectrum), false for the complex plane. */
export function drawsEigenvaluesByIndex(data: KernelPictureData): boolean {
  return data.report.hermitian?.holds === true;
}

export function kernelFigures(data: KernelPictureData, options: KernelFigureOptions = {}): PlotFigure[] {
  const figures: (PlotFigure | null)[] = [
    ...kernelHeatmapFigures(data),
    hermitianDefectFigure(data),
    drawsEigenvaluesByIndex(data) ? eigenvalueIndexFigure(data.report) : eigenvalueComplexFigure(data.report),
    traceShareFigure(data.report),
    eigenfunctionFigure(data.report, data.axes, options.eigenfunctions ?? defaultEigenfunctionCount),
  ];
  return figures.filter((f): f is PlotFigure => f !== null);
}
