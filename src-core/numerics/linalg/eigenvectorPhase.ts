/**
 * The phase convention for complex eigenvectors shared by the Hermitian solvers: a unit eigenvector is determined
 * only up to a factor e^{iθ}, so each one is rotated until its entry of largest modulus is real and positive (the
 * first such entry when several tie). This makes results reproducible and comparable across solvers; for a real
 * vector it is the usual sign convention.
 */

/**
 * Writes x + iy (entries 0..n−1 of x and y) to column k of the n×n row-major pair (vectorsRe, vectorsIm), multiplied
 * by conj(z_big)/|z_big| where z_big is its entry of largest modulus.
 */
export function writePhasedColumn(
  x: Float64Array,
  y: Float64Array,
  n: number,
  k: number,
  vectorsRe: Float64Array,
  vectorsIm: Float64Array,
): void {
  let bigI = 0;
  let big2 = -1;
  for (let i = 0; i < n; i++) {
    const m2 = x[i] * x[i] + y[i] * y[i];
    if (m2 > big2) {
      big2 = m2;
      bigI = i;
    }
  }
  const mod = Math.sqrt(big2);
  const cr = mod > 0 ? x[bigI] / mod : 1;
  const ci = mod > 0 ? -y[bigI] / mod : 0;
  for (let i = 0; i < n; i++) {
    vectorsRe[i * n + k] = x[i] * cr - y[i] * ci;
    vectorsIm[i * n + k] = x[i] * ci + y[i] * cr;
  }
  vectorsIm[bigI * n + k] = 0;
}

/**
 * Scales the vector x + iy in place to unit 2-norm and rotates it so that its entry of largest modulus is real and
 * positive (for a real vector, y all zero: the usual sign convention). A zero vector is left as it is.
 */
export function phaseUnitVector(x: Float64Array, y: Float64Array): void {
  const n = x.length;
  let bigI = 0;
  let big2 = -1;
  let norm2 = 0;
  for (let i = 0; i < n; i++) {
    const m2 = x[i] * x[i] + y[i] * y[i];
    norm2 += m2;
    if (m2 > big2) { big2 = m2; bigI = i; }
  }
  if (!(norm2 > 0)) return;
  const scale = 1 / (Math.sqrt(big2) * Math.sqrt(norm2));
  const cr = x[bigI] * scale;
  const ci = -y[bigI] * scale;
  for (let i = 0; i < n; i++) {
    const a = x[i];
    const b = y[i];
    x[i] = a * cr - b * ci;
    y[i] = a * ci + b * cr;
  }
  y[bigI] = 0;
}
