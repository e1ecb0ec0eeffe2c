/**
 * Where a kernel fails to be Hermitian: the defect D(t, s) = K(t, s) − conj K(s, t) as a heat map (signed and
 * diverging for a real kernel, where D is antisymmetric; its modulus for a complex one), with the point where the
 * Hermitian check measured the largest |D| marked. Drawn only when the check found the kernel not Hermitian.
 */
import { formatEstimate, formatNumber } from '../text';
import { cellLayer, colourRange, lociLayers } from './heatmapLayers';
import { overlayHalo, overlayInk } from './palette';
import type { KernelPictureData, KernelSamples, PlotFigure, VegaLiteSpec } from './plotTypes';
import { markNames } from './plotTypes';
import { isFiniteNumber, layeredSpec } from './specCommon';
import { squareAxes } from './heatmapLayers';
import { lociToDraw } from './confirmedLoci';

/** D(t_i, s_j) on the sample grid: signed (real kernels) or |D| (complex kernels); null where K is not finite. */
export function defectValues(samples: KernelSamples): (number | null)[] {
  const n = samples.points;
  const out: (number | null)[] = new Array(n * n);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) {
      const p = i * n + j;
      const q = j * n + i;
      const kr = samples.re[p];
      const mr = samples.re[q];
      if (!isFiniteNumber(kr) || !isFiniteNumber(mr)) {
        out[p] = null;
        continue;
      }
      if (!samples.im) {
        out[p] = kr - mr;
        continue;
      }
      const ki = samples.im[p];
      const mi = samples.im[q];
      out[p] = isFiniteNumber(ki) && isFiniteNumber(mi) ? Math.hypot(kr - mr, ki + mi) : null;
    }
  }
  return out;
}

function complexText(v: { re: number; im: number }): string {
  if (!isFiniteNumber(v.re)) return 'not finite';
  if (!isFiniteNumber(v.im) || v.im === 0) return formatNumber(v.re, 6);
  return `${formatNumber(v.re, 6)} ${v.im < 0 ? '−' : '+'} ${formatNumber(Math.abs(v.im), 6)}i`;
}

/** The defect figure, or null when the kernel is Hermitian (or was not checked, or has no samples). */
export function hermitianDefectFigure(data: KernelPictureData): PlotFigure | null {
  const h = data.report.hermitian;
  const samples = data.samples;
  if (!h || h.holds || !samples) return null;
  const complex = samples.im !== null;
  const values = defectValues(samples);
  const range = colourRange(values, data.report.continuity?.class === 'singular', !complex);
  if (!range) return null;
  const legend = complex ? '|K(t, s) − conj K(s, t)|' : 'K(t, s) − K(s, t)';
  const layers: VegaLiteSpec[] = [cellLayer(samples, values, range, data.axes, legend, markNames.defectCells), ...lociLayers(lociToDraw(data.report, samples.loci).drawn, samples.domain, data.axes)];
  const worst = h.worst;
  if (worst && isFiniteNumber(worst.t) && isFiniteNumber(worst.s)) {
    const enc = squareAxes(data.axes, samples.domain, 't', 's');
    const row = { t: worst.t, s: worst.s, what: 'largest defect, at (t, s)' };
    layers.push({
      name: markNames.worstPoint,
      data: { values: [row] },
      mark: { type: 'point', filled: true, size: 110, fill: overlayInk, stroke: overlayHalo, strokeWidth: 1.5, opacity: 1 },
      encoding: {
        ...enc,
        shape: { field: 'what', type: 'nominal', scale: { domain: [row.what], range: ['diamond'] }, legend: { title: null } },
        description: { value: `largest defect at t = ${worst.t}, s = ${worst.s}` },
      },
    });
  }
  const defect = isFiniteNumber(h.defect)
    ? (isFiniteNumber(h.defectError) ? formatEstimate(h.defect, h.defectError) : formatNumber(h.defect, 3))
    : 'not available';
  const rows: string[][] = [['relative defect ‖K − K*‖₂ / ‖K‖₂', `${defect} (sampled on the check’s grid)`]];
  if (worst) {
    rows.push(['largest at', `t = ${formatNumber(worst.t, 6)}, s = ${formatNumber(worst.s, 6)}`]);
    rows.push(['K(t, s)', complexText(worst.value)]);
    rows.push([complex ? 'conj K(s, t)' : 'K(s, t)', complexText(worst.mirrored)]);
  }
  return {
    kind: 'defect',
    title: complex ? 'Hermitian defect |K(t, s) − conj K(s, t)|' : 'Symmetry defect K(t, s) − K(s, t)',
    caption: complex
      ? 'How far K is from Hermitian at each cell: zero (darkest) where K(t, s) equals conj K(s, t). The diamond marks where the check measured the largest difference.'
      : 'K minus its transpose, antisymmetric about the diagonal: zero (the neutral middle colour) where K is symmetric, blue and orange of equal depth on opposite sides. The diamond marks where the check measured the largest difference.',
    spec: layeredSpec(layers),
    tables: [{ caption: 'Where the defect is largest', columns: ['figure', 'value'], rows }],
  };
}
