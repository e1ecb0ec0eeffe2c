/**
 * Test helpers for the linear-algebra layer: reproducible random matrices, complex products, residual and
 * orthonormality measures computed directly from the definitions, and conversion to mathjs.
 */
import { complex, type Complex } from 'mathjs';

/** Deterministic uniform numbers in [−1, 1) (a 48-bit linear congruential generator, as in java.util.Random). */
export function rng(seed: number): () => number {
  let s = BigInt(seed) ^ 0x5deece66dn;
  const mask = (1n << 48n) - 1n;
  return () => {
    s = (s * 0x5deece66dn + 0xbn) & mask;
    return Number(s >> 16n) / 2 ** 31 - 1;
  };
}

export function randomMatrix(rows: number, cols: number, seed: number): Float64Array {
  const r = rng(seed);
  return Float64Array.from({ length: rows * cols }, () => r());
}

export function randomSymmetric(n: number, seed: number): Float64Array {
  const a = randomMatrix(n, n, seed);
  for (let i = 0; i < n; i++) for (let j = 0; j < i; j++) a[j * n + i] = a[i * n + j];
  return a;
}

/** A random Hermitian matrix (re symmetric, im antisymmetric with zero diagonal). */
export function randomHermitian(n: number, seed: number): { re: Float64Array; im: Float64Array } {
  const re = randomSymmetric(n, seed);
  const im = randomMatrix(n, n, seed + 1);
  for (let i = 0; i < n; i++) {
    im[i * n + i] = 0;
    for (let j = 0; j < i; j++) im[j * n + i] = -im[i * n + j];
  }
  return { re, im };
}

export interface CMat {
  re: Float64Array;
  im: Float64Array;
}

/** C = A·B for complex rows×inner and inner×cols matrices. */
export function cmatmul(a: CMat, b: CMat, rows: number, inner: number, cols: number): CMat {
  const re = new Float64Array(rows * cols);
  const im = new Float64Array(rows * cols);
  for (let i = 0; i < rows; i++) {
    for (let k = 0; k < inner; k++) {
      const ar = a.re[i * inner + k];
      const ai = a.im[i * inner + k];
      for (let j = 0; j < cols; j++) {
        const br = b.re[k * cols + j];
        const bi = b.im[k * cols + j];
        re[i * cols + j] += ar * br - ai * bi;
        im[i * cols + j] += ar * bi + ai * br;
      }
    }
  }
  return { re, im };
}

/** The conjugate transpose of a rows×cols complex matrix. */
export function adjoint(a: CMat, rows: number, cols: number): CMat {
  const re = new Float64Array(rows * cols);
  const im = new Float64Array(rows * cols);
  for (let i = 0; i < rows; i++) {
    for (let j = 0; j < cols; j++) {
      re[j * rows + i] = a.re[i * cols + j];
      im[j * rows + i] = -a.im[i * cols + j];
    }
  }
  return { re, im };
}

/** A random unitary matrix: the Q of complex Gram–Schmidt on a random complex matrix. */
export function randomUnitary(n: number, seed: number): CMat {
  const re = randomMatrix(n, n, seed);
  const im = randomMatrix(n, n, seed + 7);
  for (let j = 0; j < n; j++) {
    for (let pass = 0; pass < 2; pass++) {
      for (let p = 0; p < j; p++) {
        let hr = 0;
        let hi = 0;
        for (let i = 0; i < n; i++) {
          const qr = re[i * n + p];
          const qi = im[i * n + p];
          const vr = re[i * n + j];
          const vi = im[i * n + j];
          hr += qr * vr + qi * vi;
          hi += qr * vi - qi * vr;
        }
        for (let i = 0; i < n; i++) {
          const qr = re[i * n + p];
          const qi = im[i * n + p];
          re[i * n + j] -= qr * hr - qi * hi;
          im[i * n + j] -= qr * hi + qi * hr;
        }
      }
    }
    let s = 0;
    for (let i = 0; i < n; i++) s += re[i * n + j] ** 2 + im[i * n + j] ** 2;
    s = Math.sqrt(s);
    for (let i = 0; i < n; i++) {
      re[i * n + j] /= s;
      im[i * n + j] /= s;
    }
  }
  return { re, im };
}

