/**
 * `kernwright export` run as a user runs it: JSON on stdout or into a file, CSV and NPY folders read back (by the
 * reader written from the NPY format description, and by NumPy itself when python3 with numpy is installed), the
 * choice of kernel, and the refusals, none of which leaves anything behind.
 */
import { spawnSync } from 'node:child_process';
import * as fs from 'node:fs';
import * as os from 'node:os';
import * as path from 'node:path';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { bundleCli, expectCleanFailure, writeTree, type Harness, type Run } from './cliHarness';
import { readNpy } from './npyReader';

vi.setConfig({ testTimeout: 600_000 });

let h: Harness;
let work = '';
const two = '# Invented test scenario.\ndomain [0, 1]\nkernel rod(t, s) = min(t, s) - t * s\nkernel wave(t, s) = exp(i * 3 * (t - s)) * exp(-abs(t - s))\n';
const unbounded = '# Invented test scenario.\ndomain [0, 1]\nkernel big(t, s) = 1 / abs(t - s)\n';

function kw(...args: string[]): Run {
  return h.run(work, [...args, '--time-budget', '20000']);
}

interface JsonArray { dtype: string; shape: number[]; data: unknown }
let reference: Record<string, JsonArray> = {};

const hasNumpy = spawnSync('python3', ['-c', 'import numpy'], { encoding: 'utf8' }).status === 0;

function flat(a: JsonArray): { re: number[]; im: number[] | null } {
  if (a.dtype === 'complex128') {
    const d = a.data as { re: unknown[]; im: unknown[] };
    return { re: d.re.flat(2) as number[], im: d.im.flat(2) as number[] };
  }
  return { re: (a.data as unknown[]).flat(2) as number[], im: null };
}

beforeAll(async () => {
  h = await bundleCli();
  work = fs.mkdtempSync(path.join(os.tmpdir(), 'kw-export-'));
  writeTree(work, { 'two.kw': two, 'big.kw': unbounded, 'out/keep.txt': 'already here' });
  const r = kw('export', 'two.kw', '--kernel', 'wave');
  if (r.status !== 0) throw new Error(r.stderr);
  reference = JSON.parse(r.stdout).arrays;
}, 300_000);

afterAll(() => {
  h?.dispose();
  if (work) fs.rmSync(work, { recursive: true, force: true });
});

