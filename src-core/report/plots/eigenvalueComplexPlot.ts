/**
 * The eigenvalues of a kernel that is not Hermitian, in the complex plane: each λ_k a point at (Re λ, Im λ) with
 * error bars ±error along both axes (visible only where larger than the mark), inside the disc |z| ≤ ‖T‖ that holds
 * the whole spectrum. Both axes have the same scale, so the disc is round.
 */
import type { KernelReport } from '../../analysis/types';
import { eigenvalueTable } from './eigenvalueIndexPlot';
import { neutral, positiveColour } from './palette';
import type { PlotFigure, VegaLiteSpec } from './plotTypes';
import { markNames } from './plotTypes';
import { isFiniteNumber, layeredSpec, plotSize, shortFormat } from './specCommon';

export function eigenvalueComplexFigure(report: KernelReport): PlotFigure | null {
  const s = report.spectrum;
  if (!s || s.eigenvalues.length === 0) return null;
  const points = s.eigenvalues
    .map((ev, i) => ({ ev, k: i + 1 }))
    .filter(({ ev }) => isFiniteNumber(ev.re) && isFiniteNumber(ev.im))
    .map(({ ev, k }) => {
      const e = isFiniteNumber(ev.error) ? ev.error : 0;
      return { k, re: ev.re, im: ev.im, reLo: ev.re - e, reHi: ev.re + e, imLo: ev.im - e, imHi: ev.im + e, what: 'eigenvalue λ_k (bars: ± error)', label: `λ${k} = ${ev.re} + ${ev.im}i ± ${ev.error}` };
    });
  if (points.length === 0) return null;
  const norm = s.norm && isFiniteNumber(s.norm.value) && s.norm.value > 0 ? s.norm : null;
  const reach = Math.max(norm ? norm.value : 0, ...points.map((p) => Math.max(Math.abs(p.reHi), Math.abs(p.reLo), Math.abs(p.imHi), Math.abs(p.imLo))));
  const extent = reach > 0 ? reach * 1.12 : 1;
  const scale = { domain: [-extent, extent], nice: false, zero: false };
  const x = { field: 're', type: 'quantitative', scale, axis: { title: 'Re λ', format: shortFormat, tickCount: 5 } };
  const y = { field: 'im', type: 'quantitative', scale, axis: { title: 'Im λ', format: shortFormat, tickCount: 5 } };
  const layers: VegaLiteSpec[] = [];
  const whatDomain: string[] = [];
  const whatRange: string[] = [];
  if (norm) {
    // The disc as one symbol whose area is fixed in pixels: radius ‖T‖ in data units is (‖T‖ / extent) · size / 2 px.
    const radius = (norm.value / extent) * (plotSize / 2);
    const label = 'disc |z| ≤ ‖T‖ (holds the spectrum)';
    whatDomain.push(label);
    whatRange.push(neutral);
    layers.push({
      name: markNames.normBound,
      data: { values: [{ re: 0, im: 0, what: label }] },
      mark: { type: 'point', shape: 'circle', size: Math.PI * radius * radius, filled: false, strokeWidth: 1.5, strokeDash: [5, 3], fill: neutral, fillOpacity: 0.08, opacity: 1 },
      encoding: { x, y, color: { field: 'what', type: 'nominal', legend: { title: null, symbolType: 'circle' } } },
    });
  }
  whatDomain.push(points[0].what);
  whatRange.push(positiveColour);
  const colour = { field: 'what', type: 'nominal', scale: { domain: whatDomain, range: whatRange }, legend: { title: null } };
  layers.push({
    data: { values: points },
    mark: { type: 'rule', strokeWidth: 1.5, color: positiveColour, aria: false },
    encoding: { x: { ...x, field: 'reLo' }, x2: { field: 'reHi' }, y },
  });
  layers.push({
    data: { values: points },
    mark: { type: 'rule', strokeWidth: 1.5, color: positiveColour, aria: false },
    encoding: { x, y: { ...y, field: 'imLo' }, y2: { field: 'imHi' } },
  });
  layers.push({
    name: markNames.eigenvalues,
    data: { values: points },
    mark: { type: 'point', filled: true, size: 55, opacity: 1, shape: 'circle' },
    encoding: { x, y, color: colour, description: { field: 'label' } },
  });
  // Put the colour scale on the disc layer too, so that one legend lists both marks.
  if (norm) (layers[0] as { encoding: { color: VegaLiteSpec } }).encoding.color = { ...colour, legend: { title: null } };
  return {
    kind: 'eigenvalues',
    title: 'Eigenvalues in the complex plane',
    caption: `${s.eigenvalues.length === 1 ? 'The eigenvalue' : `The ${s.eigenvalues.length} eigenvalues`} of largest modulus. The kernel is not Hermitian, so they may be complex;`
      + ' all of them lie in the shaded disc of radius ‖T‖ (dashed circle).',
    spec: layeredSpec(layers),
    tables: [eigenvalueTable(s.eigenvalues, norm)],
  };
}
