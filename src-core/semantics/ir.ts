/**
 * The resolved form of an expression, after names are bound: constants are folded to numbers, helper calls become
 * `let` bindings (so nested helpers do not blow up in size), variables are numbered slots (slot 0 = t, slot 1 = s
 * for a kernel). Every node keeps the source range it came from, for evaluation faults. This is what the evaluator
 * compiles and what the symbolic analyses (smoothness loci, separability) read.
 */
import type { TextRange } from '../syntax/textRange';
import type { BuiltinFunctionName } from './builtins';

export type IrBinaryOp =
  | 'add' | 'sub' | 'mul' | 'div' | 'pow'
  | 'lt' | 'le' | 'gt' | 'ge' | 'eq' | 'ne'
  | 'and' | 'or';

export type IrNode =
  | { readonly op: 'const'; readonly re: number; readonly im: number; readonly range: TextRange }
  | { readonly op: 'var'; readonly slot: number; readonly range: TextRange }
  | { readonly op: 'neg' | 'not'; readonly a: IrNode; readonly range: TextRange }
  | { readonly op: IrBinaryOp; readonly a: IrNode; readonly b: IrNode; readonly range: TextRange }
  | { readonly op: 'call'; readonly fn: BuiltinFunctionName; readonly args: readonly IrNode[]; readonly range: TextRange }
  | { readonly op: 'cond'; readonly test: IrNode; readonly then: IrNode; readonly otherwise: IrNode; readonly range: TextRange }
  /** Evaluate `value` once, bind it to `slot`, then evaluate `body` (slots are unique within one tree). */
  | { readonly op: 'let'; readonly slot: number; readonly value: IrNode; readonly body: IrNode; readonly range: TextRange };

/** A compiled-ready expression: its tree, how many variable slots it uses, and whether it can be complex. */
export interface IrFunction {
  readonly root: IrNode;
  /** Number of free variables (2 for a kernel: t in slot 0, s in slot 1). */
  readonly arity: number;
  /** Total number of slots, free variables and `let` slots together. */
  readonly slotCount: number;
  /** True when some value in the tree may be complex (uses i, a complex constant, ...). */
  readonly complex: boolean;
}
