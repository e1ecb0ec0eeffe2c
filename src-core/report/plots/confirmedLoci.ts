/**
 * Which non-smooth lines to draw. The engine reads candidate lines from the expression (abs, min, max, comparisons,
 * divisions); the continuity and boundedness checks then measure K across them. When the checks ran, a line is
 * drawn only if they name it (as a kink, the place of a jump or singularity, or the worst singularity), so that the
 * picture agrees with the verdicts: `abs(t − s) < 3 ? 1 : 0` has a candidate kink on the diagonal where K is in fact
 * constant. Places the checks found but no straight line describes (“a curve located numerically through …”) cannot
 * be drawn; they are returned by name for the caption. Without check results every candidate is drawn.
 */
import type { KernelReport } from '../../analysis/types';
import type { LocusSegment } from './plotTypes';

export interface LociToDraw {
  readonly drawn: readonly LocusSegment[];
  /** Places the checks name that are not among the drawn lines. */
  readonly notDrawn: readonly string[];
}

export function lociToDraw(report: KernelReport, candidates: readonly LocusSegment[]): LociToDraw {
  const c = report.continuity;
  const b = report.boundedness;
  if (!c && !b) return { drawn: candidates, notDrawn: [] };
  const named = new Set<string>();
  if (c?.where) named.add(c.where);
  for (const j of c?.jumps ?? []) named.add(j);
  for (const k of c?.kinks ?? []) named.add(k);
  if (b?.where) named.add(b.where);
  const drawn = candidates.filter((l) => named.has(l.label));
  const notDrawn = [...named].filter((n) => !drawn.some((l) => l.label === n));
  return { drawn, notDrawn };
}
