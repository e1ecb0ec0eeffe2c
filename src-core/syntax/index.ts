/** The syntax layer: the tree of a kernel file, its parser, printer and walker. */
export * from './ast';
export * from './textRange';
export { parse, parseExpression, declarationKeywords } from './parser';
export { printExpr } from './printer';
export { walkExpr, exprChildren } from './walk';
export { maxNestingDepth, maxExpressionNodes } from './expressionParser';
