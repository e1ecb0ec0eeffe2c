/**
 * What every figure shares: the size of a plot, the look of axes and legends, and small helpers for data that may
 * hold non-finite numbers. Text and axis colours are neutral greys that read on light and dark pages; a page may
 * restyle them with CSS (SVG presentation attributes yield to any style rule), as the report and the editor view do.
 */
import { neutral } from './palette';
import type { VegaLiteSpec } from './plotTypes';

/** Width and height of a plot's data area, in pixels (legends go below it, so an SVG stays about 300 px wide). */
export const plotSize = 240;

/** The configuration block every figure carries. */
export function baseConfig(): VegaLiteSpec {
  return {
    background: 'transparent',
    font: 'sans-serif',
    padding: 6,
    view: { stroke: neutral, strokeOpacity: 0.5 },
    axis: {
      labelFontSize: 11,
      titleFontSize: 12,
      titleFontWeight: 'normal',
      labelColor: neutral,
      titleColor: neutral,
      domainColor: neutral,
      tickColor: neutral,
      gridColor: neutral,
      gridOpacity: 0.25,
      labelFlush: true,
      labelOverlap: true,
    },
    legend: {
      orient: 'bottom',
      direction: 'vertical',
      labelFontSize: 11,
      titleFontSize: 11,
      titleFontWeight: 'normal',
      labelColor: neutral,
      titleColor: neutral,
      labelLimit: 280,
      titleLimit: 280,
      gradientLength: 200,
      gradientThickness: 10,
      symbolStrokeWidth: 2,
      rowPadding: 3,
      // Several legends below a plot stack up instead of standing side by side (which would widen the SVG).
      layout: { bottom: { anchor: 'start', direction: 'vertical', margin: 8 } },
    },
    text: { color: neutral },
  };
}

/** A complete figure specification: size, configuration and layers. */
export function layeredSpec(layers: readonly VegaLiteSpec[], extra: VegaLiteSpec = {}): VegaLiteSpec {
  return { width: plotSize, height: plotSize, config: baseConfig(), ...extra, layer: layers };
}

export function isFiniteNumber(x: unknown): x is number {
  return typeof x === 'number' && Number.isFinite(x);
}

/**
 * An eigenvalue fit for `formatEigenvalue` after a trip through JSON, where NaN and ±∞ arrive as null: a missing
 * imaginary part is 0, a missing error is NaN (printed as `?`).
 */
export function eigenForText(ev: { re: number; im: number; error: number }): { re: number; im: number; error: number } {
  return { re: ev.re, im: isFiniteNumber(ev.im) ? ev.im : 0, error: isFiniteNumber(ev.error) ? ev.error : NaN };
}

/** An error estimate fit for formatting: NaN (printed as `?`) when it did not survive as a finite number. */
export function errorForText(error: unknown): number {
  return isFiniteNumber(error) ? error : NaN;
}

/** The q-quantile (0…1) of finite values, by sorting (for colour ranges that ignore a few extreme cells). */
export function quantile(values: readonly number[], q: number): number {
  if (values.length === 0) return NaN;
  const sorted = [...values].sort((x, y) => x - y);
  const pos = Math.min(sorted.length - 1, Math.max(0, q * (sorted.length - 1)));
  const lo = Math.floor(pos);
  const hi = Math.ceil(pos);
  return sorted[lo] + (sorted[hi] - sorted[lo]) * (pos - lo);
}

/**
 * Tick values for a logarithmic axis over [lo, hi]: the powers of ten (every second or third one over many
 * decades), with 2 and 5 times them added when the range spans three decades or fewer. Keeps the axis and its grid
 * quiet where vega would label every integer multiple.
 */
export function logTicks(lo: number, hi: number): number[] {
  if (!(lo > 0) || !(hi >= lo) || !Number.isFinite(hi)) return [];
  const first = Math.floor(Math.log10(lo));
  const last = Math.ceil(Math.log10(hi));
  const decades = last - first;
  const step = decades > 16 ? 3 : decades > 8 ? 2 : 1;
  const out: number[] = [];
  // Counted down from the top decade, so that the largest values always have a labelled tick near them.
  for (let d = last; d >= first; d -= step) {
    const p = Number(`1e${d}`);
    out.push(p);
    if (decades <= 3) out.push(2 * p, 5 * p);
  }
  return out.filter((v) => v >= lo / 1.0001 && v <= hi * 1.0001).sort((x, y) => x - y);
}

/** Number format for legend and axis labels: three significant digits, trailing zeros trimmed. */
export const shortFormat = '.3~g';
