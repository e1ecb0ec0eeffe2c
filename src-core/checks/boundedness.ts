/**
 * Boundedness: is T bounded on L²[a, b], and is it Hilbert–Schmidt (∫∫|K|² < ∞, hence compact)?
 *
 * What it reads: the engine's growth estimates |K| ~ d^(−α) (or log 1/d) toward each singular locus of the
 * expression, with the verdicts singularity.ts draws from them by the geometry of the locus (an oblique line: bounded
 * for α < 1 by Schur's test, Hilbert–Schmidt for α < 1/2; a line t = c or s = c: both iff α < 1/2; a point: bounded
 * for α ≤ 1, Hilbert–Schmidt for α < 1), with the exponent exact where the expression states it and with its error
 * where it is measured (undecided when the threshold lies within it); and, for singular curves that are not straight
 * lines, its own estimate at a few points of the curve (same log–log fit along the curve's normal, read like an
 * oblique line; the exponent of 1/g or g^p, g analytic, as written when the measurement agrees). Standard facts
 * (common practice; R. Kress, Linear Integral Equations, 3rd ed. 2014, §2.3; P. R. Halmos & V. S. Sunder, Bounded
 * Integral Operators on L² Spaces, 1978, §5). K infinite or undefined at points where the engine must evaluate it,
 * away from known singular lines → unbounded.
 * Findings: KW510 (unbounded, warning), KW511 (bounded but not Hilbert–Schmidt, info), KW512 (weakly singular
 * but Hilbert–Schmidt, info). Claims: `bounded` (KW604), `hilbert-schmidt` (KW605).
 */
import type { BoundednessClass, BoundednessReport } from '../analysis/types';
import type { LocalVerdict, LocusGeometry } from '../numerics/engine/singularity';
import type { ClaimVerdict, CheckContext, Finding } from './types';
import { holds, undecided } from './types';
import { findCrossings, findIsolatedZeros } from './curves';
import type { IrNode } from '../semantics/ir';
import { PointEvaluator, describePlace, fmt, inSquare } from './sampling';

export interface Singularity {
  readonly where: string;
  readonly type: 'power' | 'log';
  readonly exponent: number;
  /** Error of the exponent (0 when it is read from the expression). */
  readonly exponentError: number;
  readonly class: BoundednessClass;
  /** Whether this singularity alone leaves the operator bounded / Hilbert–Schmidt (with its exponent's error). */
  readonly bounded: LocalVerdict;
  readonly hilbertSchmidt: LocalVerdict;
  /** A point of the square on the singular set. */
  readonly at: readonly [number, number];
  readonly point: boolean;
  /** True for a curve that is not a straight line of the expression (located numerically). */
  readonly curve: boolean;
  /** A point, a line t = c or s = c, an oblique line, or a curve. */
  readonly geometry: LocusGeometry | 'curve';
}

export interface BoundednessFacts {
  readonly report: BoundednessReport;
  /** Every singularity found, worst first. */
  readonly singularities: readonly Singularity[];
  /** Why the operator is unbounded, as a clause for messages; null when it is bounded. */
  readonly reason: string | null;
  /** True when the engine produced a spectrum although the operator is unbounded (it must not be reported). */
  readonly dropSpectrum: boolean;
  /**
   * Why boundedness or the Hilbert–Schmidt property is undecided (an exponent whose error interval contains the
   * threshold), as clauses for messages; null when decided. The report's class is then the best class not excluded
   * ('bounded' while boundedness is undecided, with the spectrum dropped), and the claims are undecided.
   */
  readonly undecided: { readonly bounded: string | null; readonly hilbertSchmidt: string | null };
}

const classRank: Record<BoundednessClass, number> = { 'hilbert-schmidt': 0, bounded: 1, unbounded: 2 };

function classOf(bounded: LocalVerdict, hs: LocalVerdict): BoundednessClass {
  if (bounded === 'fails') return 'unbounded';
  return hs === 'holds' ? 'hilbert-schmidt' : 'bounded';
}

/** α as written (two decimals at least: 1.50, 0.996) or as measured with its error (0.703 ± 0.004). */
export function fmtExponent(exponent: number, error: number): string {
  if (error === 0) return Number(exponent.toFixed(2)) === exponent ? exponent.toFixed(2) : fmt(exponent, 12);
  return `${exponent.toFixed(3)} ± ${fmt(error, 2)}`;
}

