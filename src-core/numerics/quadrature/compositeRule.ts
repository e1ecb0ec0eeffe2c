/**
 * Composite Gauss–Legendre rules on a partition of an interval.
 *
 * Method: the Gauss–Legendre rule mapped affinely to each panel [t_i, t_{i+1}] and concatenated (e.g. P. J. Davis
 * and P. Rabinowitz, Methods of Numerical Integration, 2nd ed., 1984, ch. 2, compound rules). A per-panel point count
 * gives the hp-variant used on geometric meshes: few points on the tiny panels next to a singularity, more on
 * the large ones.
 */
import { gaussLegendre } from './gaussLegendre';
import { QuadratureInputError, requireInteger, type Rule1D } from './types';

/**
 * The composite rule on the panels between consecutive breakpoints (strictly increasing, at least two).
 * `pointsPerPanel` is one count for all panels or one count per panel. Nodes come out ascending.
 */
export function compositeRule(breakpoints: readonly number[], pointsPerPanel: number | readonly number[]): Rule1D {
  const panels = breakpoints.length - 1;
  if (panels < 1) {
    throw new QuadratureInputError(`compositeRule: need at least two breakpoints, got ${breakpoints.length}`);
  }
  for (let i = 0; i <= panels; i++) {
    if (!Number.isFinite(breakpoints[i])) {
      throw new QuadratureInputError(`compositeRule: breakpoint ${i} is not finite (${breakpoints[i]})`);
    }
    if (i > 0 && !(breakpoints[i] > breakpoints[i - 1])) {
      throw new QuadratureInputError(
        `compositeRule: breakpoints must increase strictly, but t[${i - 1}] = ${breakpoints[i - 1]} ≥ t[${i}] = ${breakpoints[i]}`,
      );
    }
  }
  const counts: number[] = [];
  if (typeof pointsPerPanel === 'number') {
    requireInteger(pointsPerPanel, 'compositeRule: pointsPerPanel', 1);
    for (let i = 0; i < panels; i++) counts.push(pointsPerPanel);
  } else {
    if (pointsPerPanel.length !== panels) {
      throw new QuadratureInputError(
        `compositeRule: ${panels} panels but ${pointsPerPanel.length} point counts were given`,
      );
    }
    for (let i = 0; i < panels; i++) {
      requireInteger(pointsPerPanel[i], `compositeRule: pointsPerPanel[${i}]`, 1);
      counts.push(pointsPerPanel[i]);
    }
  }
  const total = counts.reduce((s, c) => s + c, 0);
  const nodes = new Float64Array(total);
  const weights = new Float64Array(total);
  let offset = 0;
  for (let i = 0; i < panels; i++) {
    const base = gaussLegendre(counts[i]);
    const a = breakpoints[i];
    const b = breakpoints[i + 1];
    const half = (b - a) / 2;
    const mid = (a + b) / 2;
    for (let j = 0; j < counts[i]; j++) {
      nodes[offset + j] = mid + half * base.nodes[j];
      weights[offset + j] = half * base.weights[j];
    }
    offset += counts[i];
  }
  return { nodes, weights };
}
