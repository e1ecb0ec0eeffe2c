/** Public surface of the quadrature layer. */
export type { Rule1D, Rule2D, Vec2, ComplexNumber } from './types';
export { QuadratureInputError } from './types';
export { gaussLegendre, mapRule, GAUSS_LEGENDRE_MAX_POINTS } from './gaussLegendre';
// gaussJacobi (./gaussJacobi.ts) is imported directly where needed: it loads mathjs for Γ, which the analysis path
// must not pay for at start-up.
export { legendreMatrix, legendreDerivative, panelBasis, panelBasisDerivative } from './legendreBasis';
export { compositeRule } from './compositeRule';
export {
  gradedPanels,
  DEFAULT_GRADING_LEVELS,
  DEFAULT_GRADING_RATIO,
  type GradedPanelsOptions,
} from './gradedPanels';
export {
  collapsedTriangleRule,
  type CollapsedTriangleOptions,
  type TriangleGrading,
  type TriangleRule,
} from './collapsedTriangle';
export { polygonArea, signedPolygonArea, splitConvexPolygon, triangulateConvex, type PolygonSplit } from './polygon';
export {
  KRONROD15_NODES,
  KRONROD15_WEIGHTS,
  GAUSS7_WEIGHTS,
  kronrod15Abscissae,
  kronrod15Estimate,
  type PanelEstimate,
} from './gaussKronrod15';
export {
  integrateAdaptive,
  integrateAdaptiveArray,
  DEFAULT_ABS_TOL,
  DEFAULT_REL_TOL,
  DEFAULT_MAX_EVALUATIONS,
  type AdaptiveOptions,
  type AdaptiveResult,
  type AdaptiveStatus,
  type ArrayIntegrand,
  type ScalarIntegrand,
} from './integrateAdaptive';
