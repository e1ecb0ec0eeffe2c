import { describe, expect, it } from 'vitest';
import { analysedFile, jsonKernel, jsonNumber, jsonReport, jsonReportVersion } from '../../src-core/report/index';
import { analyzeText } from '../../src-core/analysis/analyze';
import { LineIndex } from '../../src-core/syntax/textRange';
import { sampleFile, sampleText } from './reportData';

const tool = { name: 'kernwright', version: '9.9.9' };

/** Every number in a JSON value, with its path; the check that non-finite numbers never leak out. */
function numbersIn(value: unknown, at = '$'): [string, number][] {
  if (typeof value === 'number') return [[at, value]];
  if (Array.isArray(value)) return value.flatMap((v, k) => numbersIn(v, `${at}[${k}]`));
  if (value && typeof value === 'object') return Object.entries(value).flatMap(([k, v]) => numbersIn(v, `${at}.${k}`));
  return [];
}

describe('jsonReport', () => {
  const report = jsonReport([sampleFile], tool);
  const roundTrip = JSON.parse(JSON.stringify(report));

  it('carries the format version, the tool and a summary', () => {
    expect(roundTrip.version).toBe(jsonReportVersion);
    expect(roundTrip.tool).toEqual(tool);
    expect(roundTrip.summary).toEqual({ files: 1, errors: 1, warnings: 1, infos: 0, hints: 1 });
  });

  it('survives JSON.stringify unchanged: only finite numbers, never strings for numbers', () => {
    expect(roundTrip).toEqual(report);
    for (const [, n] of numbersIn(report)) expect(Number.isFinite(n)).toBe(true);
  });

  it('gives diagnostic ranges as 0-based line/character, related information in the same form', () => {
    const d = roundTrip.files[0].diagnostics[1];
    const column = 'kernel lake(t, s) = exp(-abs(t - s) / '.length;
    expect(d).toMatchObject({ code: 'KW201', severity: 'error', message: 'Unknown name “elll”. Did you mean “ell”?' });
    expect(d.range).toEqual({ start: { line: 3, character: column }, end: { line: 3, character: column + 4 } });
    expect(d.related).toEqual([
      { message: '“ell” is declared here', range: { start: { line: 2, character: 6 }, end: { line: 2, character: 9 } } },
    ]);
  });

  it('passes figures through, with non-finite numbers as null', () => {
    const d = roundTrip.files[0].diagnostics[1];
    expect(d.figures).toEqual({ distance: 1, worst: null, label: 'x', exact: true, nothing: null });
    expect(roundTrip.files[0].diagnostics[0].related).toEqual([]);
    expect('figures' in roundTrip.files[0].diagnostics[0]).toBe(false);
  });

  it('describes each kernel with its figures and their errors', () => {
    const [lake, wave, dry] = roundTrip.files[0].kernels;
    expect(lake).toEqual({
      name: 'lake',
      domain: [0, 2],
      range: { start: { line: 3, character: 0 }, end: { line: 3, character: sampleText.split('\n')[3].length } },
      complex: false,
      eigenvalues: [],
      norm: null,
      hsNorm: null,
      trace: null,
      method: null,
      hermitian: null,
      boundedness: null,
      continuity: null,
      positive: null,
      effectiveRank: null,
      resolvent: [],
    });
    expect(wave.complex).toBe(true);
    expect(wave.eigenvalues).toEqual([
      { re: 0.7312456789, im: 0, error: 3.2e-9 },
      { re: 0.25, im: -0.125, error: 1e-6 },
    ]);
    expect(wave.norm).toEqual({ value: 0.7312456789, error: 3.2e-9, lower: 0.73124567, upper: 0.73124568 });
    expect(wave.hsNorm).toEqual({ value: 0.81, error: 1e-8 });
    expect(wave.trace).toEqual({ value: null, error: null });
    expect(wave.method).toBe('Gauss–Legendre Nyström, n = 96');
    expect(dry).toMatchObject({ eigenvalues: [], norm: null, hsNorm: null, trace: null });
  });

  it('gives a null domain when an end is not finite', () => {
    const k = jsonKernel({ ...sampleFile.kernels[0], domain: [0, Infinity] }, new LineIndex(sampleText));
    expect(k.domain).toBeNull();
  });

  it('maps only finite numbers through jsonNumber', () => {
    expect([1.5, -0, NaN, Infinity, -Infinity].map(jsonNumber)).toEqual([1.5, -0, null, null, null]);
  });

  it('reports an empty run as zero files', () => {
    expect(jsonReport([], tool).summary).toEqual({ files: 0, errors: 0, warnings: 0, infos: 0, hints: 0 });
  });
});

