/**
 * Evaluation faults of a kernel as diagnostics: a real function outside its domain (sqrt or log of a negative
 * number in a real kernel), a complex value where a real one is needed, and values that are NaN or infinite.
 * Domain faults block the numerical analysis of that kernel; NaN or infinite values (often on a line such as the
 * diagonal of a singular kernel) do not: the spectral engine judges whether they matter.
 */
import type { Diagnostic } from '../diagnostics/types';
import { makeDiagnostic } from '../diagnostics/make';
import { compileKernel, probeFaults, type KernelFault } from '../semantics/evaluator';
import type { KernelSymbol } from '../semantics/model';
import { formatComplex, formatNumber } from '../semantics/values';

export interface FaultResult {
  readonly diagnostics: Diagnostic[];
  /** True when the kernel cannot be analysed (a real-domain or complex-where-real fault). */
  readonly blocking: boolean;
  readonly faults: readonly KernelFault[];
}

export function faultDiagnostics(k: KernelSymbol): FaultResult {
  if (!k.ir || !k.domain) return { diagnostics: [], blocking: false, faults: [] };
  const compiled = compileKernel(k.ir);
  const faults = probeFaults(k.ir, compiled, k.domain.a, k.domain.b);
  const diagnostics: Diagnostic[] = [];
  let blocking = false;
  const seen = new Set<string>();
  for (const f of faults) {
    const key = `${f.fault.kind}:${f.fault.range.start}:${f.fault.range.end}`;
    if (seen.has(key)) continue;
    seen.add(key);
    const at = { t: formatNumber(f.t), s: formatNumber(f.s) };
    const figures = { t: f.t, s: f.s };
    const arg = formatComplex({ re: f.fault.argRe, im: f.fault.argIm });
    if (f.fault.kind === 'real-domain') {
      blocking = true;
      diagnostics.push(makeDiagnostic('real-domain-fault', f.fault.range, { fn: f.fault.fn ?? 'this operation', arg, ...at }, { figures }));
    } else if (f.fault.kind === 'complex-where-real') {
      blocking = true;
      diagnostics.push(makeDiagnostic('complex-where-real', f.fault.range, { what: f.fault.fn ?? 'This operation', value: arg, ...at }, { figures }));
    } else {
      const value = formatComplex({ re: f.fault.valueRe, im: f.fault.valueIm });
      diagnostics.push(makeDiagnostic('non-finite-value', f.fault.range, { name: k.name, value, ...at }, { figures }));
    }
  }
  return { diagnostics, blocking, faults };
}
