/**
 * Lines of a text as the Language Server Protocol counts them (line ends \n, \r\n and \r; characters in UTF-16 code
 * units), and the check that a { line, character } range lies inside the text. Our own copy, so that the long run
 * checks the CLI's JSON report and the server's diagnostics against the text it wrote, not against the product's
 * own line index.
 */
export interface Position {
  readonly line: number;
  readonly character: number;
}

export interface LspRange {
  readonly start: Position;
  readonly end: Position;
}

/** Length of every line, without its line end. */
export function lineLengths(text: string): number[] {
  const out: number[] = [];
  let start = 0;
  for (let i = 0; i < text.length; i++) {
    const c = text.charCodeAt(i);
    if (c === 13 || c === 10) {
      out.push(i - start);
      if (c === 13 && text.charCodeAt(i + 1) === 10) i++;
      start = i + 1;
    }
  }
  out.push(text.length - start);
  return out;
}

function validPosition(p: Position, lengths: readonly number[]): boolean {
  return Number.isInteger(p?.line) && Number.isInteger(p?.character) && p.line >= 0 && p.line < lengths.length
    && p.character >= 0 && p.character <= lengths[p.line];
}

/** Why the range is not inside the text, or null when it is. */
export function rangeProblem(range: LspRange | undefined, lengths: readonly number[]): string | null {
  if (!range) return 'no range';
  if (!validPosition(range.start, lengths)) return `start ${JSON.stringify(range.start)} outside the text`;
  if (!validPosition(range.end, lengths)) return `end ${JSON.stringify(range.end)} outside the text`;
  const s = range.start;
  const e = range.end;
  if (s.line > e.line || (s.line === e.line && s.character > e.character)) return `start after end ${JSON.stringify(range)}`;
  return null;
}
