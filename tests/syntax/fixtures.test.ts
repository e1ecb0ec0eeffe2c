/**
 * Every fixture file parses to exactly the diagnostics annotated in it (see tests/helpers/annotations.ts):
 * same code, same line, same columns, and a message that contains the annotated fragment.
 */
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { parse } from '../../src-core/syntax/parser';
import { LineIndex } from '../../src-core/syntax/textRange';
import { catalogue } from '../../src-core/diagnostics/catalogue';
import { readAnnotations, type ExpectedDiagnostic } from '../helpers/annotations';

const fixtureDir = join(__dirname, 'fixtures');
const fixtureFiles = readdirSync(fixtureDir).filter((f) => f.endsWith('.kw')).sort();

function actualDiagnostics(text: string): (ExpectedDiagnostic & { message: string })[] {
  const index = new LineIndex(text);
  return parse(text).diagnostics.map((d) => {
    const start = index.position(d.range.start);
    const end = index.position(d.range.end);
    if (end.line !== start.line) throw new Error(`diagnostic ${d.code} spans lines ${start.line}-${end.line}`);
    return {
      line: start.line,
      startCol: start.character,
      endCol: end.character,
      code: d.code,
      messageFragment: '',
      message: d.message,
    };
  });
}

const place = (d: ExpectedDiagnostic) => `${d.line + 1}:${d.startCol}-${d.endCol} ${d.code}`;

describe('fixture files', () => {
  it('exist, one per KW1xx family and a clean one', () => {
    expect(fixtureFiles).toContain('clean.kw');
    expect(fixtureFiles.length).toBeGreaterThanOrEqual(12);
  });

  for (const file of fixtureFiles) {
    it(file, () => {
      const text = readFileSync(join(fixtureDir, file), 'utf8');
      const expected = readAnnotations(text);
      const actual = actualDiagnostics(text);
      expect(actual.map(place)).toEqual(expected.map(place));
      expected.forEach((e, i) => expect(actual[i].message).toContain(e.messageFragment));
      if (file === 'clean.kw') expect(expected).toEqual([]);
      else expect(expected.length).toBeGreaterThan(0);
    });
  }

  it('cover every KW1xx code of the catalogue', () => {
    const annotated = new Set<string>();
    for (const file of fixtureFiles) {
      for (const a of readAnnotations(readFileSync(join(fixtureDir, file), 'utf8'))) annotated.add(a.code);
    }
    const syntaxCodes = Object.values(catalogue)
      .map((e) => e.code)
      .filter((code) => code.startsWith('KW1'));
    expect(syntaxCodes.length).toBeGreaterThanOrEqual(11);
    for (const code of syntaxCodes) expect(annotated, code).toContain(code);
  });

  it('hold CR LF line ends where the line-end fixture says so', () => {
    const text = readFileSync(join(fixtureDir, 'line-ends.kw'), 'utf8');
    expect(text.split('\r\n').length).toBeGreaterThan(5);
  });
});