/** max over columns k of ‖A v_k − λ_k v_k‖₂ for a complex n×n A and eigen-pairs (values, vectors as columns). */
export function maxResidual(
  a: CMat,
  n: number,
  valuesRe: Float64Array,
  valuesIm: Float64Array,
  vectors: CMat,
  count = n,
): number {
  let worst = 0;
  for (let k = 0; k < count; k++) {
    let s = 0;
    for (let i = 0; i < n; i++) {
      let yr = 0;
      let yi = 0;
      for (let j = 0; j < n; j++) {
        const ar = a.re[i * n + j];
        const ai = a.im[i * n + j];
        const vr = vectors.re[j * count + k];
        const vi = vectors.im[j * count + k];
        yr += ar * vr - ai * vi;
        yi += ar * vi + ai * vr;
      }
      const vr = vectors.re[i * count + k];
      const vi = vectors.im[i * count + k];
      yr -= valuesRe[k] * vr - valuesIm[k] * vi;
      yi -= valuesRe[k] * vi + valuesIm[k] * vr;
      s += yr * yr + yi * yi;
    }
    worst = Math.max(worst, Math.sqrt(s));
  }
  return worst;
}

/** max |(VᴴV − I)_ij| for an n×m complex V (columns). */
export function orthonormalityDefect(v: CMat, n: number, m: number = n): number {
  const g = cmatmul(adjoint(v, n, m), v, m, n, m);
  let worst = 0;
  for (let i = 0; i < m; i++) {
    for (let j = 0; j < m; j++) {
      worst = Math.max(worst, Math.hypot(g.re[i * m + j] - (i === j ? 1 : 0), g.im[i * m + j]));
    }
  }
  return worst;
}

/** The largest |entry| of a real array. */
export function maxAbs(a: ArrayLike<number>): number {
  let m = 0;
  for (let i = 0; i < a.length; i++) m = Math.max(m, Math.abs(a[i]));
  return m;
}

export function zeros(n: number): Float64Array {
  return new Float64Array(n);
}

/** A complex row-major matrix as a mathjs array of arrays of Complex. */
export function toMathjs(re: Float64Array, im: Float64Array | null, n: number): Complex[][] | number[][] {
  const rows: (Complex | number)[][] = [];
  for (let i = 0; i < n; i++) {
    const row: (Complex | number)[] = [];
    for (let j = 0; j < n; j++) row.push(im === null ? re[i * n + j] : complex(re[i * n + j], im[i * n + j]));
    rows.push(row);
  }
  return rows as Complex[][] | number[][];
}

/** Real and imaginary parts of a mathjs eigenvalue list (numbers or Complex). */
export function mathjsValues(values: unknown): { re: number[]; im: number[] } {
  const list = (Array.isArray(values) ? values : (values as { toArray(): unknown[] }).toArray()) as (number | Complex)[];
  return {
    re: list.map((z) => (typeof z === 'number' ? z : z.re)),
    im: list.map((z) => (typeof z === 'number' ? 0 : z.im)),
  };
}

/**
 * Greedy matching of two complex lists of equal length: returns max over a of min over unmatched b of |a − b|,
 * removing each match. Sensible when the lists are close and their points are separated.
 */
export function matchedDistance(aRe: ArrayLike<number>, aIm: ArrayLike<number>, bRe: number[], bIm: number[]): number {
  if (aRe.length !== bRe.length) return Infinity;
  const free = bRe.map((_, i) => i);
  let worst = 0;
  for (let p = 0; p < aRe.length; p++) {
    let best = -1;
    let bestD = Infinity;
    for (const q of free) {
      const d = Math.hypot(aRe[p] - bRe[q], aIm[p] - bIm[q]);
      if (d < bestD) {
        bestD = d;
        best = q;
      }
    }
    free.splice(free.indexOf(best), 1);
    worst = Math.max(worst, bestD);
  }
  return worst;
}
