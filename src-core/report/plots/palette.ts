/**
 * The colours of the pictures, chosen once, with the reasons:
 *
 * - Values of one sign (|K|, a non-negative kernel, a defect modulus): Vega's `viridis`, perceptually uniform (equal
 *   steps in value look like equal steps in colour), monotone in lightness so it survives grey-scale printing and
 *   the common colour-vision deficiencies, and without a white end that would vanish on a light page or glare on a
 *   dark one.
 * - Signed values (a kernel that changes sign, Re K and Im K, the antisymmetric defect K − Kᵀ): Vega's `blueorange`,
 *   a diverging scheme centred on zero. Blue against orange stays distinct for red–green colour blindness, which a
 *   red–blue or red–green scheme does not.
 * - Curves and points (eigenfunctions, the sign of an eigenvalue): four mid-tone colours of our own whose contrast is
 *   at least 3.3 : 1 on white and on the usual dark editor background (#1e1e1e), so the same SVG reads in both
 *   themes. Colour is never the only cue: each curve also has its own dash pattern and each sign its own shape.
 * - Lines drawn over a heat map (non-smooth loci, the worst defect point): black with a white halo, which stands out
 *   on every colour of both schemes. Their legend symbols and the neutral marks (‖T‖) use `neutral`, a grey with
 *   4 : 1 contrast on white and on #1e1e1e.
 */

/** Sequential scheme for one-signed values. */
export const sequentialScheme = 'viridis';
/** Diverging scheme for signed values, centred on zero. */
export const divergingScheme = 'blueorange';

/** Series colours: contrast ≥ 3.3 : 1 against #ffffff and #1e1e1e (blue, amber, teal, magenta). */
export const seriesColours = ['#2f86d8', '#c96d10', '#1a9985', '#c2559e'] as const;

/** Dash patterns that go with the series colours (solid, long dash, dash-dot, short dash). */
export const seriesDashes: readonly (readonly number[])[] = [[1, 0], [7, 3], [7, 2, 2, 2], [3, 2]];

/** A grey that reads on light and dark backgrounds (4 : 1 on both). */
export const neutral = '#7f7f7f';

/** Overlay lines on heat maps: the line and its halo. */
export const overlayInk = '#000000';
export const overlayHalo = '#ffffff';

/** Eigenvalue signs: colour and shape. */
export const positiveColour = seriesColours[0];
export const negativeColour = seriesColours[1];
