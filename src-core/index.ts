/**
 * Kernwright core: the public surface. Pure TypeScript with no editor, protocol or file-system code: text in, data out.
 */
export * from './syntax/textRange';
export type * from './syntax/ast';
export { parse, parseExpression } from './syntax/parser';
export { walkExpr } from './syntax/walk';
export { printExpr } from './syntax/printer';
export type * from './diagnostics/types';
export { catalogue, entryByCode, nameByCode, formatMessage, type CatalogueEntry, type DiagnosticName } from './diagnostics/catalogue';
export * from './semantics';
export type * from './analysis/types';
export { defaultAnalysisOptions } from './analysis/types';
export { analyzeText, compareDiagnostics, type PipelineHooks, type StopReason } from './analysis/analyze';
export { clearSpectralCache, forgetSpectra } from './analysis/kernelAnalysis';
export { runChecks, clearCheckCache, forgetChecks, isHermitianByConstruction, type CheckResults } from './checks';
export * from './fixes';
export * from './util/cancellation';
export { suggest } from './util/suggest';
export * from './report';
export * from './review';
export * from './editing';
export { setExpressionSimplifier, type ExpressionSimplifier } from './fixes/simplifier';
