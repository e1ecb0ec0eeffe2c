/**
 * A kernel's figures as short text for editors: the one-line summary above each kernel (code lens), the block of
 * figures in a hover, and the full listing of the "show figures" command. Every number is printed with its error
 * estimate, using the report layer's formatting (digits follow the error; the error is never rounded away).
 */
import type { KernelReport, NormEstimate } from '../analysis/types';
import { digitsFor, formatEigenvalue, formatEstimate, formatNumber } from '../report/text';

/** One property of a kernel as the checks judged it, with the figure behind the verdict. */
export interface PropertyMark {
  /** `Hermitian`, `positive`, `continuous`, `Hilbert–Schmidt`, `bounded`. */
  readonly name: string;
  /** True when the property holds, false when it fails, null when undecided. */
  readonly holds: boolean | null;
  /** The figure behind the verdict, formatted with its error where it has one (e.g. `λ_min = -0.2 ± 1e-9`). */
  readonly figure?: string;
}

function estimate(x: { value: number; error: number } | null | undefined): string | null {
  return x && Number.isFinite(x.value) ? formatEstimate(x.value, x.error) : null;
}

function withFigure(name: string, holds: boolean | null, figure: string | null | undefined): PropertyMark {
  return figure ? { name, holds, figure } : { name, holds };
}

/**
 * The verdicts of the property checks a report carries, in a fixed order. Every field is read defensively (a report
 * from a kernel that was not analysed has none, and older cores had none at all).
 */
export function propertyMarks(report: KernelReport): PropertyMark[] {
  const out: PropertyMark[] = [];
  const h = report.hermitian;
  if (h) {
    const figure = h.method === 'symbolic' ? 'by construction' : `‖K − K*‖/‖K‖ = ${formatEstimate(h.defect, h.defectError)}`;
    out.push(withFigure('Hermitian', h.holds, figure));
  }
  const p = report.positive;
  if (p) {
    const min = estimate(p.minEigenvalue);
    const cert = p.certificate ? `${p.certificate.kind === 'diagonal' ? 'K(t, t) < 0' : '|K(t, s)|² > K(t, t) K(s, s)'} at t = ${formatNumber(p.certificate.t, 6)}, s = ${formatNumber(p.certificate.s, 6)}` : null;
    out.push(withFigure('positive', p.holds, min ? `λ_min = ${min}` : cert));
  }
  const c = report.continuity;
  if (c) {
    const jump = estimate(c.jump);
    const figure = c.class === 'continuous' ? null
      : c.class === 'jump' ? `jumps${c.where ? ` across ${c.where}` : ''}${jump ? ` by ${jump}` : ''}`
        : `singular${c.where ? ` at ${c.where}` : ''}`;
    out.push(withFigure('continuous', c.class === 'continuous', figure));
  }
  const b = report.boundedness;
  if (b) {
    const growth = b.exponent !== null && b.exponent !== undefined ? `|K| ~ d^(−${formatNumber(b.exponent, 3)})${b.where ? ` toward ${b.where}` : ''}` : null;
    if (b.undecided?.property === 'bounded') out.push(withFigure('bounded', null, b.undecided.reason));
    else if (b.undecided) out.push(withFigure('Hilbert–Schmidt', null, b.undecided.reason));
    else if (b.class === 'hilbert-schmidt') out.push(withFigure('Hilbert–Schmidt', true, growth));
    else if (b.class === 'bounded') out.push(withFigure('bounded', true, growth ? `not Hilbert–Schmidt: ${growth}` : 'not Hilbert–Schmidt'));
    else out.push(withFigure('bounded', false, growth));
  }
  return out;
}

function mark(holds: boolean | null): string {
  return holds === true ? '✓' : holds === false ? '✗' : '?';
}

export function formatPropertyMark(p: PropertyMark, figure: boolean): string {
  return `${p.name} ${mark(p.holds)}${figure && p.figure ? ` (${p.figure})` : ''}`;
}

/** `0.0432 ± 2.1e-12 in [0.04321, 0.04324]` */
export function formatNorm(norm: NormEstimate): string {
  const digits = digitsFor(norm.value, Math.max(norm.error, Math.abs(norm.upper - norm.lower) / 2));
  const bracket = `[${formatNumber(norm.lower, digits)}, ${formatNumber(norm.upper, digits)}]`;
  return `${formatEstimate(norm.value, norm.error)} in ${bracket}`;
}

const subscripts = '₀₁₂₃₄₅₆₇₈₉';

/** λ₁, λ₂, …, λ₁₂ */
export function lambda(index: number): string {
  return `λ${String(index).replace(/\d/g, (d) => subscripts[Number(d)])}`;
}

/** How many modes carry 90 %, 99 % and 99.9 % of the trace, in words; null when the report has no such figure. */
export function effectiveRankText(report: KernelReport): string | null {
  const r = report.effectiveRank;
  if (!r) return null;
  const part = (n: number | null, share: string) => `${n === null ? `> ${r.resolvedModes}` : n} (${share})`;
  return `${part(r.p90, '90 %')}, ${part(r.p99, '99 %')}, ${part(r.p999, '99.9 %')} of the trace`;
}

