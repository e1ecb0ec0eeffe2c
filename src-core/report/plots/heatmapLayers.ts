/**
 * The building blocks of a heat map on the square [a, b]²: one rectangle per sampled cell coloured by a value,
 * the colour scale (sequential for one-signed values, diverging and centred on zero for signed ones, clipped when a
 * few cells near a singular line would wash out the rest), and the overlay of the lines where K is not smooth.
 * t runs along the horizontal axis and s up the vertical one.
 */
import { divergingScheme, neutral, overlayHalo, overlayInk, sequentialScheme } from './palette';
import type { AxisNames, KernelSamples, LocusSegment, VegaLiteSpec } from './plotTypes';
import { markNames } from './plotTypes';
import { isFiniteNumber, quantile, shortFormat } from './specCommon';

/** How the values of a heat map are coloured. */
export interface ColourRange {
  readonly kind: 'sequential' | 'diverging';
  readonly lo: number;
  readonly hi: number;
  /** True when values beyond [lo, hi] exist and take the end colours. */
  readonly clipped: boolean;
}

/**
 * The colour range of some values: sequential over [min, max] when they have one sign, else diverging over [−M, M].
 * With `clip`, M (or max) is the 97th percentile of |value|, so that the growth toward a singular line does not
 * leave the rest of the square in one colour.
 */
export function colourRange(values: readonly (number | null)[], clip: boolean, forceDiverging = false): ColourRange | null {
  const finite = values.filter(isFiniteNumber);
  if (finite.length === 0) return null;
  let min = Infinity;
  let max = -Infinity;
  for (const v of finite) {
    if (v < min) min = v;
    if (v > max) max = v;
  }
  const top = Math.max(Math.abs(min), Math.abs(max));
  if (top === 0) return { kind: 'diverging', lo: -1, hi: 1, clipped: finite.length < values.length };
  const cut = clip ? quantile(finite.map(Math.abs), 0.97) : top;
  const m = cut > 0 ? cut : top;
  const clipped = finite.length < values.length || m < top * (1 - 1e-12);
  const signed = forceDiverging || (min < -1e-12 * top && max > 1e-12 * top);
  if (signed) return { kind: 'diverging', lo: -m, hi: m, clipped };
  // One sign: from the value nearest zero to the clipped extreme; a constant kernel gets [0, K] (or [K, 0]).
  let lo = max <= 0 ? Math.max(min, -m) : min;
  let hi = max <= 0 ? max : Math.min(max, m);
  if (!(hi > lo)) {
    lo = Math.min(0, lo);
    hi = Math.max(0, hi);
  }
  return { kind: 'sequential', lo, hi, clipped };
}

function scaleOf(range: ColourRange): VegaLiteSpec {
  return range.kind === 'diverging'
    ? { scheme: divergingScheme, domain: [range.lo, range.hi], domainMid: 0, clamp: true }
    : { scheme: sequentialScheme, domain: [range.lo, range.hi], clamp: true };
}

/** Quantitative x (t) and y (s) encodings over the square, with the axis titles. */
export function squareAxes(axes: AxisNames, domain: readonly [number, number], tField: string, sField: string): VegaLiteSpec {
  const scale = { domain: [domain[0], domain[1]], nice: false, zero: false };
  return {
    x: { field: tField, type: 'quantitative', scale, axis: { title: axes.t, tickCount: 5 } },
    y: { field: sField, type: 'quantitative', scale, axis: { title: axes.s, tickCount: 5 } },
  };
}

