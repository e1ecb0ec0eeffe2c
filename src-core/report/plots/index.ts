/**
 * Plots as data: the pictures of a kernel as plain Vega-Lite specifications, computed from the analysis alone.
 * Rendering them (to SVG, with vega) is the business of the server and the editor, not of the core.
 */
export * from './plotTypes';
export { sequentialScheme, divergingScheme, seriesColours, seriesDashes, neutral as neutralColour } from './palette';
export { unitOfNote, domainUnit, axisNames } from './domainUnit';
export { kernelSamples, lociSegments, defaultSamplePoints } from './kernelSamples';
export { kernelPictureData, fileKernelPictureData, type PictureDataOptions } from './pictureData';
export { colourRange, type ColourRange } from './heatmapLayers';
export { lociToDraw, type LociToDraw } from './confirmedLoci';
export { kernelHeatmapFigures, kernelTable } from './kernelHeatmap';
export { hermitianDefectFigure, defectValues } from './hermitianDefect';
export { eigenvalueIndexFigure, eigenvalueTable, indexRows, signLabels } from './eigenvalueIndexPlot';
export { eigenvalueComplexFigure } from './eigenvalueComplexPlot';
export { traceShareFigure, shareRows, type ShareRow } from './traceShare';
export { eigenfunctionFigure, defaultEigenfunctionCount } from './eigenfunctionCurves';
export { kernelFigures, drawsEigenvaluesByIndex, type KernelFigureOptions } from './kernelFigures';