/** The one-line summary shown above a kernel. */
export function kernelLensTitle(report: KernelReport): string {
  const s = report.spectrum;
  const parts: string[] = [];
  if (s?.norm) parts.push(`‖T‖ = ${formatEstimate(s.norm.value, s.norm.error)}`);
  if (s && s.eigenvalues.length > 0) parts.push(`${lambda(1)} = ${formatEigenvalue(s.eigenvalues[0])}`);
  const marks = propertyMarks(report).map((p) => formatPropertyMark(p, false));
  if (marks.length > 0) parts.push(marks.join(' '));
  if (s && !s.converged) parts.push('(target accuracy not reached)');
  if (parts.length === 0) return 'no spectrum';
  return parts.join(' · ');
}

/** Text with the characters markdown would take for formatting escaped. */
export function escapeMarkdown(text: string): string {
  return text.replace(/[\\`*_{}[\]|<>#]/gu, (c) => `\\${c}`);
}

/**
 * Markdown blocks of a kernel's figures (for the hover): the property marks with their figures, a table of the
 * figures with their errors (norm with its bracket, leading eigenvalues, trace, Hilbert–Schmidt norm, effective rank),
 * and the method.
 */
export function kernelFiguresMarkdown(report: KernelReport, eigenvalueCount = 4, intro?: string): string[] {
  const s = report.spectrum;
  const blocks: string[] = [];
  const marks = propertyMarks(report);
  const marksText = marks.length > 0 ? escapeMarkdown(marks.map((p) => formatPropertyMark(p, true)).join(' · ')) : null;
  // The intro and the marks share one paragraph (a hard line break between them) to keep the hover short.
  const head = [intro, marksText].filter((x): x is string => Boolean(x)).join('  \n');
  if (head) blocks.push(head);
  if (!s) return blocks;
  const rows: [string, string][] = [];
  if (s.norm) rows.push(['‖T‖', formatNorm(s.norm)]);
  s.eigenvalues.slice(0, eigenvalueCount).forEach((ev, k) => rows.push([lambda(k + 1), formatEigenvalue(ev)]));
  if (s.eigenvalues.length > eigenvalueCount) rows.push(['…', `${s.eigenvalues.length - eigenvalueCount} more (show figures)`]);
  if (s.trace) rows.push(['trace', formatEstimate(s.trace.value, s.trace.error)]);
  if (s.hsNorm) rows.push(['‖K‖ HS', formatEstimate(s.hsNorm.value, s.hsNorm.error)]);
  const rank = effectiveRankText(report);
  if (rank) rows.push(['effective rank', rank]);
  blocks.push(['| | estimate ± error |', '|:--|:--|', ...rows.map(([k, v]) => `| ${k} | ${escapeMarkdown(v)} |`)].join('\n'));
  blocks.push(`_${escapeMarkdown(s.method)}${s.converged ? '' : '; target accuracy not reached'}_`);
  return blocks;
}

/** The complete plain-text listing of a kernel's figures (the "show figures" command). */
export function kernelFiguresText(report: KernelReport): string {
  const out: string[] = [];
  const domain = report.domain ? ` on [${report.domain[0]}, ${report.domain[1]}]` : '';
  out.push(`kernel ${report.name}${domain} (${report.complex ? 'complex' : 'real'})`);
  const s = report.spectrum;
  if (!s) {
    out.push('  no spectrum: the kernel was not analysed numerically (see its diagnostics)');
    return out.join('\n');
  }
  for (const p of propertyMarks(report)) out.push(`  ${formatPropertyMark(p, true)}`);
  out.push(`  operator norm      ${s.norm ? formatNorm(s.norm) : 'not available'}`);
  out.push(`  Hilbert–Schmidt    ${s.hsNorm ? formatEstimate(s.hsNorm.value, s.hsNorm.error) : 'infinite or not available'}`);
  out.push(`  trace              ${s.trace ? formatEstimate(s.trace.value, s.trace.error) : 'not available'}`);
  const rank = effectiveRankText(report);
  if (rank) out.push(`  effective rank     ${rank}`);
  for (const r of report.resolvent ?? []) {
    const mu = r.mu.im === 0 ? formatNumber(r.mu.re, 6) : `${formatNumber(r.mu.re, 6)} ${r.mu.im < 0 ? '-' : '+'} ${formatNumber(Math.abs(r.mu.im), 6)}i`;
    const verdict = r.inResolventSet === true ? 'in the resolvent set' : r.inResolventSet === false ? 'in the spectrum' : 'undecided';
    const dist = estimate(r.distance);
    const norm = estimate(r.resolventNorm);
    out.push(`  resolvent μ = ${mu}: ${verdict}${dist ? `, dist(μ, σ) = ${dist}` : ''}${norm ? `, ‖(μ − T)⁻¹‖ = ${norm}` : ''}`);
  }
  out.push(`  eigenvalues (by decreasing modulus):`);
  s.eigenvalues.forEach((ev, k) => out.push(`    ${lambda(k + 1).padEnd(4)} ${formatEigenvalue(ev)}`));
  out.push(`  method             ${s.method}`);
  out.push(`  converged          ${s.converged ? 'yes' : 'no (target accuracy not reached within the time budget)'}`);
  out.push(`  time               ${s.elapsedMs.toFixed(1)} ms`);
  return out.join('\n');
}
