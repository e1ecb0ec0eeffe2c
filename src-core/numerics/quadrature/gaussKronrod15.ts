/**
 * The 7-point Gauss / 15-point Kronrod pair on one panel, with the QUADPACK error estimate.
 *
 * Method: R. Piessens, E. de Doncker-Kapenga, C. W. Überhuber, D. K. Kahaner, QUADPACK: A Subroutine Package for
 * Automatic Integration, Springer, 1983, routine QK15: the Kronrod extension of the 7-point
 * Gauss rule (A. S. Kronrod, Nodes and Weights of Quadrature Formulas, 1965) is exact for degree 22, the embedded
 * Gauss rule for degree 13. The error estimate is
 *   err = resasc · min(1, (200 |K15 − G7| / resasc)^{3/2}),   raised to at least 50 ε · resabs,
 * where resabs = ∫|f| and resasc = ∫|f − mean f| by the Kronrod rule. Complex integrands use moduli throughout.
 * The constants are the QUADPACK ones; tests verify them by exact integration of all monomials of degree ≤ 22.
 */

/** Kronrod abscissae on [-1, 1], largest first; the last is the centre. Odd positions (1, 3, 5) are Gauss nodes. */
export const KRONROD15_NODES: readonly number[] = [
  0.991455371120812639206854697526329, 0.949107912342758524526189684047851,
  0.864864423359769072789712788640926, 0.741531185599394439863864773280788,
  0.586087235467691130294144845693013, 0.405845151377397166906606412076961,
  0.207784955007898467600689403773245, 0.0,
];

/** Kronrod weights matching KRONROD15_NODES. */
export const KRONROD15_WEIGHTS: readonly number[] = [
  0.022935322010529224963732008058970, 0.063092092629978553290700663189204,
  0.104790010322250183839876322541518, 0.140653259715525918745189590510238,
  0.169004726639267902826583426598550, 0.190350578064785409913256402421014,
  0.204432940075298892414161999234649, 0.209482141084727828012999174891714,
];

/** Gauss weights for the nodes KRONROD15_NODES[1], [3], [5] and the centre [7]. */
export const GAUSS7_WEIGHTS: readonly number[] = [
  0.129484966168869693270611432679082, 0.279705391489276667901467771423780,
  0.381830050505118944950369775488975, 0.417959183673469387755102040816327,
];

export const KRONROD15_POINTS = 15;

const EPSILON = Number.EPSILON; // QUADPACK's epmach = d1mach(4), the largest relative spacing
const UNDERFLOW = Number.MIN_VALUE * 2 ** 52; // smallest normal number, QUADPACK's uflow

/**
 * Writes the 15 abscissae of panel [a, b] into xs[offset .. offset+14] in the order
 * centre, then (centre − h·ξ_j, centre + h·ξ_j) for j = 0..6.
 */
export function kronrod15Abscissae(a: number, b: number, xs: Float64Array, offset: number): void {
  const c = (a + b) / 2;
  const h = (b - a) / 2;
  xs[offset] = c;
  for (let j = 0; j < 7; j++) {
    const d = h * KRONROD15_NODES[j];
    xs[offset + 1 + 2 * j] = c - d;
    xs[offset + 2 + 2 * j] = c + d;
  }
}

export interface PanelEstimate {
  readonly re: number;
  readonly im: number;
  /** QUADPACK error estimate for this panel. */
  readonly error: number;
  /** ∫_a^b |f| by the Kronrod rule. */
  readonly absIntegral: number;
}

/** K15 value and error estimate on [a, b] from values laid out as by kronrod15Abscissae. */
export function kronrod15Estimate(
  a: number,
  b: number,
  fRe: Float64Array,
  fIm: Float64Array,
  offset: number,
): PanelEstimate {
  const h = (b - a) / 2;
  const absH = Math.abs(h);
  let kRe = KRONROD15_WEIGHTS[7] * fRe[offset];
  let kIm = KRONROD15_WEIGHTS[7] * fIm[offset];
  let gRe = GAUSS7_WEIGHTS[3] * fRe[offset];
  let gIm = GAUSS7_WEIGHTS[3] * fIm[offset];
  let resabs = KRONROD15_WEIGHTS[7] * Math.hypot(fRe[offset], fIm[offset]);
  for (let j = 0; j < 7; j++) {
    const i1 = offset + 1 + 2 * j;
    const i2 = i1 + 1;
    const sRe = fRe[i1] + fRe[i2];
    const sIm = fIm[i1] + fIm[i2];
    kRe += KRONROD15_WEIGHTS[j] * sRe;
    kIm += KRONROD15_WEIGHTS[j] * sIm;
    if (j % 2 === 1) {
      const wg = GAUSS7_WEIGHTS[(j - 1) / 2];
      gRe += wg * sRe;
      gIm += wg * sIm;
    }
    resabs += KRONROD15_WEIGHTS[j] * (Math.hypot(fRe[i1], fIm[i1]) + Math.hypot(fRe[i2], fIm[i2]));
  }
  const meanRe = kRe / 2;
  const meanIm = kIm / 2;
  let resasc = KRONROD15_WEIGHTS[7] * Math.hypot(fRe[offset] - meanRe, fIm[offset] - meanIm);
  for (let j = 0; j < 7; j++) {
    const i1 = offset + 1 + 2 * j;
    const i2 = i1 + 1;
    resasc +=
      KRONROD15_WEIGHTS[j] *
      (Math.hypot(fRe[i1] - meanRe, fIm[i1] - meanIm) + Math.hypot(fRe[i2] - meanRe, fIm[i2] - meanIm));
  }
  resabs *= absH;
  resasc *= absH;
  let error = Math.hypot(kRe - gRe, kIm - gIm) * absH;
  if (resasc !== 0 && error !== 0) error = resasc * Math.min(1, (200 * error / resasc) ** 1.5);
  if (resabs > UNDERFLOW / (50 * EPSILON)) error = Math.max(50 * EPSILON * resabs, error);
  return { re: kRe * h, im: kIm * h, error, absIntegral: resabs };
}
