/** Reports: the findings of an analysis as plain text lines and as JSON data. Pure functions, no I/O. */
export * from './json';
export * from './text';