/** One rectangle per cell with a finite value: cell (i, j) spans [t_i ± h/2] × [s_j ± h/2]. */
export function cellLayer(
  samples: KernelSamples,
  values: readonly (number | null)[],
  range: ColourRange,
  axes: AxisNames,
  legendTitle: string,
  markName: string,
): VegaLiteSpec {
  const [a, b] = samples.domain;
  const n = samples.points;
  const h = (b - a) / n;
  // Each rectangle reaches 3 % into its neighbours (and is clipped to the square), so that no hairline seams show
  // between cells where anti-aliasing would leave them.
  const over = 0.03 * h;
  const cells: { t0: number; t1: number; s0: number; s1: number; v: number }[] = [];
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) {
      const v = values[i * n + j];
      if (!isFiniteNumber(v)) continue;
      cells.push({ t0: a + i * h, t1: a + (i + 1) * h + over, s0: a + j * h, s1: a + (j + 1) * h + over, v });
    }
  }
  const { x, y } = squareAxes(axes, samples.domain, 't0', 's0') as { x: VegaLiteSpec; y: VegaLiteSpec };
  return {
    name: markName,
    data: { values: cells },
    mark: { type: 'rect', aria: false, clip: true },
    encoding: {
      x,
      x2: { field: 't1' },
      y,
      y2: { field: 's1' },
      color: {
        field: 'v',
        type: 'quantitative',
        scale: scaleOf(range),
        legend: { title: range.clipped ? `${legendTitle} (colours clipped)` : legendTitle, direction: 'horizontal', format: shortFormat, tickCount: 5 },
      },
    },
  };
}

export const locusKindLabels: Readonly<Record<string, string>> = {
  kink: 'kink: K′ jumps',
  jump: 'jump: K jumps',
  singular: 'singular: |K| → ∞',
};

const dashOf: Readonly<Record<string, number[]>> = { kink: [6, 3], jump: [1, 0], singular: [2, 2] };

/** The non-smooth lines (black on a white halo, dash by kind) and corner points, or no layer. */
export function lociLayers(loci: readonly LocusSegment[], domain: readonly [number, number], axes: AxisNames): VegaLiteSpec[] {
  const lines = loci.filter((l) => l.from[0] !== l.to[0] || l.from[1] !== l.to[1]);
  const points = loci.filter((l) => l.from[0] === l.to[0] && l.from[1] === l.to[1]);
  const layers: VegaLiteSpec[] = [];
  const enc = squareAxes(axes, domain, 't', 's');
  if (lines.length > 0) {
    const rows = lines.flatMap((l, id) => [
      { id, order: 0, t: l.from[0], s: l.from[1], kind: locusKindLabels[l.kind], where: l.label },
      { id, order: 1, t: l.to[0], s: l.to[1], kind: locusKindLabels[l.kind], where: l.label },
    ]);
    const kinds = [...new Set(lines.map((l) => l.kind))];
    layers.push({
      data: { values: rows },
      mark: { type: 'line', stroke: overlayHalo, strokeWidth: 4.5, opacity: 0.85, aria: false, clip: true },
      encoding: { ...enc, detail: { field: 'id', type: 'nominal' }, order: { field: 'order' } },
    });
    layers.push({
      name: markNames.loci,
      data: { values: rows },
      mark: { type: 'line', stroke: overlayInk, strokeWidth: 1.8, clip: true },
      encoding: {
        ...enc,
        detail: { field: 'id', type: 'nominal' },
        order: { field: 'order' },
        description: { field: 'where' },
        strokeDash: {
          field: 'kind',
          type: 'nominal',
          scale: { domain: kinds.map((k) => locusKindLabels[k]), range: kinds.map((k) => dashOf[k]) },
          legend: { title: 'K is not smooth along the black lines', symbolStrokeColor: neutral, symbolType: 'stroke' },
        },
      },
    });
  }
  if (points.length > 0) {
    layers.push({
      name: markNames.lociPoints,
      data: { values: points.map((p) => ({ t: p.from[0], s: p.from[1], where: p.label })) },
      mark: { type: 'point', shape: 'diamond', size: 90, filled: true, fill: overlayInk, stroke: overlayHalo, strokeWidth: 1.5 },
      encoding: { ...enc, description: { field: 'where' } },
    });
  }
  return layers;
}