/** Growth of |K| along the normal of a curve point: the log–log slope between distances 10⁻⁵ and 10⁻⁷ of L. */
function growthAt(ev: PointEvaluator, t: number, s: number, n: readonly [number, number], a: number, b: number) {
  const L = b - a;
  let best: { type: 'power' | 'log'; exponent: number; error: number } | null = null;
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
    const lg = ys.map((y) => Math.log(Math.max(y, 1e-300)));
    const slope = (lg[3] - lg[1]) / (2 * Math.LN10);
    const slope1 = (lg[2] - lg[0]) / (2 * Math.LN10);
    const d1 = ys[2] - ys[1];
    const d2 = ys[3] - ys[2];
    const linearInLog = d1 > 0 && Math.abs(d2 - d1) <= 0.05 * Math.abs(d1);
    let g: { type: 'power' | 'log'; exponent: number; error: number } | null = null;
    // The curve is located by bisection to rounding, and its normal by differences: a wider error than on a line.
    if (linearInLog && slope < 0.3) g = { type: 'log', exponent: 0, error: 0 };
    else if (slope > 0.03) g = { type: 'power', exponent: slope, error: Math.max(3 * Math.abs(slope - slope1), 0.01) };
    if (g && (!best || (g.type === 'power' && (best.type === 'log' || g.exponent > best.exponent)))) best = g;
  }
  return best;
}

/** A curve crossed transversally is like an oblique line: Schur's test for α < 1, Hilbert–Schmidt for α < 1/2. */
function curveVerdicts(g: { type: 'power' | 'log'; exponent: number; error: number }): { bounded: LocalVerdict; hs: LocalVerdict } {
  if (g.type === 'log') return { bounded: 'holds', hs: 'holds' };
  const hi = g.exponent + g.error;
  const lo = g.exponent - g.error;
  const v = (h: boolean, f: boolean): LocalVerdict => (h ? 'holds' : f ? 'fails' : 'undecided');
  return { bounded: v(hi < 1, lo >= 1), hs: v(hi < 0.5, lo >= 0.5) };
}

/**
 * A singular argument that vanishes at an isolated point without changing sign (((t − ½)² + (s − ½)²)^(−0.4) at the
 * centre): |K| ~ r^(−α) measured in eight directions (those inside the square). Read as a point singularity: ∫∫|K|²
 * is finite for α < 1 and |K| ≤ C·r^(−1) ≤ C′/|t − s| … is dominated by a Hilbert-type kernel for α ≤ 1 (the upper
 * exponent over all directions); with |K| ≥ c·r^(−α) in a direction, indicator functions of intervals of length ~ ε
 * at distance ε from the point, in t and in s, give |⟨Kg, f⟩|/(‖f‖‖g‖) ~ ε^(1−α) (unbounded for α > 1), and |K|² is
 * not integrable for α ≥ 1 (the largest lower exponent over the directions).
 */
function isolatedPoint(ev: PointEvaluator, node: IrNode, a: number, b: number): Singularity | null {
  const L = b - a;
  for (const p of findIsolatedZeros(node, a, b)) {
    let hi = 0;
    let lo = -Infinity;
    let worst: { type: 'power' | 'log'; exponent: number; error: number } | null = null;
    for (let k = 0; k < 8; k++) {
      const th = (k * Math.PI) / 4 + Math.PI / 8;
      const n: [number, number] = [Math.cos(th), Math.sin(th)];
      if (!inSquare(p.t + 1e-4 * L * n[0], p.s + 1e-4 * L * n[1], a, b)) continue;
      const g = oneSided(ev, p.t, p.s, n, a, b);
      if (!g) continue;
      if (g.type === 'power') { hi = Math.max(hi, g.exponent + g.error); lo = Math.max(lo, g.exponent - g.error); }
      if (!worst || (g.type === 'power' && (worst.type === 'log' || g.exponent > worst.exponent))) worst = g;
    }
    if (!worst) continue;
    const v = (h: boolean, f: boolean): LocalVerdict => (h ? 'holds' : f ? 'fails' : 'undecided');
    const bounded = worst.type === 'log' ? 'holds' : v(hi <= 1, lo > 1);
    const hs = worst.type === 'log' ? 'holds' : v(hi < 1, lo >= 1);
    return {
      where: `the point (t, s) = (${fmt(p.t, 6)}, ${fmt(p.s, 6)}), located numerically`,
      type: worst.type, exponent: worst.exponent, exponentError: worst.error, point: true, curve: false, geometry: 'point',
      at: [p.t, p.s], class: classOf(bounded, hs), bounded, hilbertSchmidt: hs,
    };
  }
  return null;
}

