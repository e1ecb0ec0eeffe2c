/**
 * The exported discretisation (src-core/report/exportData.ts) and its file formats (src-core/review/exportFormats.ts,
 * src-core/report/npy.ts): the arrays are what they claim to be (checked by invariants and a published spectrum),
 * and every format reads back exactly.
 */
import { describe, expect, it } from 'vitest';
import {
  analyzeText,
  csvNumber,
  encodeNpy,
  exportCsvFiles,
  exportJsonDocument,
  exportKernelData,
  exportNpyFiles,
  npyHeader,
  type AnalysisOptions,
  type ExportArray,
  type KernelExport,
} from '@kernwright/core';
import { symmetricEigen } from '../../src-core/numerics/linalg';
import { readNpy } from './npyReader';

const options: Partial<AnalysisOptions> = { timeBudgetMs: 20_000 };
const header = '# Invented test scenario.\n';

function exported(text: string, name: string): KernelExport {
  const r = exportKernelData(analyzeText(text, options), name, options);
  if (!r.ok) throw new Error(r.message);
  return r.data;
}

function array(data: KernelExport, name: string): ExportArray {
  const a = data.arrays.find((x) => x.name === name);
  if (!a) throw new Error(`no array ${name}`);
  return a;
}

const unitRod = exported(`${header}kernel rod(t, s) on [0, 1] = min(t, s) - t * s\n`, 'rod');
const gauss = exported(`${header}kernel g(t, s) on [-1, 2] = exp(-(t - s)^2)\n`, 'g');

