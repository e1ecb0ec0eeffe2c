/**
 * Declared norm bounds, `norm < x` and `norm <= x`, against the operator norm ‖T‖ the engine computed with its error
 * e and its bracket [lower, upper] (upper from the Hilbert–Schmidt norm and Schur's test). The claim
 *  - holds when the whole error interval lies on the right side: ‖T‖ + e ≤ x (< x for a strict bound), or the
 *    upper bracket already does;
 *  - fails when the whole interval lies on the wrong side: ‖T‖ − e > x (≥ x for a strict bound), or the operator
 *    is unbounded;
 *  - cannot be decided otherwise (the bound lies within the error).
 * Claim: `norm` (KW606).
 */
import type { BoundednessFacts } from './boundedness';
import type { ClaimVerdict, CheckContext } from './types';
import { holds, undecided } from './types';
import { fmt, fmtEstimate } from './sampling';

export function normClaim(ctx: CheckContext, bounded: BoundednessFacts, op: '<' | '<=' | '=', bound: number): ClaimVerdict {
  const args = (norm: string) => ({ op, bound: fmt(bound, 8), norm, name: ctx.name });
  if (bounded.report.class === 'unbounded') {
    return { outcome: 'fails', diagnostic: 'norm-claim-failed', args: args(`∞ (the operator is unbounded: ${bounded.reason ?? 'unknown reason'})`), figures: { norm: null } };
  }
  const n = ctx.spectrum?.norm;
  if (!n) return undecided('the operator norm is not available');
  const strict = op === '<';
  const hi = Math.min(n.value + n.error, Number.isFinite(n.upper) ? n.upper : Infinity);
  const lo = Math.max(n.value - n.error, n.lower);
  if (strict ? hi < bound : hi <= bound) return holds;
  if (strict ? lo >= bound : lo > bound) {
    return {
      outcome: 'fails', diagnostic: 'norm-claim-failed', args: args(fmtEstimate(n.value, n.error)),
      figures: { norm: n.value, error: n.error, lower: n.lower, upper: Number.isFinite(n.upper) ? n.upper : null, bound },
    };
  }
  return undecided(`‖T‖ = ${fmtEstimate(n.value, n.error)}: the bound ${fmt(bound, 8)} lies within its error`);
}