/** The growth of |K| from (t, s) along the unit direction n only. */
function oneSided(ev: PointEvaluator, t: number, s: number, n: readonly [number, number], a: number, b: number) {
  const L = b - a;
  const ys: number[] = [];
  for (const e of [4, 5, 6, 7]) {
    const d = L * 10 ** -e;
    if (!inSquare(t + d * n[0], s + d * n[1], a, b)) return null;
    ys.push(ev.abs(t + d * n[0], s + d * n[1]));
  }
  if (!ys.every(Number.isFinite)) return null;
  const lg = ys.map((y) => Math.log(Math.max(y, 1e-300)));
  const slope = (lg[3] - lg[1]) / (2 * Math.LN10);
  const slope1 = (lg[2] - lg[0]) / (2 * Math.LN10);
  const d1 = ys[2] - ys[1];
  const d2 = ys[3] - ys[2];
  if (d1 > 0 && Math.abs(d2 - d1) <= 0.05 * Math.abs(d1) && slope < 0.3) return { type: 'log' as const, exponent: 0, error: 0 };
  if (slope > 0.03) return { type: 'power' as const, exponent: slope, error: Math.max(3 * Math.abs(slope - slope1), 0.01) };
  return null;
}

export function measureBoundedness(ctx: CheckContext): BoundednessFacts {
  const [a, b] = ctx.domain;
  const found: Singularity[] = [];
  for (const s of ctx.engine.singularities) {
    if (s.type === 'none') continue;
    found.push({
      // A point estimate of a line is the corner where the line ends (singularity.ts): named as that corner.
      where: s.point ? `the corner (t, s) = (${fmt(s.at[0])}, ${fmt(s.at[1])})` : describePlace(s.locus.line, a, b), type: s.type, exponent: s.exponent, exponentError: s.exponentError,
      point: s.point, at: s.at, curve: false, geometry: s.geometry, bounded: s.bounded, hilbertSchmidt: s.hilbertSchmidt,
      class: classOf(s.bounded, s.hilbertSchmidt),
    });
  }
  const ev = new PointEvaluator(ctx.compiled);
  for (const u of ctx.engine.loci.unknown) {
    if (u.kind !== 'singular' || u.node.op === 'const') continue;
    let worst: Singularity | null = null;
    for (const p of findCrossings(u.node, a, b)) {
      let g = growthAt(ev, p.t, p.s, p.normal, a, b);
      if (!g) continue;
      // 1/g or g^p with g analytic and a simple zero here: the exponent as written, when the measurement agrees.
      const w = u.written;
      if (w && g.type === 'power' && Math.abs(g.exponent - w.exponent) <= g.error + 0.02) g = { type: 'power', exponent: w.exponent, error: 0 };
      const v = curveVerdicts(g);
      const cls = classOf(v.bounded, v.hs);
      if (!worst || classRank[cls] > classRank[worst.class] || (cls === worst.class && g.exponent > worst.exponent)) {
        worst = {
          where: `a curve located numerically through t = ${fmt(p.t, 4)}, s = ${fmt(p.s, 4)}`,
          type: g.type, exponent: g.exponent, exponentError: g.error, point: false, curve: true, geometry: 'curve', at: [p.t, p.s], class: cls,
          bounded: v.bounded, hilbertSchmidt: v.hs,
        };
      }
    }
    if (!worst) worst = isolatedPoint(ev, u.node, a, b);
    if (worst) found.push(worst);
  }
  found.sort((x, y) => classRank[y.class] - classRank[x.class] || y.exponent - x.exponent);
  const worst = found[0] ?? null;
  const notFinite = ctx.engine.spectrum === null && /not finite/.test(ctx.engine.reason ?? '');
  let cls: BoundednessClass = worst ? worst.class : 'hilbert-schmidt';
  let reason: string | null = null;
  if (worst && worst.class === 'unbounded') {
    reason = `${growth(worst)} toward ${worst.where}, ${worst.point
      ? 'faster than 1/r at a point, so the operator is not bounded there'
      : worst.geometry !== 'axis' ? 'which is not integrable there' : 'which is not square-integrable across a line t = c or s = c, so T maps a function to one outside L²'}`;
  } else if (notFinite) {
    cls = 'unbounded';
    reason = 'K is infinite or undefined at points inside the square, away from the lines where the expression is singular';
  }
  const open = (key: 'bounded' | 'hilbertSchmidt', threshold: string) => {
    const u = found.find((f) => f[key] === 'undecided');
    return u ? `${growth(u)} toward ${u.where}, and ${threshold} lies within the exponent's error` : null;
  };
  const undecided = {
    bounded: cls === 'unbounded' ? null : open('bounded', 'the threshold of boundedness'),
    hilbertSchmidt: cls === 'unbounded' || found.some((f) => f.hilbertSchmidt === 'fails') ? null : open('hilbertSchmidt', 'the threshold of square-integrability'),
  };
  if (cls === 'hilbert-schmidt' && undecided.hilbertSchmidt) cls = 'bounded';
  return {
    report: {
      class: cls,
      exponent: worst ? worst.exponent : null,
      where: worst ? worst.where : null,
      ...(undecided.bounded ? { undecided: { property: 'bounded' as const, reason: undecided.bounded } }
        : undecided.hilbertSchmidt ? { undecided: { property: 'hilbert-schmidt' as const, reason: undecided.hilbertSchmidt } } : {}),
    },
    singularities: found,
    reason,
    dropSpectrum: (cls === 'unbounded' || undecided.bounded !== null) && ctx.engine.spectrum !== null,
    undecided,
  };
}

