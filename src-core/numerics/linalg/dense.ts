/**
 * Dense matrix helpers shared by the linear-algebra layer.
 *
 * Matrices are dense and row-major in a Float64Array: entry (i, j) of an r×c matrix is at index i·c + j. A complex
 * matrix is a pair of such arrays (real part, imaginary part); an imaginary part of `null` means a real matrix.
 * Nothing here allocates per element; every function checks its sizes and says which argument is wrong.
 */

/** Throws a RangeError unless `n` is a positive integer; `what` names the dimension in the message. */
export function checkDimension(caller: string, what: string, n: number): void {
  if (!Number.isInteger(n) || n < 1) {
    throw new RangeError(`${caller}: ${what} must be a positive integer, got ${String(n)}`);
  }
}

/**
 * Throws a RangeError unless `a` holds exactly rows·cols finite numbers. `name` names the argument in the message,
 * and the first non-finite entry is reported with its (row, column).
 */
export function checkMatrix(caller: string, name: string, a: Float64Array, rows: number, cols: number): void {
  if (!(a instanceof Float64Array)) {
    throw new TypeError(`${caller}: ${name} must be a Float64Array`);
  }
  if (a.length !== rows * cols) {
    throw new RangeError(
      `${caller}: ${name} must hold ${rows}×${cols} = ${rows * cols} entries (row-major), got ${a.length}`,
    );
  }
  for (let p = 0; p < a.length; p++) {
    if (!Number.isFinite(a[p])) {
      const i = Math.floor(p / cols);
      throw new RangeError(`${caller}: ${name}[${i}, ${p - i * cols}] is ${String(a[p])}; entries must be finite`);
    }
  }
}

/** Checks a square (possibly complex) input: n, the real part and, when present, the imaginary part. */
export function checkSquareComplex(caller: string, re: Float64Array, im: Float64Array | null, n: number): void {
  checkDimension(caller, 'n', n);
  checkMatrix(caller, 're', re, n, n);
  if (im !== null) checkMatrix(caller, 'im', im, n, n);
}

/** True when `im` is null or all zero: the matrix is real. */
/** True when every entry is a finite number (solvers assert it; callers with doubtful data ask first). */
export function entriesFinite(xs: ArrayLike<number>): boolean {
  for (let k = 0; k < xs.length; k++) if (!Number.isFinite(xs[k])) return false;
  return true;
}

export function isRealPart(im: Float64Array | null): boolean {
  if (im === null) return true;
  for (let p = 0; p < im.length; p++) if (im[p] !== 0) return false;
  return true;
}

/** C = A·B for A rows×inner and B inner×cols (real, row-major). */
export function matmul(a: Float64Array, b: Float64Array, rows: number, inner: number, cols: number): Float64Array {
  checkDimension('matmul', 'rows', rows);
  checkDimension('matmul', 'inner', inner);
  checkDimension('matmul', 'cols', cols);
  if (a.length !== rows * inner) {
    throw new RangeError(`matmul: a must hold ${rows}×${inner} = ${rows * inner} entries, got ${a.length}`);
  }
  if (b.length !== inner * cols) {
    throw new RangeError(`matmul: b must hold ${inner}×${cols} = ${inner * cols} entries, got ${b.length}`);
  }
  const c = new Float64Array(rows * cols);
  for (let i = 0; i < rows; i++) {
    const ci = i * cols;
    for (let k = 0; k < inner; k++) {
      const aik = a[i * inner + k];
      if (aik === 0) continue;
      const bk = k * cols;
      for (let j = 0; j < cols; j++) c[ci + j] += aik * b[bk + j];
    }
  }
  return c;
}

/** The transpose (cols×rows) of a rows×cols matrix; `cols` defaults to `rows` (square). */
export function transpose(a: Float64Array, rows: number, cols: number = rows): Float64Array {
  checkDimension('transpose', 'rows', rows);
  checkDimension('transpose', 'cols', cols);
  if (a.length !== rows * cols) {
    throw new RangeError(`transpose: a must hold ${rows}×${cols} = ${rows * cols} entries, got ${a.length}`);
  }
  const t = new Float64Array(rows * cols);
  for (let i = 0; i < rows; i++) {
    for (let j = 0; j < cols; j++) t[j * rows + i] = a[i * cols + j];
  }
  return t;
}

/** ‖A‖_F of a real matrix, or of the complex matrix re + i·im when `im` is given (any shape; scaled against overflow). */
export function frobeniusNorm(re: Float64Array, im: Float64Array | null = null): number {
  if (im !== null && im.length !== re.length) {
    throw new RangeError(`frobeniusNorm: re and im must have the same length, got ${re.length} and ${im.length}`);
  }
  let scale = 0;
  for (let p = 0; p < re.length; p++) scale = Math.max(scale, Math.abs(re[p]));
  if (im !== null) for (let p = 0; p < im.length; p++) scale = Math.max(scale, Math.abs(im[p]));
  if (scale === 0 || !Number.isFinite(scale)) return scale;
  let s = 0;
  for (let p = 0; p < re.length; p++) {
    const x = re[p] / scale;
    s += x * x;
  }
  if (im !== null) {
    for (let p = 0; p < im.length; p++) {
      const x = im[p] / scale;
      s += x * x;
    }
  }
  return scale * Math.sqrt(s);
}

/**
 * ‖A − Aᴴ‖_F / ‖A‖_F for the n×n matrix A = re + i·im (Aᴴ = Aᵀ when `im` is null). 0 for a Hermitian matrix and for
 * the zero matrix; at most 2 otherwise.
 */
export function hermitianDefect(re: Float64Array, im: Float64Array | null, n: number): number {
  checkDimension('hermitianDefect', 'n', n);
  if (re.length !== n * n) {
    throw new RangeError(`hermitianDefect: re must hold ${n}×${n} = ${n * n} entries, got ${re.length}`);
  }
  if (im !== null && im.length !== n * n) {
    throw new RangeError(`hermitianDefect: im must hold ${n}×${n} = ${n * n} entries, got ${im.length}`);
  }
  const norm = frobeniusNorm(re, im);
  if (norm === 0) return 0;
  let s = 0;
  for (let i = 0; i < n; i++) {
    for (let j = i + 1; j < n; j++) {
      // (A − Aᴴ)_ij = a_ij − conj(a_ji); the (j, i) entry is minus its conjugate, so each pair counts twice.
      const dr = (re[i * n + j] - re[j * n + i]) / norm;
      const di = im === null ? 0 : (im[i * n + j] + im[j * n + i]) / norm;
      s += 2 * (dr * dr + di * di);
    }
    if (im !== null) {
      const d = (2 * im[i * n + i]) / norm;
      s += d * d;
    }
  }
  return Math.sqrt(s);
}

/** The n×n identity matrix. */
export function identity(n: number): Float64Array {
  const a = new Float64Array(n * n);
  for (let i = 0; i < n; i++) a[i * n + i] = 1;
  return a;
}

/** sqrt(a² + b²) without destructive overflow or underflow (cheaper than Math.hypot in hot paths). */
export function hypot2(a: number, b: number): number {
  const x = Math.abs(a);
  const y = Math.abs(b);
  if (x > y) {
    const r = y / x;
    return x * Math.sqrt(1 + r * r);
  }
  if (y === 0) return 0;
  const r = x / y;
  return y * Math.sqrt(1 + r * r);
}
