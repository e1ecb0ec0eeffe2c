/**
 * The complex Hermitian eigensolver: the direct complex reduction (hermitianEigen: Householder to real tridiagonal
 * form, implicit QL, LAPACK ZHEEV's scheme) against the older real symmetric embedding of order 2n
 * (hermitianEigenByEmbedding), side by side in one run, for n = 50, 100, 200 on three kinds of matrix:
 *
 *  - random: entries uniform in [−1, 1) (real part symmetric, imaginary part antisymmetric);
 *  - rank 5: A_jk = Σ_{m<5} c_m e^{i m (x_j − x_k)} g(x_j) g(x_k) / n, c_m = 1/(m + 1)², g(x) = e^{−x²}, x on [−1, 1]
 *    (a degenerate kernel on a grid: n − 5 eigenvalues at zero);
 *  - smooth: A_jk = e^{−(x_j − x_k)²} e^{3i(x_j − x_k)} / n (numerically low rank, eigenvalues decaying to noise).
 *
 * The two solvers alternate call by call so that both see the same machine load; the table gives the median of each
 * and the ratio old/new of the medians. Accuracy columns: the largest eigenvalue difference between the two, and
 * for each solver max_k ‖A v_k − λ_k v_k‖ and max |VᴴV − I|, all relative to ‖A‖₂ = max |λ|.
 */
import { hermitianEigen, type HermitianEigen } from '../src-core/numerics/linalg';
import { hermitianEigenByEmbedding } from '../src-core/numerics/linalg/hermitianEigenEmbedding';

interface Case {
  kind: string;
  n: number;
  re: Float64Array;
  im: Float64Array;
}

function lcg(seed: number): () => number {
  let s = seed >>> 0;
  return () => {
    s = (Math.imul(s, 1664525) + 1013904223) >>> 0;
    return s / 2 ** 31 - 1;
  };
}

function randomCase(n: number, seed: number): Case {
  const r = lcg(seed);
  const re = new Float64Array(n * n);
  const im = new Float64Array(n * n);
  for (let i = 0; i < n; i++) {
    re[i * n + i] = r();
    for (let j = 0; j < i; j++) {
      re[i * n + j] = re[j * n + i] = r();
      im[i * n + j] = r();
      im[j * n + i] = -im[i * n + j];
    }
  }
  return { kind: 'random', n, re, im };
}

function kernelCase(kind: string, n: number, k: (s: number, t: number) => [number, number]): Case {
  const re = new Float64Array(n * n);
  const im = new Float64Array(n * n);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) {
      const [a, b] = k(-1 + (2 * i) / (n - 1), -1 + (2 * j) / (n - 1));
      re[i * n + j] = a / n;
      im[i * n + j] = b / n;
    }
  }
  return { kind, n, re, im };
}

const rank5 = (s: number, t: number): [number, number] => {
  const g = Math.exp(-s * s - t * t);
  let a = 0;
  let b = 0;
  for (let m = 0; m < 5; m++) {
    const c = 1 / (m + 1) ** 2;
    a += c * Math.cos(m * (s - t));
    b += c * Math.sin(m * (s - t));
  }
  return [g * a, g * b];
};

const smooth = (s: number, t: number): [number, number] => {
  const g = Math.exp(-((s - t) ** 2));
  return [g * Math.cos(3 * (s - t)), g * Math.sin(3 * (s - t))];
};

/** max_k ‖A v_k − λ_k v_k‖₂ and max |VᴴV − I|. */
function defects(c: Case, r: HermitianEigen): { residual: number; ortho: number } {
  const { n, re, im } = c;
  const vr = r.vectorsRe;
  const vi = r.vectorsIm;
  let residual = 0;
  for (let k = 0; k < n; k++) {
    let s = 0;
    for (let i = 0; i < n; i++) {
      let yr = -r.values[k] * vr[i * n + k];
      let yi = -r.values[k] * vi[i * n + k];
      for (let j = 0; j < n; j++) {
        const ar = re[i * n + j];
        const ai = im[i * n + j];
        yr += ar * vr[j * n + k] - ai * vi[j * n + k];
        yi += ar * vi[j * n + k] + ai * vr[j * n + k];
      }
      s += yr * yr + yi * yi;
    }
    residual = Math.max(residual, Math.sqrt(s));
  }
  let ortho = 0;
  for (let p = 0; p < n; p++) {
    for (let q = p; q < n; q++) {
      let gr = p === q ? -1 : 0;
      let gi = 0;
      for (let i = 0; i < n; i++) {
        gr += vr[i * n + p] * vr[i * n + q] + vi[i * n + p] * vi[i * n + q];
        gi += vr[i * n + p] * vi[i * n + q] - vi[i * n + p] * vr[i * n + q];
      }
      ortho = Math.max(ortho, Math.hypot(gr, gi));
    }
  }
  return { residual, ortho };
}

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.floor(s.length / 2)];
}

const e1 = (x: number) => x.toExponential(1).padStart(9);
const f1 = (x: number) => x.toFixed(1).padStart(9);

export async function run(): Promise<void> {
  const cases: Case[] = [];
  for (const n of [50, 100, 200]) {
    cases.push(randomCase(n, 1000 + n), kernelCase('rank 5', n, rank5), kernelCase('smooth', n, smooth));
  }
  console.log('Complex Hermitian eigensolver: real embedding of order 2n (old) vs direct complex reduction (new)');
  console.log('times in ms, median of alternating calls; errors relative to ‖A‖₂');
  console.log(
    `${'matrix'.padEnd(8)}${'n'.padStart(5)}${'old ms'.padStart(9)}${'new ms'.padStart(9)}${'old/new'.padStart(9)}` +
      `${'|Δλ|'.padStart(9)}${'res old'.padStart(9)}${'res new'.padStart(9)}${'orth old'.padStart(9)}${'orth new'.padStart(9)}`,
  );
  for (const c of cases) {
    const reps = c.n <= 50 ? 31 : c.n <= 100 ? 15 : 7;
    const tOld: number[] = [];
    const tNew: number[] = [];
    let old = hermitianEigenByEmbedding(c.re, c.im, c.n); // warm-up, both
    let fresh = hermitianEigen(c.re, c.im, c.n);
    for (let r = 0; r < reps; r++) {
      let t = performance.now();
      old = hermitianEigenByEmbedding(c.re, c.im, c.n);
      tOld.push(performance.now() - t);
      t = performance.now();
      fresh = hermitianEigen(c.re, c.im, c.n);
      tNew.push(performance.now() - t);
    }
    const norm = Math.max(Math.abs(fresh.values[0]), Math.abs(fresh.values[c.n - 1]));
    let dl = 0;
    for (let k = 0; k < c.n; k++) dl = Math.max(dl, Math.abs(old.values[k] - fresh.values[k]));
    const dOld = defects(c, old);
    const dNew = defects(c, fresh);
    const mo = median(tOld);
    const mn = median(tNew);
    console.log(
      `${c.kind.padEnd(8)}${String(c.n).padStart(5)}${f1(mo)}${f1(mn)}${f1(mo / mn)}${e1(dl / norm)}` +
        `${e1(dOld.residual / norm)}${e1(dNew.residual / norm)}${e1(dOld.ortho)}${e1(dNew.ortho)}`,
    );
  }
}
