/**
 * Applying the fixes the editor offers, as the command line does it: which fix of each diagnostic to take, which
 * fixes fit together in one pass (their edits must not overlap), and the edit itself, applied from the end of the
 * text so that earlier offsets stay valid. Inserted text takes the file's line endings (CRLF stays CRLF).
 */
import type { Diagnostic, Fix, TextEdit } from '../diagnostics/types';

/** A fix chosen for a diagnostic, with the diagnostic's code (for the summary). */
export interface ChosenFix {
  readonly code: string;
  readonly fix: Fix;
}

/**
 * The fix to apply for each diagnostic: without `only`, its preferred fix (if it has one); with `only`, its fix of
 * that kind (the preferred one when there are several, else the first).
 */
export function chooseFixes(diagnostics: readonly Diagnostic[], only?: string): ChosenFix[] {
  const chosen: ChosenFix[] = [];
  for (const d of diagnostics) {
    const fixes = d.fixes ?? [];
    let fix: Fix | undefined;
    if (only === undefined) {
      fix = fixes.find((f) => f.preferred === true);
    } else {
      const ofKind = fixes.filter((f) => f.kind === only);
      fix = ofKind.find((f) => f.preferred === true) ?? ofKind[0];
    }
    if (fix && fix.edits.length > 0) chosen.push({ code: d.code, fix });
  }
  return chosen;
}

function overlaps(a: TextEdit, b: TextEdit): boolean {
  // Two insertions at the same offset would depend on their order: treat them as overlapping too.
  if (a.range.start === a.range.end && b.range.start === b.range.end) return a.range.start === b.range.start;
  return a.range.start < b.range.end && b.range.start < a.range.end;
}

function editsOverlapEachOther(edits: readonly TextEdit[]): boolean {
  for (let i = 0; i < edits.length; i++) for (let j = i + 1; j < edits.length; j++) if (overlaps(edits[i], edits[j])) return true;
  return false;
}

/**
 * The fixes that can be applied together in one pass: taken in order, a fix is kept when none of its edits overlaps
 * an edit already kept (the others wait for the next pass, after re-analysis). Identical fixes (the same edits
 * offered for two diagnostics) are applied once.
 */
export function compatibleFixes(chosen: readonly ChosenFix[], textLength: number): { accepted: ChosenFix[]; deferred: number } {
  const kept: TextEdit[] = [];
  const accepted: ChosenFix[] = [];
  const seen = new Set<string>();
  let deferred = 0;
  for (const c of chosen) {
    const key = JSON.stringify(c.fix.edits);
    if (seen.has(key)) continue;
    const valid = c.fix.edits.every((e) => e.range.start >= 0 && e.range.end <= textLength && e.range.start <= e.range.end);
    if (!valid || editsOverlapEachOther(c.fix.edits)) continue;
    if (c.fix.edits.some((e) => kept.some((k) => overlaps(e, k)))) {
      deferred++;
      continue;
    }
    seen.add(key);
    kept.push(...c.fix.edits);
    accepted.push(c);
  }
  return { accepted, deferred };
}

/** The line ending the text mostly uses: '\r\n' when CRLF line ends outnumber bare LF ones, else '\n'. */
export function dominantLineEnding(text: string): '\r\n' | '\n' {
  let crlf = 0;
  let lf = 0;
  for (let i = 0; i < text.length; i++) {
    if (text.charCodeAt(i) !== 10) continue;
    if (i > 0 && text.charCodeAt(i - 1) === 13) crlf++;
    else lf++;
  }
  return crlf > lf ? '\r\n' : '\n';
}

/** Replaces every line break of `text` by `eol`. */
export function withLineEnding(text: string, eol: string): string {
  return text.replace(/\r\n|\r|\n/g, eol);
}

/** Applies non-overlapping edits, from the end of the text backwards; inserted text takes the line ending `eol`. */
export function applyEdits(text: string, edits: readonly TextEdit[], eol: string = dominantLineEnding(text)): string {
  const sorted = [...edits].sort((a, b) => b.range.start - a.range.start || b.range.end - a.range.end);
  let out = text;
  for (const e of sorted) out = out.slice(0, e.range.start) + withLineEnding(e.newText, eol) + out.slice(e.range.end);
  return out;
}
