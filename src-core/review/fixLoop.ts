/**
 * Fixing a whole file: apply the chosen fixes (review/applyFixes.ts), analyse the result again, and repeat until
 * no fix is left, so that fixing a fixed file changes nothing. The number of passes is bounded, and a text seen
 * before ends the loop (fixes that undo each other).
 *
 * A file is never touched when it does not parse cleanly and no fix repairs that: a syntax error without a fix
 * refuses the whole file, and so does a result that would still have syntax errors.
 */
import type { Diagnostic } from '../diagnostics/types';
import { LineIndex } from '../syntax/textRange';
import { applyEdits, chooseFixes, compatibleFixes, dominantLineEnding } from './applyFixes';

export const defaultFixRounds = 8;

export interface AppliedFix {
  readonly code: string;
  readonly kind: string;
  readonly title: string;
  /** The pass in which it was applied (1-based). */
  readonly round: number;
}

export type FixOutcome =
  | {
      readonly ok: true;
      readonly text: string;
      readonly applied: readonly AppliedFix[];
      readonly rounds: number;
      /** 'done': nothing left to apply; 'round-limit' or 'cycle': the loop was cut short. */
      readonly stopped: 'done' | 'round-limit' | 'cycle';
    }
  | { readonly ok: false; readonly reason: string };

export interface FixLoopOptions {
  /** Restrict to fixes of this kind. */
  readonly only?: string;
  readonly maxRounds?: number;
}

const isSyntaxError = (d: Diagnostic): boolean => d.severity === 'error' && /^KW1\d\d$/.test(d.code);

function where(text: string, d: Diagnostic): string {
  const p = new LineIndex(text).position(d.range.start);
  return `line ${p.line + 1}, column ${p.character + 1}: ${d.message.replace(/\s*[\r\n]+\s*/g, ' ')}`;
}

export function fixText(text: string, analyze: (text: string) => readonly Diagnostic[], options: FixLoopOptions = {}): FixOutcome {
  const maxRounds = options.maxRounds ?? defaultFixRounds;
  const eol = dominantLineEnding(text);
  let diagnostics = analyze(text);
  const chosen = new Set(chooseFixes(diagnostics, options.only).map((c) => c.fix));
  const unfixable = diagnostics.find((d) => isSyntaxError(d) && !(d.fixes ?? []).some((f) => chosen.has(f)));
  if (unfixable) return { ok: false, reason: `it does not parse cleanly and no fix repairs it (${where(text, unfixable)})` };

  let current = text;
  const seen = new Set([current]);
  const applied: AppliedFix[] = [];
  let rounds = 0;
  let stopped: 'done' | 'round-limit' | 'cycle' = 'done';
  for (;;) {
    const { accepted } = compatibleFixes(chooseFixes(diagnostics, options.only), current.length);
    if (accepted.length === 0) break;
    if (rounds === maxRounds) {
      stopped = 'round-limit';
      break;
    }
    const next = applyEdits(current, accepted.flatMap((c) => c.fix.edits), eol);
    if (next === current) break;
    if (seen.has(next)) {
      stopped = 'cycle';
      break;
    }
    rounds++;
    for (const c of accepted) applied.push({ code: c.code, kind: c.fix.kind, title: c.fix.title, round: rounds });
    seen.add(next);
    current = next;
    diagnostics = analyze(current);
  }
  const broken = diagnostics.find(isSyntaxError);
  if (broken) return { ok: false, reason: `the fixes would leave it with a syntax error (${where(current, broken)})` };
  return { ok: true, text: current, applied, rounds, stopped };
}
