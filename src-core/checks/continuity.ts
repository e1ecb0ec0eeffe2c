/**
 * Continuity of K on the closed square, as Mercer's theorem assumes: continuous, jump (across which curve and by
 * how much) or singular (from the boundedness check). Kinks, where the first derivative jumps, are reported as
 * information: the kernel stays continuous, but plain quadrature converges slowly across them.
 *
 * The expression analysis (loci.ts) names candidate curves: comparisons, sign and floor may jump, abs, min and max
 * may kink, divisions and fractional powers may be singular. Each candidate is confirmed numerically at five
 * points along it (a few bisected crossings for curves that are not straight lines), stepping a distance d along
 * the normal to both sides:
 *  - jump: J(d) = |K(p + d·n) − K(p − d·n)| at d = 10⁻⁶ L and 10⁻⁸ L (L = b − a). A jump keeps J as d shrinks,
 *    a continuous kernel has J ∝ d; the jump is J(10⁻⁸ L) with error |J(10⁻⁶ L) − J(10⁻⁸ L)|, counted when it
 *    exceeds 10⁻⁹ of max |K| and half of J(10⁻⁶ L).
 *  - kink: the difference of the one-sided difference quotients, S(h) = |(K(p + 2h n) − K(p + h n)) −
 *    (K(p − h n) − K(p − 2h n))| / h, at h = 10⁻³ L and 10⁻⁴ L; a kink keeps S, a smooth kernel has S ∝ h.
 * So abs(t − s)^2 has no kink, sign(t − s)·(t − s) is continuous with a kink, t < s ? i : −i jumps by 2.
 * Finding: KW520 (jump, info), KW521 (kink, info). Claim: `continuous` (KW603).
 */
import type { ContinuityClass, ContinuityReport } from '../analysis/types';
import { fmtExponent, type BoundednessFacts } from './boundedness';
import type { ClaimVerdict, CheckContext, Finding } from './types';
import { holds } from './types';
import { findCrossings } from './curves';
import { PointEvaluator, describePlace, fmt, fmtEstimate, inSquare, kernelScale, lineInSquare, pointsAlong } from './sampling';

interface Site {
  readonly where: string;
  readonly points: readonly { readonly p: readonly [number, number]; readonly n: readonly [number, number] }[];
}

export interface JumpFinding {
  readonly where: string;
  readonly jump: number;
  readonly error: number;
  readonly points: number;
}

export interface ContinuityFacts {
  readonly report: ContinuityReport;
  readonly jumps: readonly JumpFinding[];
  readonly kinks: readonly { readonly where: string; readonly slope: number }[];
  /** The clause for a failed `continuous` claim, e.g. “jumps across the diagonal t = s by up to 2 ± 1e-8”. */
  readonly evidence: string | null;
}

function candidateSites(ctx: CheckContext, b: BoundednessFacts): Site[] {
  const [lo, hi] = ctx.domain;
  const singularLines = new Set(ctx.engine.singularities.filter((s) => s.type !== 'none').map((s) => s.locus));
  const sites: Site[] = [];
  for (const locus of ctx.engine.loci.loci) {
    if (singularLines.has(locus)) continue;
    const l = lineInSquare(locus.line, lo, hi);
    if (!l || l.point || l.onEdge) continue;
    const points = pointsAlong(l, [0.1, 0.3, 0.5, 0.7, 0.9]).map((p) => ({ p, n: l.normal }));
    sites.push({ where: describePlace(locus.line, lo, hi), points });
  }
  if (b.singularities.some((s) => s.curve)) return sites; // singular anyway: no need to look for jumps there
  for (const u of ctx.engine.loci.unknown) {
    if (u.node.op === 'const') continue;
    const crossings = findCrossings(u.node, lo, hi, 5);
    if (crossings.length === 0) continue;
    const first = crossings[0];
    sites.push({
      where: `a curve located numerically through t = ${fmt(first.t, 4)}, s = ${fmt(first.s, 4)}`,
      points: crossings.map((c) => ({ p: [c.t, c.s] as const, n: c.normal })),
    });
  }
  return sites;
}