describe('exportKernelData', () => {
  it('exports the eigenvalues 1/(k²π²) of min(t, s) − ts with their errors', () => {
    // The Green's function of −u'' on [0, 1] with u(0) = u(1) = 0: eigenvalues 1/(k²π²), eigenfunctions √2 sin(kπx).
    const ev = array(unitRod, 'eigenvalues').re;
    const err = array(unitRod, 'eigenvalue_errors').re;
    expect(ev.length).toBe(8);
    ev.forEach((v, k) => expect(Math.abs(v - 1 / ((k + 1) ** 2 * Math.PI ** 2))).toBeLessThanOrEqual(err[k] + 1e-13));
  });

  it('exports the Galerkin matrix whose eigenpairs are the exported ones', () => {
    const A = array(unitRod, 'galerkin_matrix');
    const [n] = A.shape;
    expect(A.shape).toEqual([n, n]);
    expect(n).toBe(unitRod.discretisation.size);
    for (let i = 0; i < n; i++) for (let j = 0; j < i; j++) expect(A.re[i * n + j]).toBeCloseTo(A.re[j * n + i], 14);
    const values = Array.from(symmetricEigen(A.re, n).values).sort((x, y) => Math.abs(y) - Math.abs(x));
    const ev = array(unitRod, 'eigenvalues').re;
    const err = array(unitRod, 'eigenvalue_errors').re;
    ev.forEach((v, k) => expect(Math.abs(values[k] - v)).toBeLessThanOrEqual(err[k] + 1e-13));
    const V = array(unitRod, 'eigenvector_coefficients');
    expect(V.shape).toEqual([8, n]);
    for (let k = 0; k < 8; k++) {
      const v = V.re.subarray(k * n, k * n + n);
      for (let l = 0; l <= k; l++) {
        const w = V.re.subarray(l * n, l * n + n);
        expect(v.reduce((s, x, i) => s + x * w[i], 0)).toBeCloseTo(k === l ? 1 : 0, 10);
      }
      for (let i = 0; i < n; i++) {
        const Av = A.re.subarray(i * n, i * n + n).reduce((s, a, j) => s + a * v[j], 0);
        expect(Av).toBeCloseTo(values[k] * v[i], 10);
      }
    }
  });

  it('samples the eigenfunctions as the check reports them: √2 sin(kπx) with a positive largest value', () => {
    const grid = array(unitRod, 'eigenfunction_grid').re;
    const phi = array(unitRod, 'eigenfunctions');
    expect(grid[0]).toBe(0);
    expect(grid[grid.length - 1]).toBe(1);
    const m = grid.length;
    expect(phi.shape).toEqual([8, m]);
    const report = analyzeText(`${header}kernel rod(t, s) on [0, 1] = min(t, s) - t * s\n`, options).kernels[0].spectrum!.eigenfunctions!;
    for (let k = 0; k < 3; k++) {
      const row = phi.re.subarray(k * m, k * m + m);
      const sign = Math.sign(row.reduce((best, x) => (Math.abs(x) > Math.abs(best) ? x : best), 0));
      expect(sign).toBe(1);
      row.forEach((x, j) => {
        expect(x).toBeCloseTo(report.re[k][j], 12);
        expect(Math.abs(x)).toBeCloseTo(Math.abs(Math.SQRT2 * Math.sin((k + 1) * Math.PI * grid[j])), 6);
      });
    }
  });

  it('exports a Nyström rule that reproduces the trace and, for a smooth kernel, the eigenvalues', () => {
    const w = array(unitRod, 'nystrom_weights').re;
    const x = array(unitRod, 'nystrom_nodes').re;
    const K = array(unitRod, 'nystrom_kernel');
    expect(w.reduce((s, v) => s + v, 0)).toBeCloseTo(1, 14);
    for (let i = 1; i < x.length; i++) expect(x[i]).toBeGreaterThan(x[i - 1]);
    const q = x.length;
    expect(K.shape).toEqual([q, q]);
    // ∫ K(t, t) dt = ∫ t − t² = 1/6, integrated exactly by Gauss–Legendre.
    expect(w.reduce((s, wi, i) => s + wi * K.re[i * q + i], 0)).toBeCloseTo(1 / 6, 13);

    const gw = array(gauss, 'nystrom_weights').re;
    const gK = array(gauss, 'nystrom_kernel');
    const p = gw.length;
    const B = new Float64Array(p * p);
    for (let i = 0; i < p; i++) for (let j = 0; j < p; j++) B[i * p + j] = Math.sqrt(gw[i]) * gK.re[i * p + j] * Math.sqrt(gw[j]);
    const nystrom = Array.from(symmetricEigen(B, p).values).sort((a, b) => Math.abs(b) - Math.abs(a));
    const ev = array(gauss, 'eigenvalues').re;
    ev.slice(0, 5).forEach((v, k) => expect(Math.abs(nystrom[k] - v)).toBeLessThan(1e-10));
  });

  it('exports complex arrays for a complex kernel, and real eigenvalues when it is Hermitian', () => {
    const data = exported(`${header}kernel c(t, s) on [0, 3] = exp(i * 4 * (t - s)) * exp(-abs(t - s) / 0.6)\n`, 'c');
    expect(data.complex).toBe(true);
    expect(array(data, 'galerkin_matrix').im).not.toBeNull();
    expect(array(data, 'eigenvalues').im).toBeNull();
    const phi = array(data, 'eigenfunctions');
    expect(phi.im).not.toBeNull();
    expect(array(data, 'nystrom_kernel').im).not.toBeNull();
  });

  it('leaves out the Nyström arrays for a singular kernel, and says why', () => {
    const data = exported(`${header}kernel l(t, s) on [0, 1] = log(abs(t - s))\n`, 'l');
    expect(data.arrays.some((a) => a.name.startsWith('nystrom'))).toBe(false);
    expect(data.notes.join(' ')).toMatch(/not finite/);
  });

  it('refuses an unknown kernel, a kernel with errors and an unbounded one, with a reason', () => {
    const a = analyzeText(`${header}domain [0, 1]\nkernel ok(t, s) = t * s\nkernel bad(t, s) = t * nope\nkernel big(t, s) = 1 / abs(t - s)\n`, options);
    const no = exportKernelData(a, 'missing', options);
    expect(no).toEqual({ ok: false, message: "there is no kernel named 'missing' (kernels: ok, bad, big)" });
    const bad = exportKernelData(a, 'bad', options);
    expect(bad.ok).toBe(false);
    if (!bad.ok) expect(bad.message).toMatch(/^kernel 'bad' has errors: line 4: .*nope/);
    const big = exportKernelData(a, 'big', options);
    expect(big.ok).toBe(false);
    if (!big.ok) expect(big.message).toMatch(/^kernel 'big' has no discretisation to export: line 5: .*bounded/);
  });
});

