/**
 * Shapes shared by the property checks. A check reads one kernel and the spectral engine's result (a
 * `CheckContext`), measures its property once (the facts, cached with the engine's result), and from the facts
 * derives findings (diagnostics about the kernel that no claim covers) and verdicts on declared claims.
 */
import type { CompiledKernel } from '../semantics/evaluator';
import type { IrFunction } from '../semantics/ir';
import type { ExpectationName } from '../syntax/ast';
import type { DiagnosticName } from '../diagnostics/catalogue';
import type { Fix } from '../diagnostics/types';
import type { SpectralResult } from '../numerics/engine/spectralEngine';
import type { AnalysisOptions, SpectrumReport } from '../analysis/types';

/** Everything a check may read: the kernel, its compiled evaluator, the engine's result and the options. */
export interface CheckContext {
  readonly name: string;
  readonly ir: IrFunction;
  readonly domain: readonly [number, number];
  readonly compiled: CompiledKernel;
  readonly engine: SpectralResult;
  /** The engine's spectrum after the separable cross-check (null when there is none). */
  readonly spectrum: SpectrumReport | null;
  readonly options: AnalysisOptions;
}

/** A finding about the kernel, placed on the kernel's name unless a declared claim covers it. */
export interface Finding {
  readonly name: DiagnosticName;
  readonly args: Readonly<Record<string, string | number>>;
  readonly figures?: Readonly<Record<string, number | string | boolean | null>>;
  readonly fixes?: readonly Fix[];
  /** Claims that say the same thing: when one of them is declared, its verdict replaces this finding. */
  readonly covers: readonly ExpectationName[];
}

/** The verdict on one declared claim: it holds, it fails (with the message arguments), or it cannot be decided. */
export type ClaimVerdict =
  | { readonly outcome: 'holds' }
  | {
    readonly outcome: 'fails';
    readonly diagnostic: DiagnosticName;
    readonly args: Readonly<Record<string, string | number>>;
    readonly figures?: Readonly<Record<string, number | string | boolean | null>>;
    readonly fixes?: readonly Fix[];
  }
  | { readonly outcome: 'undecided'; readonly reason: string };

export const holds: ClaimVerdict = { outcome: 'holds' };

export function undecided(reason: string): ClaimVerdict {
  return { outcome: 'undecided', reason };
}
