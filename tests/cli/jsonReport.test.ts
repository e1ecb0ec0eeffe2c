import { describe, expect, it } from 'vitest';
import { jsonKernel, jsonNumber, jsonReport, jsonReportVersion } from '../../src-core/report/index';
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