function growth(s: Singularity): string {
  return s.type === 'log' ? '|K| grows like log(1/d)' : `|K| grows like d^(−${fmtExponent(s.exponent, s.exponentError)})`;
}

export function boundednessFindings(ctx: CheckContext, f: BoundednessFacts): Finding[] {
  const [a, b] = ctx.domain;
  const worst = f.singularities[0];
  const figures = { exponent: f.report.exponent, class: f.report.class, where: f.report.where };
  if (f.report.class === 'unbounded') {
    return [{ name: 'unbounded', args: { name: ctx.name, a: fmt(a), b: fmt(b), reason: f.reason ?? 'unknown reason' }, figures, covers: ['bounded', 'hilbert-schmidt'] }];
  }
  if (f.undecided.bounded || f.undecided.hilbertSchmidt) return [];
  if (f.report.class === 'bounded' && worst) {
    return [{ name: 'not-hilbert-schmidt', args: { name: ctx.name, exponent: fmtExponent(worst.exponent, worst.exponentError), where: worst.where }, figures, covers: ['hilbert-schmidt'] }];
  }
  if (worst) return [{ name: 'weakly-singular', args: { name: ctx.name, growth: growth(worst), where: worst.where }, figures, covers: [] }];
  return [];
}

export function boundedClaim(ctx: CheckContext, f: BoundednessFacts): ClaimVerdict {
  if (f.undecided.bounded) return undecided(`boundedness is undecided: ${f.undecided.bounded}`);
  if (f.report.class !== 'unbounded') return holds;
  return { outcome: 'fails', diagnostic: 'bounded-claim-failed', args: { name: ctx.name, evidence: f.reason ?? 'unknown reason' }, figures: { exponent: f.report.exponent } };
}

export function hilbertSchmidtClaim(ctx: CheckContext, f: BoundednessFacts): ClaimVerdict {
  if (f.report.class === 'hilbert-schmidt') return holds;
  const open = f.undecided.hilbertSchmidt ?? f.undecided.bounded;
  if (open) return undecided(`the Hilbert–Schmidt property is undecided: ${open}`);
  const worst = f.singularities[0];
  const evidence = f.report.class === 'unbounded'
    ? `the operator is not even bounded: ${f.reason ?? 'unknown reason'}`
    : worst ? `${growth(worst)} toward ${worst.where}, and |K|² is not integrable there` : 'the singularity is not square-integrable';
  return { outcome: 'fails', diagnostic: 'hilbert-schmidt-claim-failed', args: { name: ctx.name, evidence }, figures: { exponent: f.report.exponent } };
}
