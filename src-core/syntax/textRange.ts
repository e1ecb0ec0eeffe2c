/**
 * Offsets and ranges in a source text. Offsets count UTF-16 code units from the start of the text, as JavaScript
 * strings and the LSP do. A range is half-open: [start, end).
 */
export interface TextRange {
  readonly start: number;
  readonly end: number;
}

export interface Position {
  /** 0-based line. */
  readonly line: number;
  /** 0-based UTF-16 column. */
  readonly character: number;
}

export interface LineColumnRange {
  readonly start: Position;
  readonly end: Position;
}

export function range(start: number, end: number): TextRange {
  return { start, end: Math.max(start, end) };
}

export function cover(a: TextRange, b: TextRange): TextRange {
  return { start: Math.min(a.start, b.start), end: Math.max(a.end, b.end) };
}

export function contains(r: TextRange, offset: number): boolean {
  return offset >= r.start && offset <= r.end;
}

/** Maps offsets to 0-based line/character positions and back. Lines end at \n, \r\n or \r. */
export class LineIndex {
  private readonly starts: number[];

  constructor(private readonly text: string) {
    const starts = [0];
    for (let i = 0; i < text.length; i++) {
      const c = text.charCodeAt(i);
      if (c === 13 /* \r */) {
        if (text.charCodeAt(i + 1) === 10) i++;
        starts.push(i + 1);
      } else if (c === 10 /* \n */) {
        starts.push(i + 1);
      }
    }
    this.starts = starts;
  }

  get lineCount(): number {
    return this.starts.length;
  }

  lineStart(line: number): number {
    return this.starts[Math.max(0, Math.min(line, this.starts.length - 1))];
  }

  position(offset: number): Position {
    const o = Math.max(0, Math.min(offset, this.text.length));
    let lo = 0;
    let hi = this.starts.length - 1;
    while (lo < hi) {
      const mid = (lo + hi + 1) >> 1;
      if (this.starts[mid] <= o) lo = mid;
      else hi = mid - 1;
    }
    return { line: lo, character: o - this.starts[lo] };
  }

  offset(pos: Position): number {
    if (pos.line < 0) return 0;
    if (pos.line >= this.starts.length) return this.text.length;
    const start = this.starts[pos.line];
    const next = pos.line + 1 < this.starts.length ? this.starts[pos.line + 1] : this.text.length;
    return Math.min(start + Math.max(0, pos.character), next);
  }

  toLineColumn(r: TextRange): LineColumnRange {
    return { start: this.position(r.start), end: this.position(r.end) };
  }
}
