/**
 * The exported arrays of a kernel (report/exportData.ts) as files: one JSON document; or one CSV file per array; or
 * one NPY file per array (report/npy.ts). CSV and NPY folders also get a `manifest.json` that says what each file
 * holds (the JSON document without the numbers). Pure: names and contents out, the command line writes them.
 *
 * Numbers are written so that they read back exactly: JSON and CSV use the shortest decimal that round-trips
 * (JavaScript's number-to-string); CSV spells non-finite values `nan`, `inf` and `-inf` (as NumPy reads them), JSON
 * writes them as null. Complex arrays are {re, im} pairs of nested lists in JSON, two files `NAME_re.csv` and
 * `NAME_im.csv` in CSV, and complex128 in NPY.
 */
import type { ExportArray, KernelExport } from '../report/exportData';
import type { JsonTool } from '../report/json';
import { encodeNpy } from '../report/npy';

export const exportFormatVersion = 1;

export interface ExportFile {
  readonly name: string;
  readonly content: string | Uint8Array;
}

type Nested = number | null | Nested[];

function nest(values: Float64Array, shape: readonly number[], offset = 0): Nested[] {
  if (shape.length <= 1) return Array.from(values.subarray(offset, offset + (shape[0] ?? values.length)), (x) => (Number.isFinite(x) ? x : null));
  const stride = shape.slice(1).reduce((n, d) => n * d, 1);
  const out: Nested[] = [];
  for (let k = 0; k < shape[0]; k++) out.push(nest(values, shape.slice(1), offset + k * stride));
  return out;
}

function dtypeOf(a: ExportArray): 'float64' | 'complex128' {
  return a.im ? 'complex128' : 'float64';
}

function header(data: KernelExport, tool: JsonTool, source: string) {
  return {
    version: exportFormatVersion,
    tool: { name: tool.name, version: tool.version },
    file: source,
    kernel: data.kernel,
    domain: [data.domain[0], data.domain[1]],
    complex: data.complex,
    method: data.method,
    converged: data.converged,
    discretisation: data.discretisation,
    notes: data.notes,
  };
}

/** One JSON document with every array: real arrays as nested lists, complex ones as { re, im } nested lists. */
export function exportJsonDocument(data: KernelExport, tool: JsonTool, source: string): string {
  const arrays: Record<string, unknown> = {};
  for (const a of data.arrays) {
    arrays[a.name] = {
      description: a.description,
      dtype: dtypeOf(a),
      shape: a.shape,
      data: a.im ? { re: nest(a.re, a.shape), im: nest(a.im, a.shape) } : nest(a.re, a.shape),
    };
  }
  return JSON.stringify({ ...header(data, tool, source), arrays }, null, 1) + '\n';
}

function manifest(data: KernelExport, tool: JsonTool, source: string, files: Map<string, string[]>): ExportFile {
  const arrays: Record<string, unknown> = {};
  for (const a of data.arrays) arrays[a.name] = { description: a.description, dtype: dtypeOf(a), shape: a.shape, files: files.get(a.name) ?? [] };
  return { name: 'manifest.json', content: JSON.stringify({ ...header(data, tool, source), arrays }, null, 2) + '\n' };
}

/** A number for CSV: exact round trip for finite values, `nan`, `inf`, `-inf` otherwise. */
export function csvNumber(x: number): string {
  if (Number.isNaN(x)) return 'nan';
  if (!Number.isFinite(x)) return x > 0 ? 'inf' : '-inf';
  return String(x);
}

/** Rows of a 1-D (one value per line) or 2-D (one row per line, comma-separated) array. */
export function csvText(values: Float64Array, shape: readonly number[]): string {
  const cols = shape.length >= 2 ? shape.slice(1).reduce((n, d) => n * d, 1) : 1;
  const rows = cols === 0 ? 0 : values.length / cols;
  const lines: string[] = [];
  for (let r = 0; r < rows; r++) {
    const row: string[] = [];
    for (let c = 0; c < cols; c++) row.push(csvNumber(values[r * cols + c]));
    lines.push(row.join(','));
  }
  return lines.length > 0 ? lines.join('\n') + '\n' : '';
}

export function exportCsvFiles(data: KernelExport, tool: JsonTool, source: string): ExportFile[] {
  const files: ExportFile[] = [];
  const names = new Map<string, string[]>();
  for (const a of data.arrays) {
    if (a.im) {
      files.push({ name: `${a.name}_re.csv`, content: csvText(a.re, a.shape) }, { name: `${a.name}_im.csv`, content: csvText(a.im, a.shape) });
      names.set(a.name, [`${a.name}_re.csv`, `${a.name}_im.csv`]);
    } else {
      files.push({ name: `${a.name}.csv`, content: csvText(a.re, a.shape) });
      names.set(a.name, [`${a.name}.csv`]);
    }
  }
  return [...files, manifest(data, tool, source, names)];
}

export function exportNpyFiles(data: KernelExport, tool: JsonTool, source: string): ExportFile[] {
  const files: ExportFile[] = data.arrays.map((a) => ({ name: `${a.name}.npy`, content: encodeNpy({ shape: a.shape, re: a.re, im: a.im }) }));
  const names = new Map(data.arrays.map((a) => [a.name, [`${a.name}.npy`]]));
  return [...files, manifest(data, tool, source, names)];
}
