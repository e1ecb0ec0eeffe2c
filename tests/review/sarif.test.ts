/**
 * The SARIF report (src-core/report/sarif.ts), validated against the SARIF 2.1.0 JSON schema (see sarifSchema.ts).
 */
import { describe, expect, it } from 'vitest';
import {
  analyzeText,
  catalogue,
  sarifLog,
  sarifUri,
  type AnalysedFile,
  type Diagnostic,
  type SarifLog,
} from '@kernwright/core';
import { expectValidSarif, validateSarif as validate } from './sarifSchema';

const tool = { name: 'kernwright', version: '0.1.0' };

function analysed(path: string, text: string): AnalysedFile {
  const a = analyzeText(text, { timeBudgetMs: 20_000 });
  return { path, text, diagnostics: a.diagnostics, kernels: a.kernels };
}

describe('sarifLog', () => {
  it('is valid against the SARIF 2.1.0 schema for real analyses (errors, related ranges, figures, fixes)', () => {
    const files = [
      analysed('a/typo.kw', '# Invented test.\ndomain [0, 1]\nconst width = 0.3\nkernel k(t, s) = exp(-abs(t - s) / widht)\n'),
      analysed('a/skew.kw', '# Invented test.\ndomain [0, 1]\nkernel drift(t, s) = exp(-abs(t - s)) * (1 + 0.2 * (t - s))\n'),
      analysed('b c/dup.kw', '# Invented test.\r\ndomain [0, 1]\r\nconst a = 1\r\nconst a = 2\r\nkernel k(t, s) = a * t * s\r\n'),
      analysed('clean.kw', '# Invented test.\ndomain [0, 1]\nkernel smooth(t, s) = exp(-(t - s)^2)\n  expect hermitian, positive, continuous\n'),
    ];
    const log = sarifLog(files, tool);
    expectValidSarif(log);
    const run = log.runs[0];
    expect(run.columnKind).toBe('utf16CodeUnits');
    expect(run.artifacts.map((a) => a.location.uri)).toEqual(['a/typo.kw', 'a/skew.kw', 'b%20c/dup.kw', 'clean.kw']);
    const all = files.flatMap((f) => f.diagnostics);
    expect(run.results).toHaveLength(all.length);
    // Some result has related locations, some has figures, some has a fix: all validated above.
    expect(run.results.some((r) => (r.relatedLocations ?? []).length > 0)).toBe(true);
    expect(run.results.some((r) => r.properties && Object.keys(r.properties).length > 0)).toBe(true);
    expect(run.results.some((r) => (r.fixes ?? []).length > 0)).toBe(true);
  });

  it('has one rule per code used, from the catalogue, with levels from the severities', () => {
    const files = [analysed('x.kw', '# Invented test.\ndomain [0, 1]\ndomain [0, 2]\nconst unused = 1\nkernel k(t, s) = t * s * nope\n')];
    const log: SarifLog = sarifLog(files, tool);
    const rules = log.runs[0].tool.driver.rules;
    const codes = [...new Set(files[0].diagnostics.map((d) => d.code))].sort();
    expect(rules.map((r) => r.id)).toEqual(codes);
    for (const rule of rules) {
      const [slug, entry] = Object.entries(catalogue).find(([, e]) => e.code === rule.id)!;
      expect(rule.name).toBe(slug);
      expect(rule.shortDescription.text).toBe(entry.title);
      expect(rule.fullDescription.text).toBe(entry.help);
      expect(rule.help.text).toBe(entry.help);
      expect(rule.defaultConfiguration.level).toBe({ error: 'error', warning: 'warning', info: 'note', hint: 'note' }[entry.severity]);
    }
    for (const r of log.runs[0].results) expect(rules[r.ruleIndex].id).toBe(r.ruleId);
    const levels = new Set(log.runs[0].results.map((r) => r.level));
    expect(levels).toEqual(new Set(['error', 'warning', 'note']));
  });

  it('counts columns in UTF-16 code units, 1-based, with the end column after the region', () => {
    const text = 'a😀b widht\nσ\n';
    const start = text.indexOf('widht');
    const d: Diagnostic = {
      code: 'KW201', severity: 'error', range: { start, end: start + 5 }, message: 'Unknown name “widht”.',
      related: [{ range: { start: 11, end: 12 }, message: 'σ here' }],
      figures: { value: NaN, t: 0.25, note: 'x', tags: 'reserved' },
    };
    const log = sarifLog([{ path: 'u.kw', text, diagnostics: [d], kernels: [] }], tool);
    expectValidSarif(log);
    const r = log.runs[0].results[0];
    // a = 1, 😀 = 2 and 3 (a surrogate pair), b = 4, space = 5, w = 6.
    expect(r.locations[0].physicalLocation.region).toEqual({ startLine: 1, startColumn: 6, endLine: 1, endColumn: 11 });
    expect(r.relatedLocations![0].physicalLocation.region).toEqual({ startLine: 2, startColumn: 1, endLine: 2, endColumn: 2 });
    expect(r.properties).toEqual({ value: null, t: 0.25, note: 'x', 'figure.tags': 'reserved' });
  });

  it('writes paths as relative URIs with forward slashes', () => {
    expect(sarifUri('examples\\broken\\a.kw')).toBe('examples/broken/a.kw');
    expect(sarifUri('./x/y z#1.kw')).toBe('x/y%20z%231.kw');
    expect(sarifUri('../up/π.kw')).toBe('../up/%CF%80.kw');
    expect(sarifUri('/abs/a.kw')).toBe('file:///abs/a.kw');
    expect(sarifUri('C:\\w\\a.kw')).toBe('file:///C:/w/a.kw');
  });

  it('still validates with no files and no results', () => {
    const log = sarifLog([], tool);
    expectValidSarif(log);
    expect(log.runs[0].results).toEqual([]);
  });

  it('rejects what the schema forbids (the validator is not a stub)', () => {
    const log = JSON.parse(JSON.stringify(sarifLog([analysed('x.kw', 'kernel k(t, s) = t\n')], tool)));
    log.runs[0].results[0].level = 'fatal';
    expect(validate(log)).toBe(false);
    const noVersion = JSON.parse(JSON.stringify(sarifLog([], tool)));
    delete noVersion.version;
    expect(validate(noVersion)).toBe(false);
  });
});
