/**
 * The evaluator of kernel expressions: a fast compiled path (codegen.ts), a slow explaining interpreter
 * (interpret.ts) that shares its arithmetic, and a fault probe over a kernel's square (probeFaults.ts).
 */
export type { Complex, CompiledFunction, CompiledKernel, EvalFault, EvalFaultKind, EvalResult, KernelFault } from './evalTypes';
export { compileFunction, compileKernel } from './codegen';
export { interpret } from './interpret';
export { probeFaults } from './probeFaults';
export { erf } from './erf';
