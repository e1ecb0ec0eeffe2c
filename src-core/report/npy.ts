/**
 * Arrays in NumPy's `.npy` format, version 1.0, as described in NumPy Enhancement Proposal 1 ("A Simple File Format
 * for NumPy Arrays"): the magic string \x93NUMPY, the version bytes 1 and 0, the header length as a little-endian
 * unsigned 16-bit integer, then an ASCII header holding a Python dict literal with the keys 'descr', 'fortran_order'
 * and 'shape', padded with spaces and ended by a newline so that the data starts at a multiple of 64 bytes; then the
 * data in C (row-major) order.
 *
 * Real arrays are written as little-endian float64 ('<f8'), complex ones as little-endian complex128 ('<c16': real
 * and imaginary part of each entry, one after the other). Pure: bytes out, no file system.
 */

export type NpyDtype = 'f8' | 'c16';

/** An array to write: `re` (and `im` for complex data) in row-major order, with `shape`'s product entries. */
export interface NpyArray {
  readonly shape: readonly number[];
  readonly re: ArrayLike<number>;
  /** Imaginary parts; present exactly when the array is complex. */
  readonly im: ArrayLike<number> | null;
}

const magic = [0x93, 0x4e, 0x55, 0x4d, 0x50, 0x59]; // \x93NUMPY
const alignment = 64;

/** The header dict, e.g. `{'descr': '<f8', 'fortran_order': False, 'shape': (3, 4), }`. */
export function npyHeader(dtype: NpyDtype, shape: readonly number[]): string {
  const dims = shape.length === 1 ? `(${shape[0]},)` : `(${shape.join(', ')})`;
  return `{'descr': '<${dtype}', 'fortran_order': False, 'shape': ${dims}, }`;
}

function entries(shape: readonly number[]): number {
  return shape.reduce((n, d) => n * d, 1);
}

/** The complete `.npy` file of one array. */
export function encodeNpy(array: NpyArray): Uint8Array {
  const { shape, re, im } = array;
  for (const d of shape) {
    if (!Number.isInteger(d) || d < 0) throw new RangeError(`encodeNpy: bad dimension ${d} in shape (${shape.join(', ')})`);
  }
  const n = entries(shape);
  if (re.length !== n || (im && im.length !== n)) {
    throw new RangeError(`encodeNpy: shape (${shape.join(', ')}) needs ${n} entries, got ${re.length}${im ? ` and ${im.length}` : ''}`);
  }
  const dtype: NpyDtype = im ? 'c16' : 'f8';
  const dict = npyHeader(dtype, shape);
  const fixed = magic.length + 2 + 2;
  // Pad with spaces so that fixed + header (ending in '\n') is a multiple of the alignment.
  const unpadded = dict.length + 1;
  const total = Math.ceil((fixed + unpadded) / alignment) * alignment;
  const headerLength = total - fixed;
  if (headerLength > 0xffff) throw new RangeError('encodeNpy: header too long for format version 1.0');
  const header = dict + ' '.repeat(headerLength - unpadded) + '\n';
  const itemBytes = im ? 16 : 8;
  const out = new Uint8Array(total + n * itemBytes);
  out.set(magic, 0);
  out[6] = 1;
  out[7] = 0;
  const view = new DataView(out.buffer);
  view.setUint16(8, headerLength, true);
  for (let k = 0; k < header.length; k++) out[fixed + k] = header.charCodeAt(k);
  let at = total;
  for (let k = 0; k < n; k++) {
    view.setFloat64(at, re[k], true);
    at += 8;
    if (im) {
      view.setFloat64(at, im[k], true);
      at += 8;
    }
  }
  return out;
}
