/**
 * A reader of `.npy` files written for the tests from the published format description (NumPy Enhancement
 * Proposal 1, "A Simple File Format for NumPy Arrays"), independently of the writer in src-core/report/npy.ts:
 * magic string \x93NUMPY; major and minor version bytes; header length (little-endian uint16 for version 1.x,
 * uint32 for 2.x); an ASCII Python dict literal with 'descr', 'fortran_order' and 'shape'; then the data.
 * Reads little-endian float64 ('<f8') and complex128 ('<c16') in C or Fortran order; anything else is an error.
 */

export interface NpyContents {
  readonly version: [number, number];
  readonly descr: string;
  readonly fortranOrder: boolean;
  readonly shape: number[];
  /** Entries in C (row-major) order. */
  readonly re: number[];
  readonly im: number[] | null;
  /** Where the data starts (the format wants a multiple of 16; NumPy writes 64). */
  readonly dataOffset: number;
}

export function readNpy(bytes: Uint8Array): NpyContents {
  const magic = [0x93, ...'NUMPY'.split('').map((c) => c.charCodeAt(0))];
  magic.forEach((b, k) => {
    if (bytes[k] !== b) throw new Error(`not an npy file: byte ${k} is ${bytes[k]}`);
  });
  const major = bytes[6];
  const minor = bytes[7];
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  let headerLength: number;
  let headerStart: number;
  if (major === 1) { headerLength = view.getUint16(8, true); headerStart = 10; }
  else if (major === 2) { headerLength = view.getUint32(8, true); headerStart = 12; }
  else throw new Error(`unsupported npy version ${major}.${minor}`);
  const header = String.fromCharCode(...bytes.subarray(headerStart, headerStart + headerLength));
  if (!header.endsWith('\n')) throw new Error('header does not end with a newline');
  const descr = /'descr':\s*'([^']*)'/.exec(header)?.[1];
  const fortran = /'fortran_order':\s*(True|False)/.exec(header)?.[1];
  const shapeText = /'shape':\s*\(([^)]*)\)/.exec(header)?.[1];
  if (descr === undefined || fortran === undefined || shapeText === undefined) throw new Error(`malformed header ${header}`);
  const shape = shapeText.split(',').map((s) => s.trim()).filter((s) => s !== '').map(Number);
  const count = shape.reduce((n, d) => n * d, 1);
  const dataOffset = headerStart + headerLength;
  let item: number;
  if (descr === '<f8') item = 8;
  else if (descr === '<c16') item = 16;
  else throw new Error(`unsupported dtype ${descr}`);
  if (bytes.length !== dataOffset + count * item) throw new Error(`expected ${count * item} data bytes, found ${bytes.length - dataOffset}`);
  const raw: number[] = [];
  const rawIm: number[] = [];
  for (let k = 0; k < count; k++) {
    raw.push(view.getFloat64(dataOffset + k * item, true));
    if (item === 16) rawIm.push(view.getFloat64(dataOffset + k * item + 8, true));
  }
  // Fortran order: reorder into C order.
  const toC = (values: number[]): number[] => {
    if (fortran === 'False' || shape.length < 2) return values;
    const out = new Array<number>(count);
    const strides = shape.map((_, i) => shape.slice(0, i).reduce((n, d) => n * d, 1));
    for (let c = 0; c < count; c++) {
      let rest = c;
      let f = 0;
      for (let i = shape.length - 1; i >= 0; i--) {
        f += (rest % shape[i]) * strides[i];
        rest = Math.floor(rest / shape[i]);
      }
      out[c] = values[f];
    }
    return out;
  };
  return {
    version: [major, minor],
    descr,
    fortranOrder: fortran === 'True',
    shape,
    re: toC(raw),
    im: item === 16 ? toC(rawIm) : null,
    dataOffset,
  };
}
