/**
 * Expected diagnostics written inside fixture files, on comment lines right under the code they point at:
 *
 *     kernel k(t, s) = 2 * t +
 *     #                       | KW102 Expected an expression
 *     kernel k(t, s) = t $ s
 *     #                  ^ KW101 Unexpected character “$”
 *
 * An annotation line starts with `#` at column 0, then markers in the columns they point at, then at least one
 * space, the diagnostic code and, optionally, a fragment that the message must contain:
 *
 *  - `^` marks one column of the range: `^^^` under columns 5 to 7 is the range from column 5 to column 8.
 *  - `|` (a single one) marks an empty range at its column, that is, just before the character above it.
 *  - Column 0 is where the `#` stands, so when the carets touch the `#` the `#` itself counts as the first caret:
 *    `#^^^^^ KW109` marks columns 0 to 5 (the word `expect`), and `# KW106` (no caret at all) marks column 0 alone.
 *    An empty range at column 0 cannot be written (the parser never produces one: empty ranges follow a token).
 *
 * Several annotation lines in a row all point at the nearest code line above them. Annotation lines are ordinary
 * comments to the parser, so a fixture parses exactly as written. A range must lie on one line.
 */

export interface ExpectedDiagnostic {
  /** 0-based line of the code the annotation points at. */
  readonly line: number;
  /** 0-based UTF-16 columns, end exclusive; equal for an empty range. */
  readonly startCol: number;
  readonly endCol: number;
  readonly code: string;
  /** Text the message must contain (may be empty). */
  readonly messageFragment: string;
}

const annotationLine = /^#( *)(\^*|\|)( +)(KW\d{3})(?: +(.*?))?\s*$/;

/** True when `line` is an annotation (a comment that names a diagnostic code under markers). */
export function isAnnotation(line: string): boolean {
  return annotationLine.test(line);
}

/** Reads every annotation of a fixture text, in order. Throws on an annotation it cannot place. */
export function readAnnotations(text: string): ExpectedDiagnostic[] {
  const lines = text.split(/\r\n|\r|\n/);
  const expected: ExpectedDiagnostic[] = [];
  let codeLine = -1;
  lines.forEach((line, index) => {
    const m = annotationLine.exec(line);
    if (!m) {
      codeLine = index;
      return;
    }
    if (codeLine < 0) throw new Error(`line ${index + 1}: annotation with no code line above it`);
    const [, spaces, markers, , code, fragment] = m;
    let startCol: number;
    let endCol: number;
    if (markers === '') {
      if (spaces !== '') throw new Error(`line ${index + 1}: annotation without markers`);
      startCol = 0;
      endCol = 1;
    } else if (markers === '|') {
      startCol = endCol = 1 + spaces.length;
    } else if (spaces === '') {
      startCol = 0;
      endCol = 1 + markers.length;
    } else {
      startCol = 1 + spaces.length;
      endCol = startCol + markers.length;
    }
    expected.push({ line: codeLine, startCol, endCol, code, messageFragment: fragment ?? '' });
  });
  return expected;
}
