/**
 * Every fixture file in tests/checks/fixtures/ gets exactly the evaluation-fault, property-check and
 * declared-expectation diagnostics (KW3xx, KW5xx, KW6xx) annotated in it (see tests/helpers/annotations.ts): same
 * code, same line, same columns, and a message that contains the annotated fragment. KW4xx notes on the engine's
 * accuracy depend on the time budget and are left out.
 */
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { analyzeText, catalogue, LineIndex } from '@kernwright/core';
import { readAnnotations, type ExpectedDiagnostic } from '../helpers/annotations';

const fixtureDir = join(__dirname, 'fixtures');
const fixtureFiles = readdirSync(fixtureDir).filter((f) => f.endsWith('.kw')).sort();
const checked = (code: string) => /^KW[356]\d\d$/.test(code);

function actualDiagnostics(text: string): (ExpectedDiagnostic & { message: string })[] {
  const index = new LineIndex(text);
  return analyzeText(text, { timeBudgetMs: 5000 }).diagnostics.filter((d) => checked(d.code)).map((d) => {
    const start = index.position(d.range.start);
    const end = index.position(d.range.end);
    if (end.line !== start.line) throw new Error(`diagnostic ${d.code} spans lines ${start.line}-${end.line}`);
    return { line: start.line, startCol: start.character, endCol: end.character, code: d.code, messageFragment: '', message: d.message };
  });
}

const place = (d: ExpectedDiagnostic) => `${d.line + 1}:${d.startCol}-${d.endCol} ${d.code}`;

describe('check fixtures', () => {
  for (const file of fixtureFiles) {
    it(file, () => {
      const text = readFileSync(join(fixtureDir, file), 'utf8');
      const expected = readAnnotations(text);
      const actual = actualDiagnostics(text);
      expect(actual.map(place)).toEqual(expected.map(place));
      expected.forEach((e, i) => expect(actual[i].message, place(e)).toContain(e.messageFragment));
      expect(expected.length).toBeGreaterThan(0);
    }, 300_000);
  }

  it('cover every KW5xx and KW6xx code of the catalogue but the Mercer note (see positivity.test.ts)', () => {
    const annotated = new Set<string>();
    for (const file of fixtureFiles) {
      for (const a of readAnnotations(readFileSync(join(fixtureDir, file), 'utf8'))) annotated.add(a.code);
    }
    const codes = Object.values(catalogue).map((e) => e.code).filter((c) => /^KW[56]/.test(c));
    expect(codes.length).toBeGreaterThanOrEqual(20);
    for (const code of codes) if (code !== catalogue['mercer-mismatch'].code) expect(annotated, code).toContain(code);
  });
});
