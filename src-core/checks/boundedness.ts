/**
 * Boundedness: is T bounded on L²[a, b], and is it Hilbert–Schmidt (∫∫|K|² < ∞, hence compact)?
 *
 * What it reads: the engine's growth estimates |K| ~ d^(−α) (or log 1/d) toward each singular line of the
 * expression (singularity.ts), and, for singular curves that are not straight lines, its own estimate at a few
 * points of the curve (same log–log fit, along the curve's normal). The classes follow standard facts (common
 * practice; R. Kress, Linear Integral Equations, 3rd ed. 2014, §2.3; P. R. Halmos & V. S. Sunder, Bounded Integral
 * Operators on L² Spaces, 1978, §5):
 *  - along a line (or a smooth curve): α < 1/2 or a logarithm → Hilbert–Schmidt; 1/2 ≤ α < 1 → bounded by
 *    Schur's test but not Hilbert–Schmidt; α ≥ 1 → not integrable, unbounded;
 *  - at a corner point of the square: α < 1 → Hilbert–Schmidt; α = 1 (within the fit's 0.02) → bounded, not
 *    Hilbert–Schmidt (Hilbert's inequality for 1/(t + s)); α > 1 → unbounded: with f_ε = ε^(−1/2) on [a, a + ε],
 *    ⟨|K| f_ε, f_ε⟩ ~ ε^(1−α) grows without bound (a kernel of one sign near the corner);
 *  - K infinite or undefined at points where the engine must evaluate it, away from known singular lines →
 *    unbounded.
 * Findings: KW510 (unbounded, warning), KW511 (bounded but not Hilbert–Schmidt, info), KW512 (weakly singular
 * but Hilbert–Schmidt, info). Claims: `bounded` (KW604), `hilbert-schmidt` (KW605).
 */
import type { BoundednessClass, BoundednessReport } from '../analysis/types';
import type { SingularityEstimate } from '../numerics/engine/singularity';
import type { ClaimVerdict, CheckContext, Finding } from './types';
import { holds } from './types';
import { findCrossings } from './curves';
import { PointEvaluator, describePlace, fmt, inSquare } from './sampling';

export interface Singularity {
  readonly where: string;
  readonly type: 'power' | 'log';
  readonly exponent: number;
  readonly class: BoundednessClass;
  /** A point of the square on the singular set. */
  readonly at: readonly [number, number];
  readonly point: boolean;
  /** True for a curve that is not a straight line of the expression (located numerically). */
  readonly curve: boolean;
}

export interface BoundednessFacts {
  readonly report: BoundednessReport;
  /** Every singularity found, worst first. */
  readonly singularities: readonly Singularity[];
  /** Why the operator is unbounded, as a clause for messages; null when it is bounded. */
  readonly reason: string | null;
  /** True when the engine produced a spectrum although the operator is unbounded (it must not be reported). */
  readonly dropSpectrum: boolean;
}

const classRank: Record<BoundednessClass, number> = { 'hilbert-schmidt': 0, bounded: 1, unbounded: 2 };

function classOf(type: 'power' | 'log', exponent: number, point: boolean, engine?: SingularityEstimate): BoundednessClass {
  if (type === 'log') return 'hilbert-schmidt';
  if (point) return exponent < 1 - 0.02 ? 'hilbert-schmidt' : exponent <= 1 + 0.02 ? 'bounded' : 'unbounded';
  if (engine) return !engine.integrable ? 'unbounded' : engine.squareIntegrable ? 'hilbert-schmidt' : 'bounded';
  return exponent < 0.5 - 1e-6 ? 'hilbert-schmidt' : exponent < 1 - 1e-6 ? 'bounded' : 'unbounded';
}

/** Growth of |K| along the normal of a curve point: the log–log slope between distances 10⁻⁵ and 10⁻⁷ of L. */
function growthAt(ev: PointEvaluator, t: number, s: number, n: readonly [number, number], a: number, b: number) {
  const L = b - a;
  let best: { type: 'power' | 'log'; exponent: number } | null = null;
  for (const side of [1, -1]) {
    const ys: number[] = [];
    for (const e of [4, 5, 6, 7]) {
      const d = L * 10 ** -e;
      const pt = t + side * d * n[0];
      const ps = s + side * d * n[1];
      if (!inSquare(pt, ps, a, b)) break;
      ys.push(ev.abs(pt, ps));
    }
    if (ys.length < 4 || !ys.every(Number.isFinite)) continue;
    const slope = (Math.log(Math.max(ys[3], 1e-300)) - Math.log(Math.max(ys[1], 1e-300))) / (2 * Math.LN10);
    const d1 = ys[2] - ys[1];
    const d2 = ys[3] - ys[2];
    const linearInLog = d1 > 0 && Math.abs(d2 - d1) <= 0.05 * Math.abs(d1);
    let g: { type: 'power' | 'log'; exponent: number } | null = null;
    if (linearInLog && slope < 0.3) g = { type: 'log', exponent: 0 };
    else if (slope > 0.03) g = { type: 'power', exponent: Math.round(slope * 100) / 100 };
    if (g && (!best || (g.type === 'power' && (best.type === 'log' || g.exponent > best.exponent)))) best = g;
  }
  return best;
}

