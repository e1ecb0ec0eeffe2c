/**
 * Keeping the numerical findings of unchanged kernels visible while a file is being edited. The syntax and name
 * diagnostics of a new text are known at once; the numerical ones (KW3xx and up) arrive later. Until they do, the
 * findings of every kernel whose definition did not change (same declaration text, same resolved hash) are moved
 * to the kernel's new place, so that only the kernels actually edited lose their findings for a moment.
 */
import type { Diagnostic } from '../diagnostics/types';
import type { FileModel, KernelSymbol } from '../semantics/model';
import type { TextRange } from '../syntax/textRange';

/** True for the codes that only the numerical analysis reports (evaluation faults, numerics, checks, claims). */
export function isNumericalCode(code: string): boolean {
  return /^KW[3-9]\d\d$/u.test(code);
}

export interface AnalysedText {
  readonly text: string;
  readonly model: FileModel;
}

function declText(text: string, k: KernelSymbol): string {
  return text.slice(k.decl.range.start, k.decl.range.end);
}

function shift(r: TextRange, by: number): TextRange {
  return { start: r.start + by, end: r.end + by };
}

/**
 * The numerical diagnostics of `before` (a complete analysis of an older text) that still hold in `after`, moved to
 * their new offsets. A finding is carried when it lies inside a kernel declaration that is unchanged.
 */
export function carryForward(before: AnalysedText, diagnostics: readonly Diagnostic[], after: AnalysedText): Diagnostic[] {
  const moved: { from: TextRange; by: number }[] = [];
  for (const old of before.model.kernels) {
    if (!old.hash || old.name === '') continue;
    const now = after.model.kernels.find((k) => k.name === old.name && k.hash === old.hash);
    if (now && declText(before.text, old) === declText(after.text, now)) {
      moved.push({ from: old.decl.range, by: now.decl.range.start - old.decl.range.start });
    }
  }
  const out: Diagnostic[] = [];
  for (const d of diagnostics) {
    if (!isNumericalCode(d.code)) continue;
    const m = moved.find((x) => x.from.start <= d.range.start && d.range.end <= x.from.end);
    if (!m) continue;
    // Related places and fix edits move with the kernel when they lie in it; others may have moved anyhow: dropped.
    const inside = (r: TextRange) => m.from.start <= r.start && r.end <= m.from.end;
    const related = d.related?.filter((r) => inside(r.range)).map((r) => ({ ...r, range: shift(r.range, m.by) }));
    const fixes = d.fixes?.filter((f) => f.edits.every((e) => inside(e.range)))
      .map((f) => ({ ...f, edits: f.edits.map((e) => ({ ...e, range: shift(e.range, m.by) })) }));
    out.push({
      ...d,
      range: shift(d.range, m.by),
      ...(related ? { related } : {}),
      ...(fixes ? { fixes } : {}),
    });
  }
  return out;
}
