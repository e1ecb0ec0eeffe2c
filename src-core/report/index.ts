/**
 * Reports: the findings of an analysis as plain text lines, JSON data and a SARIF log; comparisons of two versions
 * as text, markdown and JSON; exported arrays (NPY encoding). Pure functions, no I/O.
 */
export * from './json';
export * from './text';
export * from './sarif';
export * from './compare';
export * from './compareReport';
export * from './exportData';
export * from './npy';
export * from './plots';
export * from './html';
