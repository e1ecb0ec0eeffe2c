/**
 * The rank of T: the dimension of its range, that is, the number of nonzero singular values (for a Hermitian
 * kernel, the number of nonzero eigenvalues). Read from the singular values σ_1 ≥ σ_2 ≥ … of the Galerkin matrix:
 *  - noise level: σ_1 · max(100 · 8ε√N, 10 · the relative accuracy the engine reached) (rounding of the assembled
 *    matrix and its discretisation error);
 *  - lower bound r: the number of singular values above the noise level (each is a direction the operator
 *    certainly does not annihilate);
 *  - exact rank: r, when the singular values drop from above 10⁶ × noise to below the noise level in one step (a
 *    separable kernel Σ_{j≤r} f_j(t) g_j(s) gives exactly r nonzero values, the rest rounding noise) and fewer than
 *    all N are nonzero. Without such a gap (an infinite-rank kernel whose singular values decay into the noise),
 *    only the lower bound is known.
 * Claim: `rank = n` / `rank <= n` (KW607).
 */
import type { ClaimVerdict, CheckContext } from './types';
import { holds, undecided } from './types';
import { finiteEntries, galerkinSingularValues } from './galerkin';
import { fmt } from './sampling';

export interface RankFacts {
  /** Singular values certainly nonzero. */
  readonly lower: number;
  /** The rank when the singular values show a clear gap; null otherwise. */
  readonly exact: number | null;
  /** The discretisation size the singular values came from. */
  readonly size: number;
  readonly noise: number;
  /** The first singular value below the noise (or NaN). */
  readonly next: number;
}

export function measureRank(ctx: CheckContext): RankFacts | null {
  const finest = ctx.engine.finest;
  if (!finest || !ctx.spectrum || !finiteEntries(finest)) return null;
  const sv = galerkinSingularValues(finest);
  const n = sv.length;
  const s1 = sv[0] ?? 0;
  if (!(s1 > 0)) return { lower: 0, exact: 0, size: n, noise: 0, next: NaN };
  const reached = Number.isFinite(ctx.engine.reached) ? ctx.engine.reached : 0;
  const noise = s1 * Math.max(100 * 8 * Number.EPSILON * Math.sqrt(n), 10 * reached);
  let lower = 0;
  while (lower < n && sv[lower] > noise) lower++;
  const next = lower < n ? sv[lower] : NaN;
  const gap = lower < n && sv[lower - 1] > 1e6 * noise;
  return { lower, exact: gap ? lower : null, size: n, noise, next };
}

export function rankClaim(ctx: CheckContext, f: RankFacts | null, op: '=' | '<=' | '<', claimed: number): ClaimVerdict {
  if (!f) return undecided('there is no discretisation to read the rank from');
  const args = (evidence: string) => ({ op, claimed, name: ctx.name, evidence });
  const figures = { lower: f.lower, exact: f.exact, noise: f.noise };
  if (f.exact !== null) {
    const ok = op === '=' ? f.exact === claimed : f.exact <= claimed;
    if (ok) return holds;
    return {
      outcome: 'fails', diagnostic: 'rank-claim-failed',
      args: args(`rank ${f.exact} (${f.exact} singular value${f.exact === 1 ? '' : 's'} above the noise level ${fmt(f.noise, 2)}, then a drop to ${fmt(f.next, 2)})`),
      figures,
    };
  }
  if (f.lower > claimed) {
    return {
      outcome: 'fails', diagnostic: 'rank-claim-failed',
      args: args(`rank at least ${f.lower} (${f.lower} singular values above the noise level ${fmt(f.noise, 2)}${f.lower === f.size ? ', as many as the discretisation has' : ''})`),
      figures,
    };
  }
  return undecided(`the singular values decay without a clear gap (${f.lower} above the noise level ${fmt(f.noise, 2)}), so the rank is at least ${f.lower} and may be infinite`);
}
