/**
 * Folding regions of a kernel file: declarations that span several lines (a kernel with its claims, a long
 * expression) and runs of two or more full-line comments. Offsets; a front end turns them into lines and drops
 * those that fit on one line.
 */
import type { SourceFile } from '../syntax/ast';
import { LineIndex } from '../syntax/textRange';

export interface FoldingRegion {
  readonly start: number;
  readonly end: number;
  readonly kind: 'region' | 'comment';
}

export function foldingRegions(source: SourceFile): FoldingRegion[] {
  const index = new LineIndex(source.text);
  const line = (o: number) => index.position(o).line;
  const out: FoldingRegion[] = [];
  for (const d of source.declarations) {
    if (line(d.range.end) > line(d.range.start)) out.push({ start: d.range.start, end: d.range.end, kind: 'region' });
  }
  const text = source.text;
  let run: { start: number; end: number; line: number; count: number } | null = null;
  const flush = () => {
    if (run && run.count >= 2) out.push({ start: run.start, end: run.end, kind: 'comment' });
    run = null;
  };
  for (const c of source.comments) {
    const l = line(c.range.start);
    const fullLine = text.slice(index.lineStart(l), c.range.start).trim() === '';
    if (!fullLine) {
      flush();
      continue;
    }
    if (run && run.line === l - 1) {
      run.end = c.range.end;
      run.line = l;
      run.count++;
    } else {
      flush();
      run = { start: c.range.start, end: c.range.end, line: l, count: 1 };
    }
  }
  flush();
  return out.sort((a, b) => a.start - b.start);
}
