/**
 * The heat map of K on its square (for a complex kernel: Re K and Im K on one shared diverging scale), with the
 * lines where K is not smooth drawn over it. The table under it holds the kernel's norms and trace with their
 * errors, and the non-smooth lines by name.
 */
import { formatEstimate, formatNumber } from '../text';
import { cellLayer, colourRange, locusKindLabels, lociLayers, type ColourRange } from './heatmapLayers';
import { lociToDraw } from './confirmedLoci';
import type { FigureTable, KernelPictureData, PlotFigure } from './plotTypes';
import { markNames } from './plotTypes';
import { isFiniteNumber, layeredSpec } from './specCommon';

/** True when K grows without bound somewhere on the square (the colours are then clipped). */
function isSingular(data: KernelPictureData): boolean {
  const r = data.report;
  return r.continuity?.class === 'singular'
    || (r.boundedness !== null && r.boundedness !== undefined && isFiniteNumber(r.boundedness.exponent))
    || (data.samples?.loci ?? []).some((l) => l.kind === 'singular');
}

function estimate(x: { value: number; error: number } | null | undefined): string {
  return x && isFiniteNumber(x.value) ? formatEstimate(x.value, isFiniteNumber(x.error) ? x.error : NaN) : 'not available';
}

/** The kernel-level figures: ‖T‖ with its bracket, ‖K‖_HS, the trace, and the non-smooth lines. */
export function kernelTable(data: KernelPictureData): FigureTable {
  const s = data.report.spectrum;
  const rows: string[][] = [];
  const norm = s?.norm ?? null;
  if (norm && isFiniteNumber(norm.value)) {
    const bracket = isFiniteNumber(norm.lower) && isFiniteNumber(norm.upper)
      ? ` (between ${formatNumber(norm.lower, 6)} and ${formatNumber(norm.upper, 6)})` : '';
    rows.push(['operator norm ‖T‖', `${estimate(norm)}${bracket}`]);
  }
  if (s) {
    rows.push(['Hilbert–Schmidt norm ‖K‖₂', s.hsNorm ? estimate(s.hsNorm) : 'infinite']);
    rows.push(['trace ∫K(t, t) dt', s.trace ? estimate(s.trace) : 'not integrable']);
  }
  const loci = lociToDraw(data.report, data.samples?.loci ?? []);
  for (const l of loci.drawn) rows.push(['not smooth', `${l.label} (${locusKindLabels[l.kind]})`]);
  for (const where of loci.notDrawn) rows.push(['not smooth', `${where} (not drawn)`]);
  if (s) rows.push(['discretisation', `${s.method}${s.converged ? '' : ' (accuracy target not reached)'}`]);
  return { caption: 'The kernel’s figures', columns: ['figure', 'value ± error'], rows };
}

function rangeNote(range: ColourRange): string {
  if (!range.clipped) return '';
  return ` Colours are clipped at ${formatNumber(range.lo, 3)} and ${formatNumber(range.hi, 3)}: K grows without bound`
    + ' near a singular line, and cells where it is not finite are left blank.';
}

function lociNote(data: KernelPictureData): string {
  const { drawn, notDrawn } = lociToDraw(data.report, data.samples?.loci ?? []);
  const missing = notDrawn.length > 0 ? ` Not drawn (no straight line describes it): ${notDrawn.join('; ')}.` : '';
  if (drawn.length === 0 && notDrawn.length === 0) return ' K is smooth on the whole square.';
  if (drawn.length === 0) return missing;
  return ` Black lines: where K is not smooth (${drawn.map((l) => l.label).join('; ')}).${missing}`;
}

/** The heat map figure(s) of K: one for a real kernel, Re K and Im K for a complex one; none without samples. */
export function kernelHeatmapFigures(data: KernelPictureData): PlotFigure[] {
  const samples = data.samples;
  if (!samples) return [];
  const clip = isSingular(data);
  const n = samples.points;
  const grid = `${n} × ${n} cells, each coloured by K at its centre.`;
  const table = kernelTable(data);
  const overlays = lociLayers(lociToDraw(data.report, samples.loci).drawn, samples.domain, data.axes);
  if (!samples.im) {
    const range = colourRange(samples.re, clip);
    if (!range) return [];
    return [{
      kind: 'kernel',
      title: `K(t, s) on the square`,
      caption: `The kernel on ${grid}${lociNote(data)}${rangeNote(range)}`,
      spec: layeredSpec([cellLayer(samples, samples.re, range, data.axes, 'K(t, s)', markNames.kernelCells), ...overlays]),
      tables: [table],
    }];
  }
  // One scale for both parts, so that equal colours mean equal values in the two pictures.
  const both = [...samples.re, ...samples.im];
  const range = colourRange(both, clip, true);
  if (!range) return [];
  const part = (which: 're' | 'im'): PlotFigure => ({
    kind: which === 're' ? 'kernel-re' : 'kernel-im',
    title: which === 're' ? 'Re K(t, s)' : 'Im K(t, s)',
    caption: `The ${which === 're' ? 'real' : 'imaginary'} part of the kernel on ${grid} Both parts share one colour`
      + ` scale centred on zero.${lociNote(data)}${rangeNote(range)}`,
    spec: layeredSpec([
      cellLayer(samples, which === 're' ? samples.re : samples.im!, range, data.axes, which === 're' ? 'Re K(t, s)' : 'Im K(t, s)', markNames.kernelCells),
      ...overlays,
    ]),
    tables: which === 're' ? [table] : [],
  });
  return [part('re'), part('im')];
}
