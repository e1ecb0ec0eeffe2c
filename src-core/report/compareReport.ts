/**
 * A comparison as text for the terminal, as markdown to paste into a review, and as JSON. Pure functions of data.
 *
 * Every figure is shown with its error estimate; figures whose change lies within the combined errors are listed
 * together as unchanged. In markdown each file gets one table, property flips first.
 */
import type { ComplexFigure } from '../analysis/types';
import type { FigureChange, Figure } from '../review/figureChange';
import type { PointwiseChange } from '../review/pointwise';
import { figureName, formatRelativeChange, propertyWords } from '../review/thresholds';
import type { Comparison, CompareVerdict, FileComparison, KernelComparison, KernelStatus } from '../review/types';
import type { JsonTool } from './json';
import { formatEigenvalue, formatEstimate, formatNumber } from './text';

export const compareReportVersion = 1;

// ---------- pieces shared by text and markdown ----------

export function formatFigure(f: Figure | null): string {
  if (!f) return 'none';
  return f.im === 0 ? formatEstimate(f.re, f.error) : formatEigenvalue(f);
}

/** A value of K at a grid point, to full precision (its error is rounding, shown beside it). */
function formatComplex(z: ComplexFigure | null): string {
  if (!z) return '?';
  if (z.im === 0) return formatNumber(z.re, 15);
  return `${formatNumber(z.re, 15)} ${z.im < 0 ? '-' : '+'} ${formatNumber(Math.abs(z.im), 15)}i`;
}

function formatDomain(d: readonly [number, number] | null): string {
  return d ? `[${formatNumber(d[0], 15)}, ${formatNumber(d[1], 15)}]` : 'none';
}

const propertyNames = propertyWords;

export function describePointwise(p: PointwiseChange): string {
  // Each evaluation carries half of the rounding error of the difference.
  const each = formatNumber(p.max.error / 2, 2);
  const where = p.at
    ? ` at t = ${formatNumber(p.at.t, 6)}, s = ${formatNumber(p.at.s, 6)} (K was ${formatComplex(p.old)}, is ${formatComplex(p.new)}, each ± ${each})`
    : '';
  const share = p.scale > 0 && Number.isFinite(p.max.value) ? `, ${formatNumber((100 * p.max.value) / p.scale, 3)} % of max |K|` : '';
  const skipped = p.skipped > 0 ? `; ${p.skipped} grid point${p.skipped === 1 ? '' : 's'} where K is not finite skipped` : '';
  return `${formatEstimate(p.max.value, p.max.error)}${share}${where}, on a ${p.gridPoints} × ${p.gridPoints} grid of ${formatDomain(p.domain)}${skipped}`;
}

function rankLevel(level: 'p90' | 'p99' | 'p999'): string {
  return level === 'p90' ? '90' : level === 'p99' ? '99' : '99.9';
}

function kernelTitle(k: KernelComparison): string {
  return k.oldName ? `“${k.oldName}” → “${k.name}”` : `“${k.name}”`;
}

function statusWords(k: KernelComparison): string {
  switch (k.status) {
    case 'renamed':
      return 'renamed (same definition)';
    case 'unchanged':
      return k.rewritten ? 'unchanged (rewritten; every figure agrees within its error estimate)' : 'unchanged';
    case 'not-comparable':
      return 'not comparable';
    default:
      return k.status;
  }
}

function unchangedFigures(k: KernelComparison): string[] {
  return k.figures.filter((f) => !f.significant).map((f) => figureName(f.figure));
}

function count(n: number, one: string, many: string): string {
  return `${n} ${n === 1 ? one : many}`;
}

const statusOrder: readonly KernelStatus[] = ['changed', 'renamed', 'added', 'removed', 'unchanged', 'not-comparable'];

