/**
 * The eigenvalues of a Hermitian kernel (real, in [−‖T‖, ‖T‖]): |λ_k| against k on a logarithmic axis, the sign told
 * by shape and colour (a blue disc for λ > 0, an amber triangle for λ < 0), an error bar ±error around each (visible
 * only where it is larger than the mark), and a rule at ‖T‖, which no |λ| exceeds. An eigenvalue 0 (to the last
 * digit) cannot be drawn on the logarithmic axis: it is listed in the table only.
 */
import type { EigenEstimate, KernelReport } from '../../analysis/types';
import { formatEigenvalue, formatEstimate } from '../text';
import { negativeColour, neutral, positiveColour } from './palette';
import type { FigureTable, PlotFigure, VegaLiteSpec } from './plotTypes';
import { markNames } from './plotTypes';
import { eigenForText, errorForText, isFiniteNumber, layeredSpec, logTicks, shortFormat } from './specCommon';

export const signLabels = { positive: 'λ > 0', negative: 'λ < 0' } as const;

interface IndexRow {
  readonly k: number;
  readonly abs: number;
  readonly lo: number;
  readonly hi: number;
  readonly sign: string;
  readonly label: string;
}

/** The table of eigenvalues (index and λ ± error), with ‖T‖ last when known. */
export function eigenvalueTable(eigenvalues: readonly EigenEstimate[], norm: { value: number; error: number } | null): FigureTable {
  const rows = eigenvalues.map((ev, i) => [String(i + 1), isFiniteNumber(ev.re) ? formatEigenvalue(eigenForText(ev)) : 'not available']);
  if (norm && isFiniteNumber(norm.value)) rows.push(['‖T‖', formatEstimate(norm.value, errorForText(norm.error))]);
  return { caption: `All ${eigenvalues.length} eigenvalues with their errors`, columns: ['k', 'λ_k ± error'], rows };
}

/** One row per drawable eigenvalue (finite and non-zero), with its error bar clipped to the axis. */
export function indexRows(eigenvalues: readonly EigenEstimate[]): IndexRow[] {
  const drawable = eigenvalues
    .map((ev, i) => ({ ev, k: i + 1 }))
    .filter(({ ev }) => isFiniteNumber(ev.re) && ev.re !== 0);
  if (drawable.length === 0) return [];
  const floor = Math.min(...drawable.map(({ ev }) => Math.abs(ev.re))) / 4;
  return drawable.map(({ ev, k }) => {
    const abs = Math.abs(ev.re);
    const err = isFiniteNumber(ev.error) ? ev.error : 0;
    return {
      k,
      abs,
      lo: Math.max(floor, abs - err),
      hi: abs + err,
      sign: ev.re > 0 ? signLabels.positive : signLabels.negative,
      label: `λ${k} = ${ev.re} ± ${ev.error}`,
    };
  });
}

export function eigenvalueIndexFigure(report: KernelReport): PlotFigure | null {
  const s = report.spectrum;
  if (!s || s.eigenvalues.length === 0) return null;
  const rows = indexRows(s.eigenvalues);
  if (rows.length === 0) return null;
  const norm = s.norm && isFiniteNumber(s.norm.value) && s.norm.value > 0 ? s.norm : null;
  const signs = [...new Set(rows.map((r) => r.sign))];
  const signDomain = [signLabels.positive, signLabels.negative].filter((x) => signs.includes(x));
  const legend = { title: 'eigenvalue (bar: ± error)' };
  const colour = {
    field: 'sign',
    type: 'nominal',
    scale: { domain: signDomain, range: signDomain.map((d) => (d === signLabels.positive ? positiveColour : negativeColour)) },
    legend,
  };
  const x = { field: 'k', type: 'quantitative', scale: { domain: [0.5, s.eigenvalues.length + 0.5], nice: false, zero: false }, axis: { title: 'index k (by decreasing |λ|)', tickMinStep: 1, format: 'd', grid: false } };
  const lo = Math.min(...rows.map((r) => r.lo));
  const hi = Math.max(norm ? norm.value : 0, ...rows.map((r) => r.hi));
  const y = { field: 'abs', type: 'quantitative', scale: { type: 'log', domain: [lo / 1.5, hi * 1.5], nice: false }, axis: { title: '|λ_k|', format: shortFormat, values: logTicks(lo / 1.5, hi * 1.5) } };
  const layers: VegaLiteSpec[] = [];
  if (norm) {
    layers.push({
      name: markNames.normBound,
      data: { values: [{ abs: norm.value, what: '‖T‖: no |λ| lies above this line' }] },
      mark: { type: 'rule', stroke: neutral, strokeWidth: 1.5, strokeDash: [5, 3] },
      encoding: {
        y,
        strokeDash: { field: 'what', type: 'nominal', scale: { range: [[5, 3]] }, legend: { title: null, symbolStrokeColor: neutral, symbolType: 'stroke' } },
      },
    });
  }
  layers.push({
    data: { values: rows },
    mark: { type: 'rule', strokeWidth: 1.5, aria: false },
    encoding: {
      x,
      y: { field: 'lo', type: 'quantitative' },
      y2: { field: 'hi' },
      color: colour,
    },
  });
  layers.push({
    name: markNames.eigenvalues,
    data: { values: rows },
    mark: { type: 'point', filled: true, size: 60, opacity: 1 },
    encoding: {
      x,
      y,
      color: colour,
      shape: {
        field: 'sign',
        type: 'nominal',
        scale: { domain: signDomain, range: signDomain.map((d) => (d === signLabels.positive ? 'circle' : 'triangle-down')) },
        legend,
      },
      description: { field: 'label' },
    },
  });
  const zeros = s.eigenvalues.length - rows.length;
  return {
    kind: 'eigenvalues',
    title: 'Eigenvalues |λ_k| (Hermitian: all real)',
    caption: `${s.eigenvalues.length === 1 ? 'The eigenvalue' : `The ${s.eigenvalues.length} eigenvalues`} of largest modulus, on a logarithmic axis; the sign is shown by shape and colour.`
      + ' Every eigenvalue of a Hermitian kernel lies in the interval [−‖T‖, ‖T‖], below the dashed rule.'
      + (zeros > 0 ? ` ${zeros} eigenvalue${zeros === 1 ? ' is' : 's are'} zero or not finite and appear${zeros === 1 ? 's' : ''} only in the table.` : ''),
    spec: layeredSpec(layers),
    tables: [eigenvalueTable(s.eigenvalues, norm)],
  };
}
