/**
 * Every fixture file analyses to exactly the diagnostics annotated in it (see tests/helpers/annotations.ts): same
 * code, same line, same columns, a message that contains the annotated fragment, and nothing else. Then the parts
 * of those diagnostics that annotations cannot show: fixes (applied, they remove their diagnostic and nothing
 * else), related places (duplicates and cycles), and the “unnecessary” tag of unused-name hints.
 *
 * All fixtures are analysed without numerics (syntax and binding only), except faults.kw: evaluation faults are
 * found by sampling, which runs with the numerical analysis. There only codes below KW400 are compared; numerical
 * findings (KW4xx) and property checks (KW5xx, KW6xx) have fixtures of their own.
 */
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { analyzeText } from '../../src-core/analysis/analyze';
import { catalogue } from '../../src-core/diagnostics/catalogue';
import type { Diagnostic, TextEdit } from '../../src-core/diagnostics/types';
import { LineIndex } from '../../src-core/syntax/textRange';
import { readAnnotations, type ExpectedDiagnostic } from '../helpers/annotations';

const fixtureDir = join(__dirname, 'fixtures');
const fixtureFiles = readdirSync(fixtureDir).filter((f) => f.endsWith('.kw')).sort();
const read = (file: string) => readFileSync(join(fixtureDir, file), 'utf8');

/** Fixtures analysed with numerics on; the rest bind only. */
const withNumerics = new Set(['faults.kw']);

function analyse(file: string, text = read(file)): Diagnostic[] {
  if (!withNumerics.has(file)) return [...analyzeText(text, { numerics: false }).diagnostics];
  const all = analyzeText(text, { numerics: true, timeBudgetMs: 2000 }).diagnostics;
  return all.filter((d) => Number(d.code.slice(2)) < 400);
}

interface Placed extends ExpectedDiagnostic {
  readonly message: string;
}

function place(text: string, d: Diagnostic): Placed {
  const index = new LineIndex(text);
  const start = index.position(d.range.start);
  const end = index.position(d.range.end);
  if (end.line !== start.line) throw new Error(`${d.code} spans lines ${start.line + 1}-${end.line + 1}`);
  return { line: start.line, startCol: start.character, endCol: end.character, code: d.code, messageFragment: '', message: d.message };
}

const byPosition = (a: ExpectedDiagnostic, b: ExpectedDiagnostic) =>
  a.line - b.line || a.startCol - b.startCol || a.endCol - b.endCol || a.code.localeCompare(b.code);
const where = (d: ExpectedDiagnostic) => `${d.line + 1}:${d.startCol}-${d.endCol} ${d.code}`;

/** The text with the edits applied (edits do not overlap). */
function applyEdits(text: string, edits: readonly TextEdit[]): string {
  let out = text;
  for (const e of [...edits].sort((a, b) => b.range.start - a.range.start)) {
    out = out.slice(0, e.range.start) + e.newText + out.slice(e.range.end);
  }
  return out;
}

const slice = (text: string, r: { start: number; end: number }) => text.slice(r.start, r.end);
const lineOf = (text: string, offset: number) => new LineIndex(text).position(offset).line;

describe('semantic fixtures', () => {
  it('exist, one per family and a clean one', () => {
    for (const f of ['names', 'arity', 'duplicates', 'cycles', 'domains', 'constants', 'unused', 'expectations', 'params', 'faults', 'clean']) {
      expect(fixtureFiles).toContain(`${f}.kw`);
    }
  });

  for (const file of fixtureFiles) {
    it(`${file} has exactly its annotated diagnostics`, () => {
      const text = read(file);
      const expected = readAnnotations(text).sort(byPosition);
      const actual = analyse(file, text).map((d) => place(text, d)).sort(byPosition);
      expect(actual.map(where)).toEqual(expected.map(where));
      expected.forEach((e, k) => expect(actual[k].message, where(e)).toContain(e.messageFragment));
      if (file === 'clean.kw') expect(expected).toEqual([]);
      else expect(expected.length).toBeGreaterThan(0);
    });
  }

  it('cover every KW2xx code, the evaluation faults and the size limit of binding', () => {
    const annotated = new Set(fixtureFiles.flatMap((f) => readAnnotations(read(f)).map((a) => a.code)));
    const codes = Object.values(catalogue).map((e) => e.code).filter((c) => /^KW[23]\d\d$/.test(c));
    expect(codes.length).toBeGreaterThanOrEqual(25);
    for (const code of [...codes, 'KW107']) expect(annotated, code).toContain(code);
  });
});