export function formatComparisonSummary(c: Comparison): string {
  const k = c.summary.kernels;
  const total = statusOrder.reduce((n, s) => n + k[s], 0);
  const parts = statusOrder.filter((s) => k[s] > 0).map((s) => `${k[s]} ${s}`);
  const flips = c.summary.flips > 0 ? `; ${count(c.summary.flips, 'property flipped', 'properties flipped')}` : '';
  return `compared ${count(c.summary.files, 'file', 'files')}, ${count(total, 'kernel', 'kernels')}: ${parts.length > 0 ? parts.join(', ') : 'none'}${flips}`;
}

// ---------- text ----------

function kernelTextLines(k: KernelComparison): string[] {
  const lines = [`  ${kernelTitle(k)}: ${statusWords(k)}${k.newLine ?? k.oldLine ? ` (line ${k.newLine ?? k.oldLine})` : ''}`];
  const add = (s: string) => lines.push(`    ${s}`);
  for (const f of k.flips) add(`${propertyNames[f.property]} flipped: ${f.old} → ${f.new}`);
  if (k.domainChanged) add(`domain changed: ${formatDomain(k.oldDomain)} → ${formatDomain(k.newDomain)}`);
  for (const n of k.notes) add(n);
  for (const f of k.figures.filter((x) => x.significant)) {
    add(`${figureName(f.figure)}: ${formatFigure(f.old)} → ${formatFigure(f.new)} (${formatRelativeChange(f)})`);
  }
  for (const r of k.rank) add(`modes for ${rankLevel(r.level)} % of the trace: ${r.old ?? 'more than resolved'} → ${r.new ?? 'more than resolved'}`);
  if (k.pointwise) add(`${k.pointwise.significant ? 'largest change of K' : 'K unchanged within rounding; largest difference'}: ${describePointwise(k.pointwise)}`);
  if (k.status === 'changed') {
    const same = unchangedFigures(k);
    if (same.length > 0) add(`unchanged within the error estimates: ${same.join(', ')}`);
  }
  return lines;
}

/** The file name of a path or of a `revision:path` label. */
function fileName(p: string): string {
  return p.replace(/^.*[\\/:]/, '');
}

/** True when the file was renamed (not merely read from another folder or revision). */
function renamedFile(f: FileComparison): boolean {
  return !!f.oldPath && !!f.newPath && fileName(f.oldPath) !== fileName(f.newPath);
}

export function formatFileComparisonText(f: FileComparison): string[] {
  if (f.status === 'unchanged') return [`${f.path}: unchanged (${count(f.kernels.length, 'kernel', 'kernels')})`];
  const label = renamedFile(f) ? ` (was ${f.oldPath})` : '';
  const lines = [`${f.path}${label}: ${f.status === 'modified' ? 'modified' : `file ${f.status}`}`];
  if (f.oldErrors) lines.push(`  the old version has errors: ${f.oldErrors}`);
  if (f.newErrors) lines.push(`  the new version has errors: ${f.newErrors}`);
  for (const k of f.kernels) lines.push(...kernelTextLines(k));
  return lines;
}

export function formatComparisonText(c: Comparison, verdict: CompareVerdict): string {
  const lines = c.files.flatMap(formatFileComparisonText);
  lines.push(formatComparisonSummary(c));
  if (verdict.failed) lines.push('limits exceeded:', ...verdict.reasons.map((r) => `  ${r}`));
  return lines.join('\n') + '\n';
}

// ---------- markdown ----------

function cell(s: string): string {
  return s.replace(/\|/g, '\\|').replace(/\r?\n/g, ' ');
}

function row(...cells: string[]): string {
  return `| ${cells.map(cell).join(' | ')} |`;
}

function code(name: string): string {
  return `\`${name.replace(/`/g, '')}\``;
}

function kernelCell(k: KernelComparison): string {
  return k.oldName ? `${code(k.oldName)} → ${code(k.name)}` : code(k.name);
}