describe('the property checks in the JSON report', () => {
  // Invented scenario: two textbook kernels on [0, 1]; the values mean nothing beyond this test.
  const text = [
    'domain [0, 1]',
    'kernel brownian(t, s) = min(t, s)',
    '  expect resolvent 0.5, resolvent 1 + i',
    'kernel lopsided(t, s) = t * s^2',
    'kernel wire(t, s) = 1 / abs(t - s)',
    '',
  ].join('\n');
  const report = JSON.parse(JSON.stringify(jsonReport([analysedFile('a.kw', analyzeText(text, { timeBudgetMs: 5000 }))], tool)));
  const [brownian, lopsided, wire] = report.files[0].kernels;

  it('gives hermitian, boundedness, continuity, positive and effectiveRank for each analysed kernel', () => {
    expect(brownian.hermitian).toEqual({ holds: true, defect: 0, defectError: 0, method: 'symbolic', worst: null });
    expect(brownian.boundedness).toEqual({ class: 'hilbert-schmidt', exponent: null, where: null });
    expect(brownian.continuity).toEqual({ class: 'continuous', where: null, jump: null, jumps: [], kinks: ['the diagonal t = s'] });
    expect(brownian.positive.holds).toBe(true);
    expect(brownian.positive.minEigenvalue.value + brownian.positive.minEigenvalue.error).toBeGreaterThanOrEqual(0);
    // Brownian motion on [0, 1]: λ_k = 1/((k − 1/2)² π²) and trace 1/2 (common practice), so λ₁ + λ₂ = 0.4503 is
    // the first partial sum above 90 % of the trace.
    expect(brownian.effectiveRank.p90).toBe(2);
  });

  it('gives the worst point of a kernel that is not symmetric, with both values', () => {
    const w = lopsided.hermitian.worst;
    expect(lopsided.hermitian.holds).toBe(false);
    expect(w.value.re).toBeCloseTo(w.t * w.s ** 2, 14);
    expect(w.mirrored.re).toBeCloseTo(w.s * w.t ** 2, 14);
    expect(lopsided.positive).toMatchObject({ holds: false, minEigenvalue: null });
    expect(lopsided.effectiveRank).toBeNull();
  });

  it('gives an unbounded kernel a class, an exponent and a place, and no eigenvalues or norm', () => {
    expect(wire.boundedness).toEqual({ class: 'unbounded', exponent: 1, where: 'the diagonal t = s' });
    expect(wire.continuity.class).toBe('singular');
    expect(wire.eigenvalues).toEqual([]);
    expect(wire.norm).toBeNull();
    expect(wire.positive.holds).toBeNull();
  });

  it('lists each declared resolvent point with μ as {re, im}', () => {
    expect(brownian.resolvent).toHaveLength(2);
    const [half, complex] = brownian.resolvent;
    expect(half.mu).toEqual({ re: 0.5, im: 0 });
    expect(half.inResolventSet).toBe(true);
    // The nearest eigenvalue is λ₁ = 4/π².
    expect(half.distance.value).toBeCloseTo(0.5 - 4 / Math.PI ** 2, 12);
    expect(half.resolventNorm.value).toBeCloseTo(1 / (0.5 - 4 / Math.PI ** 2), 9);
    expect(half.neumannConverges).toBe(true);
    expect(complex.mu).toEqual({ re: 1, im: 1 });
    expect(complex.distance.value).toBeCloseTo(Math.hypot(1 - 4 / Math.PI ** 2, 1), 12);
    for (const [, n] of numbersIn(report)) expect(Number.isFinite(n)).toBe(true);
  });
});
