export { bindFile } from './bind';
export { formatNumber as formatValue, formatComplex } from './values';
export type * from './model';
export type * from './ir';
export * from './builtins';
export { expectationInfo, isExpectationName } from './expectations';
export { canonicalIr, hashText } from './hash';
