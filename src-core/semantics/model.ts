/**
 * The bound model of a kernel file: every declared name with its definition and its references, constants
 * evaluated, kernels resolved to IR with their domains and declared expectations. Produced by `bindFile`.
 */
import type { ConstDecl, Expectation, ExpectationName, ExpectationOp, FnDecl, KernelDecl } from '../syntax/ast';
import type { TextRange } from '../syntax/textRange';
import type { Diagnostic } from '../diagnostics/types';
import type { IrFunction } from './ir';

export interface ComplexValue {
  readonly re: number;
  readonly im: number;
}

interface SymbolBase {
  readonly name: string;
  readonly nameRange: TextRange;
  /** Every place the name is used (not the declaration itself). */
  readonly references: TextRange[];
}

export interface ConstantSymbol extends SymbolBase {
  readonly kind: 'const';
  readonly decl: ConstDecl;
  /** Null when the value could not be computed (a diagnostic says why). */
  value: ComplexValue | null;
}

export interface FunctionSymbol extends SymbolBase {
  readonly kind: 'fn';
  readonly decl: FnDecl;
  readonly params: readonly string[];
}

export interface ResolvedDomain {
  readonly a: number;
  readonly b: number;
  /** Where the domain was written (the kernel's own `on [a, b]` or the file's `domain` line). */
  readonly range: TextRange;
  readonly own: boolean;
}

export interface ResolvedExpectation {
  readonly name: ExpectationName;
  readonly item: Expectation;
  readonly op?: ExpectationOp;
  /** The value of norm, rank and resolvent claims. */
  readonly value?: ComplexValue;
}

export interface KernelSymbol extends SymbolBase {
  readonly kind: 'kernel';
  readonly decl: KernelDecl;
  readonly domain: ResolvedDomain | null;
  /** Null when the body has errors. */
  readonly ir: IrFunction | null;
  /** Stable hash of the resolved definition (domain + IR); null when ir or domain is null. */
  readonly hash: string | null;
  readonly expectations: readonly ResolvedExpectation[];
}

export type FileSymbol = ConstantSymbol | FunctionSymbol | KernelSymbol;

export interface FileModel {
  /** By name; the first declaration wins when a name is duplicated. */
  readonly symbols: ReadonlyMap<string, FileSymbol>;
  readonly kernels: readonly KernelSymbol[];
  readonly defaultDomain: ResolvedDomain | null;
  /** Name and declaration diagnostics (KW2xx). */
  readonly diagnostics: readonly Diagnostic[];
}