export function measureBoundedness(ctx: CheckContext): BoundednessFacts {
  const [a, b] = ctx.domain;
  const found: Singularity[] = [];
  for (const s of ctx.engine.singularities) {
    if (s.type === 'none') continue;
    found.push({
      where: describePlace(s.locus.line, a, b), type: s.type, exponent: s.exponent, point: s.point, at: s.at, curve: false,
      class: classOf(s.type, s.exponent, s.point, s),
    });
  }
  const ev = new PointEvaluator(ctx.compiled);
  for (const u of ctx.engine.loci.unknown) {
    if (u.kind !== 'singular' || u.node.op === 'const') continue;
    let worst: Singularity | null = null;
    for (const p of findCrossings(u.node, a, b)) {
      const g = growthAt(ev, p.t, p.s, p.normal, a, b);
      if (!g) continue;
      const cls = classOf(g.type, g.exponent, false);
      if (!worst || classRank[cls] > classRank[worst.class] || (cls === worst.class && g.exponent > worst.exponent)) {
        worst = {
          where: `a curve located numerically through t = ${fmt(p.t, 4)}, s = ${fmt(p.s, 4)}`,
          type: g.type, exponent: g.exponent, point: false, curve: true, at: [p.t, p.s], class: cls,
        };
      }
    }
    if (worst) found.push(worst);
  }
  found.sort((x, y) => classRank[y.class] - classRank[x.class] || y.exponent - x.exponent);
  const worst = found[0] ?? null;
  const notFinite = ctx.engine.spectrum === null && /not finite/.test(ctx.engine.reason ?? '');
  let cls: BoundednessClass = worst ? worst.class : 'hilbert-schmidt';
  let reason: string | null = null;
  if (worst && worst.class === 'unbounded') {
    reason = `|K| grows like d^(−${worst.exponent.toFixed(2)}) toward ${worst.where}, which is not integrable there`;
  } else if (notFinite) {
    cls = 'unbounded';
    reason = 'K is infinite or undefined at points inside the square, away from the lines where the expression is singular';
  }
  return {
    report: {
      class: cls,
      exponent: worst ? worst.exponent : null,
      where: worst ? worst.where : null,
    },
    singularities: found,
    reason,
    dropSpectrum: cls === 'unbounded' && ctx.engine.spectrum !== null,
  };
}

function growth(s: Singularity): string {
  return s.type === 'log' ? '|K| grows like log(1/d)' : `|K| grows like d^(−${s.exponent.toFixed(2)})`;
}

export function boundednessFindings(ctx: CheckContext, f: BoundednessFacts): Finding[] {
  const [a, b] = ctx.domain;
  const worst = f.singularities[0];
  const figures = { exponent: f.report.exponent, class: f.report.class, where: f.report.where };
  if (f.report.class === 'unbounded') {
    return [{ name: 'unbounded', args: { name: ctx.name, a: fmt(a), b: fmt(b), reason: f.reason ?? 'unknown reason' }, figures, covers: ['bounded', 'hilbert-schmidt'] }];
  }
  if (f.report.class === 'bounded' && worst) {
    return [{ name: 'not-hilbert-schmidt', args: { name: ctx.name, exponent: worst.exponent.toFixed(2), where: worst.where }, figures, covers: ['hilbert-schmidt'] }];
  }
  if (worst) return [{ name: 'weakly-singular', args: { name: ctx.name, growth: growth(worst), where: worst.where }, figures, covers: [] }];
  return [];
}

export function boundedClaim(ctx: CheckContext, f: BoundednessFacts): ClaimVerdict {
  if (f.report.class !== 'unbounded') return holds;
  return { outcome: 'fails', diagnostic: 'bounded-claim-failed', args: { name: ctx.name, evidence: f.reason ?? 'unknown reason' }, figures: { exponent: f.report.exponent } };
}

export function hilbertSchmidtClaim(ctx: CheckContext, f: BoundednessFacts): ClaimVerdict {
  if (f.report.class === 'hilbert-schmidt') return holds;
  const worst = f.singularities[0];
  const evidence = f.report.class === 'unbounded'
    ? `the operator is not even bounded: ${f.reason ?? 'unknown reason'}`
    : worst ? `${growth(worst)} toward ${worst.where}, and |K|² is not integrable there` : 'the singularity is not square-integrable';
  return { outcome: 'fails', diagnostic: 'hilbert-schmidt-claim-failed', args: { name: ctx.name, evidence }, figures: { exponent: f.report.exponent } };
}
