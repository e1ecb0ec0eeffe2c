/** Applying text edits, as an editor or `kernwright fix` would. */
import type { Fix } from '@kernwright/core';

export function applyFix(text: string, fix: Fix): string {
  const edits = [...fix.edits].sort((a, b) => b.range.start - a.range.start);
  let out = text;
  for (const e of edits) out = out.slice(0, e.range.start) + e.newText + out.slice(e.range.end);
  return out;
}
