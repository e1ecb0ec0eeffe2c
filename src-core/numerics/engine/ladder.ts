/**
 * The sequence of discretisations the engine climbs. Kernels that are smooth on every panel pair (analytic, or with
 * kinks and jumps only on loci the panels respect) are refined in the polynomial degree (p-refinement: exponential
 * convergence), then in the number of panels. Kernels with singular loci use hp-refinement: geometric grading toward
 * the singular points grows together with the degree (Gui & Babuška 1986; Schwab 1998, ch. 4). Kernels with
 * non-smooth places the expression analysis could not place on straight lines get h-refinement on top.
 */
import type { Discretisation } from './assemble';
import { meshBreakpoints, type MeshPlan } from './mesh';

export interface LadderOptions {
  readonly singular: boolean;
  readonly unknownLoci: boolean;
  readonly maxSize: number;
  readonly minSize: number;
}

function make(plan: MeshPlan, split: number, levels: number, degree: number, singular: boolean, step = 0): Discretisation {
  const breakpoints = meshBreakpoints(plan, split, levels);
  return {
    breakpoints,
    degree,
    // Singular levels share one order so that the cached unit-square rules are reused from level to level.
    order: singular ? Math.max(degree + 6, 20) : degree + 8,
    // The singular quadrature is refined with the basis, so level-to-level differences also measure its error.
    singularLevels: singular ? 10 + 2 * step : 0,
    gradedPoints: singular ? 8 + step : 0,
  };
}

const size = (d: Discretisation) => (d.breakpoints.length - 1) * (d.degree + 1);

export function buildLadder(plan: MeshPlan, o: LadderOptions): Discretisation[] {
  const steps: Discretisation[] = [];
  if (o.singular) {
    for (let k = 0; k < 12; k++) {
      steps.push(make(plan, o.unknownLoci ? 4 + 2 * k : 4, 2 + k, 4 + k, true, k));
    }
  } else if (o.unknownLoci) {
    for (const [split, degree] of [[4, 5], [8, 5], [8, 7], [16, 7], [24, 7], [32, 7], [48, 7], [64, 7]] as const) {
      steps.push(make(plan, split, 0, degree, false));
    }
  } else {
    // Roughly ×1.5 more unknowns per level: enough levels for a convergence rate, few wasted small ones.
    const p: [number, number][] = [
      [1, 7], [1, 11], [1, 15], [1, 23], [2, 23], [3, 23], [4, 23], [6, 23], [8, 23], [12, 23], [16, 23],
    ];
    // Many loci make many panels: when degree 7 on them is beyond the resolution cap, lower degrees come first.
    if (size(make(plan, 1, 0, 7, false)) > o.maxSize) p.unshift([1, 1], [1, 2], [1, 3], [1, 5]);
    for (const [split, degree] of p) steps.push(make(plan, split, 0, degree, false));
  }
  const fits = steps.filter((d) => size(d) <= o.maxSize);
  // Start where the basis can hold the requested eigenvalues comfortably.
  const firstUseful = fits.findIndex((d) => size(d) >= o.minSize);
  // Empty when not even the coarsest level fits the resolution cap: the caller then follows fewer loci.
  return firstUseful < 0 ? fits.slice(-2) : fits.slice(firstUseful);
}

export { size as discretisationSize };