describe('fixes', () => {
  // Each fix, applied alone, removes its own diagnostic and changes no other (columns on its line may shift).
  for (const file of ['names.kw', 'domains.kw', 'expectations.kw']) {
    it(`of ${file} remove their diagnostic and nothing else`, () => {
      const text = read(file);
      const before = analyse(file, text);
      const fixed = before.filter((d) => d.fixes && d.fixes.length > 0);
      expect(fixed.length).toBeGreaterThanOrEqual(2);
      const key = (t: string, d: Diagnostic) => `${lineOf(t, d.range.start) + 1} ${d.code} ${d.message}`;
      for (const d of fixed) {
        const fix = d.fixes!.find((f) => f.preferred);
        expect(fix, key(text, d)).toBeDefined();
        const after = applyEdits(text, fix!.edits);
        const expected = before.filter((x) => x !== d).map((x) => key(text, x)).sort();
        expect(analyse(file, after).map((x) => key(after, x)).sort(), key(text, d)).toEqual(expected);
      }
    });
  }

  it('are did-you-mean for names and claims, swap-domain for reversed domains', () => {
    const kinds = new Map<string, Set<string>>();
    for (const file of ['names.kw', 'domains.kw', 'expectations.kw']) {
      for (const d of analyse(file)) {
        for (const f of d.fixes ?? []) kinds.set(d.code, new Set([...(kinds.get(d.code) ?? []), f.kind]));
      }
    }
    expect(Object.fromEntries([...kinds].map(([c, k]) => [c, [...k]]))).toEqual({
      KW201: ['did-you-mean'], KW202: ['did-you-mean'], KW208: ['swap-domain'], KW213: ['did-you-mean'],
    });
  });

  it('swap the text of the two ends, whatever they are', () => {
    const text = read('domains.kw');
    const d = analyse('domains.kw', text).find((x) => x.code === 'KW208' && slice(text, x.range).includes('pi'))!;
    const after = applyEdits(text, d.fixes![0].edits);
    expect(after.split('\n')[lineOf(text, d.range.start)]).toBe('kernel backwards(t, s) on [-len, 2 * pi] = sin(t) * sin(s)');
  });
});

describe('related places', () => {
  /** The offset of the name in the first declaration (`const|fn|kernel name`) of `name` in the text. */
  const firstDeclaration = (text: string, name: string): number => {
    const m = new RegExp(`^(?:const|fn|kernel) (${name.replace(/\$/g, '\\$')})\\b`, 'm').exec(text)!;
    return m.index + m[0].length - name.length;
  };

  for (const file of ['duplicates.kw', 'adversarial.kw']) {
    it(`of a duplicate name in ${file} point at its first declaration`, () => {
      const text = read(file);
      const duplicates = analyse(file, text).filter((d) => d.code === 'KW204');
      expect(duplicates.length).toBeGreaterThan(0);
      for (const d of duplicates) {
        const name = slice(text, d.range);
        expect(d.related, name).toHaveLength(1);
        const r = d.related![0];
        expect(slice(text, r.range)).toBe(name);
        expect(r.range.start).toBe(firstDeclaration(text, name));
        expect(r.range.start).toBeLessThan(d.range.start);
        expect(r.message).toMatch(/^first declared here as a (constant|helper function|kernel)$/);
      }
    });
  }

  it('of a cycle are its other members, in the order of the chain, at their declarations', () => {
    const text = read('cycles.kw');
    const cycles = analyse('cycles.kw', text).filter((d) => d.code === 'KW205');
    expect(cycles.length).toBe(5);
    for (const d of cycles) {
      const chain = /depends on itself: (.*)\.$/.exec(d.message)![1].split(' → ');
      expect(chain[0]).toBe(slice(text, d.range));
      expect(chain[chain.length - 1]).toBe(chain[0]);
      const others = chain.slice(1, -1);
      expect(d.related!.map((r) => slice(text, r.range))).toEqual(others);
      expect(d.related!.map((r) => r.range.start)).toEqual(others.map((n) => firstDeclaration(text, n)));
      for (const [k, r] of d.related!.entries()) expect(r.message).toBe(`“${others[k]}” is part of the cycle`);
    }
  });

  it('of a shadowing parameter point at the declaration it hides', () => {
    const text = read('params.kw');
    const shadows = analyse('params.kw', text).filter((d) => d.code === 'KW216');
    const declared = shadows.filter((d) => !/built-in/.test(d.message));
    expect(declared.length).toBe(4);
    for (const d of declared) {
      const name = slice(text, d.range);
      expect(d.related!.map((r) => r.range.start)).toEqual([firstDeclaration(text, name)]);
    }
    for (const d of shadows.filter((x) => /built-in/.test(x.message))) expect(d.related).toBeUndefined();
  });

  it('of a second domain line point at the first', () => {
    const text = read('duplicates.kw');
    const seconds = analyse('duplicates.kw', text).filter((d) => d.code === 'KW218');
    expect(seconds).toHaveLength(2);
    for (const d of seconds) expect(d.related!.map((r) => slice(text, r.range))).toEqual(['[0, 2]']);
  });
});

describe('unused names', () => {
  it('are hints tagged unnecessary, and no other diagnostic is', () => {
    for (const file of fixtureFiles) {
      for (const d of analyse(file)) {
        const unused = d.code === 'KW211' || d.code === 'KW212';
        expect(d.tags ?? [], `${file} ${d.message}`).toEqual(unused ? ['unnecessary'] : []);
        if (unused) expect(d.severity).toBe('hint');
      }
    }
  });
});
