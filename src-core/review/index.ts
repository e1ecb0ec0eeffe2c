/**
 * Code review of kernel files: comparing two versions kernel by kernel, the limits that fail a review, applying the
 * editor's fixes from the command line (with a unified diff), and the exported arrays as files.
 */
export type * from './types';
export { noThresholds } from './types';
export { compareFigure, exceedsRelative, eigenvalueIndex, realFigure, eigenFigure, type Figure, type FigureChange } from './figureChange';
export { pointwiseChange, intersectDomains, defaultGridPoints, type PointwiseChange } from './pointwise';
export { matchKernels, type KernelIdentity, type KernelPairing } from './matchKernels';
export { diffKernel, kernelOnlyIn, type KernelVersion, type KernelDiffOptions } from './kernelDiff';
export { compareVerdict, formatRelativeChange, formatLimit, figureName, propertyWords } from './thresholds';
export { chooseFixes, compatibleFixes, applyEdits, dominantLineEnding, withLineEnding, type ChosenFix } from './applyFixes';
export { fixText, defaultFixRounds, type AppliedFix, type FixOutcome, type FixLoopOptions } from './fixLoop';
export { unifiedDiff, splitLines } from './unifiedDiff';
export { exportJsonDocument, exportCsvFiles, exportNpyFiles, csvNumber, csvText, exportFormatVersion, type ExportFile } from './exportFormats';
