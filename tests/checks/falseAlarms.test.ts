/**
 * The false-alarm measurement: a file of correct kernels of many kinds (covariances, Green's functions, weakly
 * singular kernels, complex Hermitian ones, non-Hermitian ones) whose declared claims are all true. Every kernel
 * must be analysed, and no check may report an error or a warning. The number of kernels is in the test's title.
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { analyzeText, LineIndex } from '@kernwright/core';

const text = readFileSync(join(__dirname, 'falseAlarms.kw'), 'utf8');
const count = text.split('\n').filter((l) => l.startsWith('kernel ')).length;

describe('false alarms', () => {
  it(`${count} correct kernels with true claims: no error and no warning from any check`, () => {
    const analysis = analyzeText(text, { timeBudgetMs: 5000 });
    const index = new LineIndex(text);
    const alarms = analysis.diagnostics
      .filter((d) => d.severity === 'error' || d.severity === 'warning')
      .map((d) => `${index.position(d.range.start).line + 1}: ${d.code} ${d.message}`);
    expect(alarms).toEqual([]);
    expect(count).toBeGreaterThanOrEqual(30);
    expect(analysis.kernels).toHaveLength(count);
    for (const k of analysis.kernels) {
      expect(k.hermitian, k.name).not.toBeNull();
      expect(k.spectrum, k.name).not.toBeNull();
    }
    const claims = analysis.model.kernels.reduce((n, k) => n + k.expectations.length, 0);
    expect(claims).toBeGreaterThanOrEqual(3 * count);
  }, 600_000);
});
