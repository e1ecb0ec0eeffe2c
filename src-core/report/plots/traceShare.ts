/**
 * How many modes a positive kernel needs (its effective rank): the share of the trace that the first n eigenvalues
 * leave uncaptured, r_n = 1 − (λ_1 + … + λ_n) / trace, on a logarithmic axis, so that the thresholds 90 %, 99 % and
 * 99.9 % captured (r = 0.1, 0.01, 0.001) are evenly spaced rules. Error bars: the error of r_n from the eigenvalue
 * errors and the trace error, (Σ e_k + (1 − r_n) · e_trace) / trace. A point whose r_n is not larger than its error
 * is not resolved and is left out of the picture (it stays in the table).
 */
import type { KernelReport } from '../../analysis/types';
import { formatEstimate, formatNumber } from '../text';
import { neutral, positiveColour } from './palette';
import type { FigureTable, PlotFigure, VegaLiteSpec } from './plotTypes';
import { markNames } from './plotTypes';
import { errorForText, isFiniteNumber, layeredSpec, logTicks } from './specCommon';

export interface ShareRow {
  readonly n: number;
  /** Share of the trace captured by the first n modes. */
  readonly captured: number;
  /** 1 − captured. */
  readonly remaining: number;
  readonly error: number;
}

/** r_n for n = 1 … (number of eigenvalues), with its error; empty without a finite positive trace. */
export function shareRows(report: KernelReport): ShareRow[] {
  const s = report.spectrum;
  const trace = s?.trace;
  if (!s || !trace || !isFiniteNumber(trace.value) || !(trace.value > 0)) return [];
  const te = isFiniteNumber(trace.error) ? trace.error : 0;
  const rows: ShareRow[] = [];
  let sum = 0;
  let errSum = 0;
  for (let k = 0; k < s.eigenvalues.length; k++) {
    const ev = s.eigenvalues[k];
    if (!isFiniteNumber(ev.re)) break;
    sum += ev.re;
    errSum += isFiniteNumber(ev.error) ? ev.error : 0;
    const captured = sum / trace.value;
    rows.push({ n: k + 1, captured, remaining: 1 - captured, error: (errSum + captured * te) / trace.value });
  }
  return rows;
}

const thresholds = [
  { remaining: 0.1, label: '90 % captured' },
  { remaining: 0.01, label: '99 % captured' },
  { remaining: 0.001, label: '99.9 % captured' },
] as const;

function shareTables(report: KernelReport, rows: readonly ShareRow[]): FigureTable[] {
  const tables: FigureTable[] = [];
  const er = report.effectiveRank;
  if (er) {
    const modes = (x: number | null) => (x === null ? `more than ${er.resolvedModes} (all resolved modes)` : String(x));
    tables.push({
      caption: 'Effective rank',
      columns: ['share of the trace', 'modes needed'],
      rows: [['90 %', modes(er.p90)], ['99 %', modes(er.p99)], ['99.9 %', modes(er.p999)]],
    });
  }
  tables.push({
    caption: `The share captured by modes 1…n, for n = 1 … ${rows.length}`,
    columns: ['n', 'share of the trace in modes 1…n'],
    rows: rows.map((r) => [String(r.n), `${formatEstimate(100 * r.captured, 100 * r.error)} %`]),
  });
  return tables;
}

/** The figure, for a positive kernel with a finite trace; null otherwise. */
export function traceShareFigure(report: KernelReport): PlotFigure | null {
  if (report.positive?.holds !== true) return null;
  const rows = shareRows(report);
  if (rows.length === 0) return null;
  const drawn = rows
    .filter((r) => r.remaining > r.error && r.remaining > 0)
    .map((r) => ({
      n: r.n,
      remaining: r.remaining,
      lo: Math.max(r.remaining - r.error, r.remaining / 4),
      hi: r.remaining + r.error,
      what: 'trace left after n modes (bars: ± error)',
      label: `n = ${r.n}: ${r.remaining} left ± ${r.error}`,
    }));
  const x = { field: 'n', type: 'quantitative', scale: { domain: [0.5, rows.length + 0.5], nice: false, zero: false }, axis: { title: 'modes n', tickMinStep: 1, format: 'd', grid: false } };
  const lowest = Math.min(1e-3, ...drawn.map((d) => d.lo)) / 2;
  const y = { field: 'remaining', type: 'quantitative', scale: { type: 'log', domain: [lowest, 1] }, axis: { title: '1 − (λ₁ + … + λ_n) / trace', format: '~%', values: logTicks(lowest, 1) } };
  const layers: VegaLiteSpec[] = [
    {
      data: { values: thresholds.map((t) => ({ ...t })) },
      mark: { type: 'rule', stroke: neutral, strokeDash: [4, 3], strokeWidth: 1 },
      encoding: { y },
    },
    {
      data: { values: thresholds.map((t) => ({ ...t })) },
      mark: { type: 'text', align: 'right', baseline: 'bottom', dx: 0, dy: -2, fontSize: 10, color: neutral, x: 'width' },
      encoding: { y, text: { field: 'label' } },
    },
  ];
  if (drawn.length > 0) {
    layers.push(
      { data: { values: drawn }, mark: { type: 'line', color: positiveColour, strokeWidth: 1.5, aria: false }, encoding: { x, y } },
      { data: { values: drawn }, mark: { type: 'rule', color: positiveColour, strokeWidth: 1.5, aria: false }, encoding: { x, y: { ...y, field: 'lo' }, y2: { field: 'hi' } } },
      {
        name: markNames.shares,
        data: { values: drawn },
        mark: { type: 'point', filled: true, size: 45, opacity: 1 },
        encoding: {
          x,
          y,
          color: { field: 'what', type: 'nominal', scale: { range: [positiveColour] }, legend: { title: null } },
          description: { field: 'label' },
        },
      },
    );
  }
  const er = report.effectiveRank;
  const rankNote = er && er.p90 !== null ? ` ${er.p90} mode${er.p90 === 1 ? '' : 's'} carry 90 % of the trace.` : '';
  return {
    kind: 'trace-share',
    title: 'Effective rank: trace left after n modes',
    caption: `For a positive kernel the eigenvalues add up to the trace ${formatEstimate(report.spectrum!.trace!.value, errorForText(report.spectrum!.trace!.error))};`
      + ` the curve shows the share not yet captured by the first n of them (logarithmic axis).${rankNote}`
      + (drawn.length < rows.length ? ` Values not larger than their error (${rows.length - drawn.length}) are left out of the picture.` : '')
      + ` Dashed rules: ${thresholds.map((t) => `${formatNumber(100 * (1 - t.remaining), 3)} %`).join(', ')} captured.`,
    spec: layeredSpec(layers),
    tables: shareTables(report, rows),
  };
}