function figureRow(k: KernelComparison, f: FigureChange): string {
  return row(kernelCell(k), figureName(f.figure), formatFigure(f.old), formatFigure(f.new), formatRelativeChange(f));
}

/** One table per file: flips of every kernel first, then each kernel's other changes, then the quiet kernels. */
export function formatFileComparisonMarkdown(f: FileComparison): string[] {
  const title = renamedFile(f) ? `${code(f.oldPath!)} → ${code(f.path)}` : code(f.path);
  const lines = [`#### ${title} (${f.status})`, ''];
  if (f.oldErrors) lines.push(`The old version has errors: ${f.oldErrors}`, '');
  if (f.newErrors) lines.push(`**The new version has errors:** ${f.newErrors}`, '');
  if (f.kernels.length === 0) return [...lines, 'No kernels.', ''];
  lines.push(row('Kernel', 'What', 'Old', 'New', 'Change'), '|---|---|---|---|---|');
  for (const k of f.kernels) {
    for (const flip of k.flips) lines.push(row(kernelCell(k), `**${propertyNames[flip.property]} flipped**`, flip.old, `**${flip.new}**`, 'flipped'));
  }
  for (const k of f.kernels) {
    if (k.status !== 'changed' && k.status !== 'not-comparable') continue;
    if (k.domainChanged) lines.push(row(kernelCell(k), 'domain', formatDomain(k.oldDomain), formatDomain(k.newDomain), 'changed'));
    for (const n of k.notes) lines.push(row(kernelCell(k), 'note', '', '', n));
    for (const fig of k.figures.filter((x) => x.significant)) lines.push(figureRow(k, fig));
    for (const r of k.rank) lines.push(row(kernelCell(k), `modes for ${rankLevel(r.level)} % of the trace`, String(r.old ?? '> resolved'), String(r.new ?? '> resolved'), ''));
    if (k.pointwise) lines.push(row(kernelCell(k), k.pointwise.significant ? 'largest change of K' : 'K (unchanged within rounding)', '', '', describePointwise(k.pointwise)));
    const same = unchangedFigures(k);
    if (same.length > 0 && k.status === 'changed') lines.push(row(kernelCell(k), 'unchanged within the error estimates', '', '', same.join(', ')));
  }
  for (const k of f.kernels) {
    if (k.status === 'changed' || k.status === 'not-comparable') continue;
    lines.push(row(kernelCell(k), statusWords(k), '', '', ''));
  }
  lines.push('');
  return lines;
}

export function formatComparisonMarkdown(c: Comparison, verdict: CompareVerdict): string {
  const lines = ['### Kernel changes', '', `**${formatComparisonSummary(c).replace(/^compared /, 'Compared ')}**`, ''];
  if (verdict.failed) lines.push('**Limits exceeded:**', '', ...verdict.reasons.map((r) => `- ${cell(r)}`), '');
  const changed = c.files.filter((f) => f.status !== 'unchanged');
  for (const f of changed) lines.push(...formatFileComparisonMarkdown(f));
  const quiet = c.files.filter((f) => f.status === 'unchanged');
  if (quiet.length > 0) lines.push(`Unchanged: ${quiet.map((f) => code(f.path)).join(', ')}`, '');
  lines.push('Every figure is shown as value ± estimated error; changes within the combined error estimates count as unchanged.');
  return lines.join('\n') + '\n';
}

// ---------- JSON ----------

export interface CompareJsonReport {
  readonly version: number;
  readonly tool: JsonTool;
  readonly files: readonly FileComparison[];
  readonly summary: Comparison['summary'];
  readonly verdict: CompareVerdict;
}

/** The comparison as one JSON document (numbers that are not finite become null when stringified). */
export function compareJsonReport(c: Comparison, verdict: CompareVerdict, tool: JsonTool): CompareJsonReport {
  return { version: compareReportVersion, tool: { name: tool.name, version: tool.version }, files: c.files, summary: c.summary, verdict };
}