export function measureContinuity(ctx: CheckContext, bounded: BoundednessFacts): ContinuityFacts {
  const [a, b] = ctx.domain;
  const L = b - a;
  const ev = new PointEvaluator(ctx.compiled);
  const scale = kernelScale(ctx.compiled, a, b);
  const diff = (p: readonly [number, number], n: readonly [number, number], x: number, y: number) => {
    const u = ev.at(p[0] + x * n[0], p[1] + x * n[1]);
    const v = ev.at(p[0] + y * n[0], p[1] + y * n[1]);
    return { re: u[0] - v[0], im: u[1] - v[1] };
  };
  const jumps: JumpFinding[] = [];
  const kinks: { where: string; slope: number }[] = [];
  for (const site of candidateSites(ctx, bounded)) {
    let jump = 0;
    let error = 0;
    let count = 0;
    let slope = 0;
    for (const { p, n } of site.points) {
      const ok = (d: number) => inSquare(p[0] + d * n[0], p[1] + d * n[1], a, b) && inSquare(p[0] - d * n[0], p[1] - d * n[1], a, b);
      const d1 = 1e-6 * L;
      const d2 = 1e-8 * L;
      if (!ok(d1)) continue;
      const j1 = diff(p, n, d1, -d1);
      const j2 = diff(p, n, d2, -d2);
      const J1 = Math.hypot(j1.re, j1.im);
      const J2 = Math.hypot(j2.re, j2.im);
      if (Number.isFinite(J2) && J2 > 1e-9 * scale && J2 > 0.5 * J1) {
        count++;
        if (J2 > jump) jump = J2;
        error = Math.max(error, Math.abs(J1 - J2));
        continue;
      }
      const h1 = 1e-3 * L;
      const h2 = 1e-4 * L;
      if (!ok(2 * h1)) continue;
      const kinkAt = (h: number) => {
        const right = diff(p, n, 2 * h, h);
        const left = diff(p, n, -h, -2 * h);
        return Math.hypot(right.re - left.re, right.im - left.im) / h;
      };
      const S1 = kinkAt(h1);
      const S2 = kinkAt(h2);
      if (Number.isFinite(S2) && S2 > 1e-6 * scale / L && S2 > 0.5 * S1) slope = Math.max(slope, S2);
    }
    if (count > 0) jumps.push({ where: site.where, jump, error: Math.max(error, 4 * Number.EPSILON * scale), points: count });
    else if (slope > 0) kinks.push({ where: site.where, slope });
  }
  jumps.sort((x, y) => y.jump - x.jump);
  const worstSingular = bounded.singularities[0];
  let cls: ContinuityClass = 'continuous';
  let where: string | null = null;
  let evidence: string | null = null;
  if (worstSingular) {
    cls = 'singular';
    where = worstSingular.where;
    evidence = worstSingular.type === 'log'
      ? `is singular: |K| grows like log(1/d) toward ${where}`
      : `is singular: |K| grows like d^(−${fmtExponent(worstSingular.exponent, worstSingular.exponentError)}) toward ${where}`;
  } else if (bounded.report.class === 'unbounded') {
    cls = 'singular';
    evidence = `is not finite: ${bounded.reason ?? 'unknown reason'}`;
  } else if (jumps.length > 0) {
    cls = 'jump';
    where = jumps[0].where;
    evidence = `jumps across ${where} by up to ${fmtEstimate(jumps[0].jump, jumps[0].error)}`;
  }
  return {
    report: {
      class: cls,
      where,
      jump: cls === 'jump' ? { value: jumps[0].jump, error: jumps[0].error } : null,
      jumps: cls === 'jump' ? jumps.map((j) => j.where) : [],
      kinks: kinks.map((k) => k.where),
    },
    jumps,
    kinks,
    evidence,
  };
}

export function continuityFindings(ctx: CheckContext, f: ContinuityFacts): Finding[] {
  const out: Finding[] = [];
  if (f.report.class === 'jump') {
    for (const j of f.jumps) {
      out.push({
        name: 'jump', args: { name: ctx.name, where: j.where, jump: fmtEstimate(j.jump, j.error), points: j.points },
        figures: { jump: j.jump, error: j.error, where: j.where }, covers: ['continuous'],
      });
    }
  }
  for (const k of f.kinks) {
    out.push({ name: 'kink', args: { name: ctx.name, where: k.where, slope: fmt(k.slope, 3) }, figures: { slope: k.slope, where: k.where }, covers: [] });
  }
  return out;
}

export function continuousClaim(ctx: CheckContext, f: ContinuityFacts): ClaimVerdict {
  if (f.report.class === 'continuous') return holds;
  return {
    outcome: 'fails', diagnostic: 'continuous-claim-failed', args: { name: ctx.name, evidence: f.evidence ?? 'is not continuous' },
    figures: { class: f.report.class, where: f.report.where, jump: f.report.jump?.value ?? null },
  };
}