describe('kernwright export', () => {
  it('prints one JSON document with every array, its dtype and shape', () => {
    expect(Object.keys(reference)).toEqual([
      'breakpoints', 'galerkin_matrix', 'eigenvalues', 'eigenvalue_errors', 'eigenvector_coefficients',
      'eigenfunction_grid', 'eigenfunctions', 'nystrom_nodes', 'nystrom_weights', 'nystrom_kernel',
    ]);
    expect(reference.galerkin_matrix.dtype).toBe('complex128');
    expect(reference.eigenvalues.dtype).toBe('float64');
    const n = reference.galerkin_matrix.shape[0];
    expect(reference.galerkin_matrix.shape).toEqual([n, n]);
    expect(flat(reference.galerkin_matrix).re).toHaveLength(n * n);
  });

  it('writes NPY files that read back exactly, by the format reader and by NumPy', () => {
    const r = kw('export', 'two.kw', '--kernel', 'wave', '--format', 'npy', '-o', 'npy');
    expect(r.status).toBe(0);
    expect(r.stdout).toBe('wrote 11 files to npy\n');
    const manifest = JSON.parse(fs.readFileSync(path.join(work, 'npy', 'manifest.json'), 'utf8'));
    expect(manifest.kernel).toBe('wave');
    for (const [name, a] of Object.entries(reference)) {
      const back = readNpy(fs.readFileSync(path.join(work, 'npy', `${name}.npy`)));
      expect(back.shape).toEqual(a.shape);
      expect(back.descr).toBe(a.dtype === 'complex128' ? '<c16' : '<f8');
      const f = flat(a);
      expect(back.re).toEqual(f.re);
      expect(back.im).toEqual(f.im);
      expect(manifest.arrays[name].files).toEqual([`${name}.npy`]);
    }
    if (!hasNumpy) return; // numpy is optional: the reader above already checked the format
    const script = [
      'import json, sys, numpy as np',
      'out = {}',
      `for name in ${JSON.stringify(Object.keys(reference))}:`,
      "    a = np.load(sys.argv[1] + '/' + name + '.npy')",
      "    out[name] = {'shape': list(a.shape), 'dtype': str(a.dtype), 're': np.real(a).ravel().tolist(), 'im': np.imag(a).ravel().tolist() if np.iscomplexobj(a) else None}",
      'print(json.dumps(out))',
    ].join('\n');
    const py = spawnSync('python3', ['-c', script, path.join(work, 'npy')], { encoding: 'utf8', maxBuffer: 64 * 1024 * 1024 });
    expect(py.stderr).toBe('');
    const numpy = JSON.parse(py.stdout);
    for (const [name, a] of Object.entries(reference)) {
      expect(numpy[name].shape).toEqual(a.shape);
      expect(numpy[name].dtype).toBe(a.dtype);
      expect(numpy[name].re).toEqual(flat(a).re);
      expect(numpy[name].im).toEqual(flat(a).im);
    }
  });

  it('writes CSV files (complex arrays as _re and _im) that read back exactly', () => {
    expect(kw('export', 'two.kw', '--kernel', 'wave', '--format=csv', '--output', 'csv').status).toBe(0);
    for (const [name, a] of Object.entries(reference)) {
      const parse = (file: string) => fs.readFileSync(path.join(work, 'csv', file), 'utf8').trimEnd().split('\n').flatMap((l) => l.split(',')).map(Number);
      const f = flat(a);
      if (f.im) {
        expect(parse(`${name}_re.csv`)).toEqual(f.re);
        expect(parse(`${name}_im.csv`)).toEqual(f.im);
      } else {
        expect(parse(`${name}.csv`)).toEqual(f.re);
        if (a.shape.length === 2) expect(fs.readFileSync(path.join(work, 'csv', `${name}.csv`), 'utf8').split('\n')).toHaveLength(a.shape[0] + 1);
      }
    }
  });

  it('writes JSON to a file or into a folder, and into an existing folder next to what is there', () => {
    expect(kw('export', 'two.kw', '--kernel', 'rod', '-o', 'rod.json').status).toBe(0);
    expect(JSON.parse(fs.readFileSync(path.join(work, 'rod.json'), 'utf8')).kernel).toBe('rod');
    expect(kw('export', 'two.kw', '--kernel', 'rod', '-o', 'out')).toMatchObject({ status: 0, stdout: `wrote ${path.join('out', 'rod.json')}\n` });
    expect(kw('export', 'two.kw', '--kernel', 'rod', '--format', 'npy', '-o', 'out').status).toBe(0);
    expect(fs.readdirSync(path.join(work, 'out')).sort()).toContain('keep.txt');
    expect(fs.readdirSync(path.join(work, 'out'))).toContain('galerkin_matrix.npy');
    expect(fs.readdirSync(work).filter((n) => n.includes('kwexport') || n.endsWith('.tmp'))).toEqual([]);
  });

  it('needs --kernel when the file has several, and names them', () => {
    expectCleanFailure(kw('export', 'two.kw'), 2, /'two\.kw' declares 2 kernels \(rod, wave\): choose one with --kernel/);
    expectCleanFailure(kw('export', 'two.kw', '--kernel', 'nope'), 2, /has no kernel named 'nope' \(kernels: rod, wave\)/);
  });

  it('exports nothing for an unbounded kernel (exit 1) and refuses bad usage and unreadable input (exit 2)', () => {
    const r = kw('export', 'big.kw', '--format', 'npy', '-o', 'big-out');
    expectCleanFailure(r, 1, /nothing exported from 'big\.kw': kernel 'big' has no discretisation to export: line 3: .*bounded/);
    expect(fs.existsSync(path.join(work, 'big-out'))).toBe(false);
    expectCleanFailure(kw('export', 'two.kw', '--kernel', 'rod', '--format', 'npy'), 2, /name a folder with -o <folder>/);
    expectCleanFailure(kw('export', 'missing.kw'), 2, /cannot find|cannot read 'missing\.kw'/);
    expectCleanFailure(kw('export', 'two.kw', '--kernel', 'rod', '--format', 'npy', '-o', 'no/such/dir'), 2, /the folder 'no\/such' does not exist/);
    expect(fs.existsSync(path.join(work, 'no'))).toBe(false);
    expectCleanFailure(kw('export', 'two.kw', '--kernel', 'rod', '--format', 'npy', '-o', 'rod.json'), 2, /'rod\.json' exists and is not a folder/);
    expectCleanFailure(kw('export', 'two.kw', 'big.kw'), 2, /export needs exactly one file, got 2/);
    expectCleanFailure(kw('export', 'two.kw', '--format', 'xml'), 2, /unknown format 'xml' \(use json, csv or npy\)/);
  });
});