describe('export file formats', () => {
  it('writes NPY version 1.0 headers aligned to 64 bytes that the reader parses', () => {
    expect(npyHeader('f8', [3])).toBe("{'descr': '<f8', 'fortran_order': False, 'shape': (3,), }");
    expect(npyHeader('c16', [2, 5])).toBe("{'descr': '<c16', 'fortran_order': False, 'shape': (2, 5), }");
    const cases = [
      { shape: [0], re: [], im: null },
      { shape: [3], re: [1.5, -0, Number.MAX_VALUE], im: null },
      { shape: [2, 3], re: [1, 2, 3, 4, 5, NaN], im: null },
      { shape: [2, 2], re: [1, 0, -1, 1e-300], im: [0, 2, Infinity, -3] },
    ];
    for (const c of cases) {
      const bytes = encodeNpy(c);
      const back = readNpy(bytes);
      expect(back.version).toEqual([1, 0]);
      expect(back.dataOffset % 64).toBe(0);
      expect(back.shape).toEqual(c.shape);
      expect(back.descr).toBe(c.im ? '<c16' : '<f8');
      expect(back.fortranOrder).toBe(false);
      expect(back.re.map((x) => Object.is(x, -0) ? '-0' : String(x))).toEqual(c.re.map((x) => Object.is(x, -0) ? '-0' : String(x)));
      expect(back.im).toEqual(c.im);
    }
    expect(() => encodeNpy({ shape: [2, 2], re: [1, 2, 3], im: null })).toThrow(/needs 4 entries/);
  });

  it('round-trips every array exactly through JSON, CSV and NPY', () => {
    const tool = { name: 'kernwright', version: 'test' };
    const doc = JSON.parse(exportJsonDocument(unitRod, tool, 'rod.kw'));
    expect(doc.kernel).toBe('rod');
    const csv = new Map(exportCsvFiles(unitRod, tool, 'rod.kw').map((f) => [f.name, String(f.content)]));
    const npy = new Map(exportNpyFiles(unitRod, tool, 'rod.kw').map((f) => [f.name, f.content as Uint8Array]));
    for (const a of unitRod.arrays) {
      const flat = (doc.arrays[a.name].data as unknown[]).flat(2) as number[];
      expect(doc.arrays[a.name].shape).toEqual(a.shape);
      expect(Float64Array.from(flat)).toEqual(a.re);
      const fromCsv = csv.get(`${a.name}.csv`)!.trimEnd().split('\n').flatMap((l) => l.split(',')).map(Number);
      expect(Float64Array.from(fromCsv)).toEqual(a.re);
      const fromNpy = readNpy(npy.get(`${a.name}.npy`)!);
      expect(fromNpy.shape).toEqual(a.shape);
      expect(Float64Array.from(fromNpy.re)).toEqual(a.re);
    }
    const manifest = JSON.parse(String(csv.get('manifest.json')));
    expect(Object.keys(manifest.arrays)).toEqual(unitRod.arrays.map((a) => a.name));
    expect(manifest.arrays.galerkin_matrix.files).toEqual(['galerkin_matrix.csv']);
  });

  it('spells non-finite CSV values as NumPy reads them', () => {
    expect([NaN, Infinity, -Infinity, 0.1, -2e-300].map(csvNumber)).toEqual(['nan', 'inf', '-inf', '0.1', '-2e-300']);
  });
});
