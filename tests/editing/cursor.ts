/** Fixtures with the cursor written as `$0` inside the text. */
import { analyzeText, type FileAnalysis } from '@kernwright/core';

export function withCursor(marked: string): { text: string; offset: number } {
  const offset = marked.indexOf('$0');
  if (offset < 0) throw new Error('fixture has no $0 cursor');
  return { text: marked.slice(0, offset) + marked.slice(offset + 2), offset };
}

export function quick(text: string): FileAnalysis {
  return analyzeText(text, { numerics: false });
}
