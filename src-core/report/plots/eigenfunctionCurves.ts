/**
 * The leading eigenfunctions φ_1 … φ_m (default 4) as curves over the domain, L²-normalised as the engine returns
 * them. Each mode has its own colour and dash pattern; complex eigenfunctions are drawn as two curves per mode, the
 * real part solid and the imaginary part dotted (the mode then told by colour and by the legend). The legend names
 * each mode by its number; the table under it gives each mode's eigenvalue with its error.
 */
import type { KernelReport } from '../../analysis/types';
import { formatEigenvalue } from '../text';
import { seriesColours, seriesDashes } from './palette';
import type { AxisNames, PlotFigure } from './plotTypes';
import { markNames } from './plotTypes';
import { eigenForText, isFiniteNumber, layeredSpec, shortFormat } from './specCommon';

export const defaultEigenfunctionCount = 4;

export function eigenfunctionFigure(report: KernelReport, axes: AxisNames, count: number = defaultEigenfunctionCount): PlotFigure | null {
  const s = report.spectrum;
  const f = s?.eigenfunctions;
  if (!s || !f || f.re.length === 0 || f.grid.length === 0) return null;
  const m = Math.max(1, Math.min(count, f.re.length, seriesColours.length));
  const complex = f.im !== null && f.im.slice(0, m).some((row) => row.some((v) => isFiniteNumber(v) && v !== 0));
  const modes = Array.from({ length: m }, (_, k) => `φ${k + 1}, for λ${k + 1}`);
  const values = Array.from({ length: m }, (_, k) => {
    const ev = s.eigenvalues[k];
    return ev && isFiniteNumber(ev.re) ? formatEigenvalue(eigenForText(ev)) : 'not available';
  });
  const rows: { t: number; v: number; mode: string; part: string; series: string }[] = [];
  for (let k = 0; k < m; k++) {
    const parts: [string, readonly number[]][] = [['Re', f.re[k]]];
    if (complex && f.im) parts.push(['Im', f.im[k]]);
    for (const [part, values] of parts) {
      for (let j = 0; j < f.grid.length; j++) {
        const v = values[j];
        if (isFiniteNumber(v) && isFiniteNumber(f.grid[j])) rows.push({ t: f.grid[j], v, mode: modes[k], part, series: `${k}-${part}` });
      }
    }
  }
  const grid = f.grid.filter(isFiniteNumber);
  // Real modes: colour and dash pattern both tell the mode, in one merged legend. Complex modes: colour tells the
  // mode, the dash pattern the part.
  const modeLegend = { title: complex ? 'eigenfunction (colour)' : 'eigenfunction', symbolType: 'stroke', symbolStrokeWidth: 2.5 };
  const colour = { field: 'mode', type: 'nominal', scale: { domain: modes, range: seriesColours.slice(0, m) }, legend: modeLegend };
  const dash = complex
    ? { field: 'part', type: 'nominal', scale: { domain: ['Re', 'Im'], range: [[1, 0], [2, 2]] }, legend: { title: 'part', symbolType: 'stroke', labelExpr: "datum.label === 'Re' ? 'real part (solid)' : 'imaginary part (dotted)'" } }
    : { field: 'mode', type: 'nominal', scale: { domain: modes, range: seriesDashes.slice(0, m) }, legend: modeLegend };
  return {
    kind: 'eigenfunctions',
    title: m === 1 ? 'Leading eigenfunction φ₁' : `Leading eigenfunctions φ₁ … φ${['₀', '₁', '₂', '₃', '₄'][m]}`,
    caption: (m === 1
      ? `The eigenfunction of the eigenvalue of largest modulus, L²-normalised (its sign${complex ? ' and phase are' : ' is'} arbitrary).`
      : `The ${m} eigenfunctions of the eigenvalues of largest modulus, L²-normalised (their sign${complex ? ' and phase are' : ' is'} arbitrary).`)
      + (complex ? ' Solid: real part; dotted: imaginary part.' : m > 1 ? ' Each has its own colour and dash pattern.' : ''),
    spec: layeredSpec([{
      name: markNames.eigenfunctions,
      data: { values: rows },
      mark: { type: 'line', strokeWidth: 2, clip: true },
      encoding: {
        x: { field: 't', type: 'quantitative', scale: { domain: [Math.min(...grid), Math.max(...grid)], nice: false, zero: false }, axis: { title: axes.t, tickCount: 5 } },
        y: { field: 'v', type: 'quantitative', axis: { title: 'φ_k(t)', format: shortFormat } },
        color: colour,
        strokeDash: dash,
        detail: { field: 'series', type: 'nominal' },
      },
    }], { height: Math.round(0.75 * 240) }),
    tables: [{
      caption: 'The eigenvalues of the modes drawn',
      columns: ['mode', 'eigenvalue ± error'],
      rows: values.map((v, k) => [`φ${k + 1}, λ${k + 1}`, v]),
    }],
  };
}
