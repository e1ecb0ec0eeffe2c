/**
 * Complex elementary functions on separate real and imaginary parts, principal branches as in mathjs. Each writes
 * its result to `complexOut` ([re, im]) instead of returning an object, so the compiled grid loop allocates
 * nothing per point; the generated code reads complexOut right after the call.
 *
 * Choices, documented here once:
 * - Branch cuts (log, sqrt, pow, atan): the sign of a zero part is ignored (-0 is read as +0), so a value on a cut
 *   takes the upper (counter-clockwise) side, as mathjs does for real numbers: log(-1) = iπ, sqrt(-4) = 2i,
 *   atan(±2i) has real part π/2. (For Complex(-1, -0) mathjs would give -iπ; kernel values carry no signed zeros
 *   on purpose.)
 * - Division: Smith's algorithm (R. L. Smith, "Algorithm 116: Complex division", Communications of the ACM 5
 *   (1962), p. 435), which avoids overflow in c² + d². A zero divisor gives ±∞ in each non-zero part of the
 *   dividend (1/0 = ∞ + 0i, like the real 1/0) and NaN for 0/0.
 * - Powers: an integer exponent (|n| ≤ 2³¹) uses repeated squaring, exact for small Gaussian integers and accurate
 *   to a few ulps otherwise (mathjs goes through exp(w log z) and gives (1+2i)³ = -10.999999999999998 - 1.9999999999999964i);
 *   a real base ≥ 0 with a real exponent uses Math.pow (so 0^(−½) = ∞, as mathjs for numbers); otherwise
 *   exp(w · log z). For a complex exponent w, 0^w = 0 when Re w > 0 and NaN otherwise (as mathjs).
 * - tanh and tan: W. Kahan, "Branch cuts for complex elementary functions, or much ado about nothing's sign bit"
 *   (in The State of the Art in Numerical Analysis, 1987): tanh(x+iy) = (βρs + it)/(1 + βs²) with t = tan y,
 *   β = 1 + t², s = sinh x, ρ = √(1 + s²); for |x| > 22 tanh is ±1 to double precision and the imaginary part is
 *   4 sin y cos y e^(−2|x|). This stays finite where the textbook quotient overflows (mathjs: tan(1 + 400i) has a
 *   NaN part). tan z = −i tanh(iz).
 * - atan z = ½ atan2(2x, 1 − x² − y²) + i/4 · log((x² + (1 + y)²)/(x² + (1 − y)²)) (Abramowitz & Stegun 4.4.39
 *   rearranged; the logarithm through log1p of a non-negative argument), with the cuts on the imaginary axis
 *   beyond ±i; atan(±i) = ±i∞ as mathjs.
 * - sin, cos, sinh, cosh: the addition formulas (e.g. sin(x+iy) = sin x cosh y + i cos x sinh y).
 * - sign z = z/|z|, 0 at 0, and the direction of an infinite z (sign(−∞ + 0i) = −1, as mathjs for reals). abs is
 *   Math.hypot (no overflow or underflow for extreme parts, unlike squaring them) and is emitted inline.
 */

export const complexOut = new Float64Array(2);
const out = complexOut;

const halfPi = Math.PI / 2;

export function cexp(x: number, y: number): void {
  const e = Math.exp(x);
  out[0] = e * Math.cos(y);
  out[1] = e * Math.sin(y);
}

export function clog(x: number, y: number): void {
  x += 0;
  y += 0;
  out[0] = y === 0 ? Math.log(Math.abs(x)) : Math.log(Math.hypot(x, y));
  out[1] = Math.atan2(y, x);
}

export function csqrt(x: number, y: number): void {
  x += 0;
  y += 0;
  if (y === 0) {
    if (x >= 0) {
      out[0] = Math.sqrt(x);
      out[1] = 0;
    } else {
      out[0] = 0;
      out[1] = Math.sqrt(-x);
    }
    return;
  }
  const m = Math.hypot(x, y);
  if (x >= 0) {
    const r = Math.sqrt(0.5 * m + 0.5 * x);
    out[0] = r;
    out[1] = y / (2 * r);
  } else {
    const r = Math.sqrt(0.5 * m - 0.5 * x);
    out[0] = Math.abs(y) / (2 * r);
    out[1] = y < 0 ? -r : r;
  }
}

export function csin(x: number, y: number): void {
  out[0] = Math.sin(x) * Math.cosh(y);
  out[1] = Math.cos(x) * Math.sinh(y);
}

export function ccos(x: number, y: number): void {
  out[0] = Math.cos(x) * Math.cosh(y);
  out[1] = -Math.sin(x) * Math.sinh(y);
}

export function csinh(x: number, y: number): void {
  out[0] = Math.sinh(x) * Math.cos(y);
  out[1] = Math.cosh(x) * Math.sin(y);
}

export function ccosh(x: number, y: number): void {
  out[0] = Math.cosh(x) * Math.cos(y);
  out[1] = Math.sinh(x) * Math.sin(y);
}

export function ctanh(x: number, y: number): void {
  if (Math.abs(x) > 22) {
    out[0] = x > 0 ? 1 : -1;
    out[1] = 4 * Math.sin(y) * Math.cos(y) * Math.exp(-2 * Math.abs(x));
    return;
  }
  const t = Math.tan(y);
  const beta = 1 + t * t;
  const s = Math.sinh(x);
  const rho = Math.sqrt(1 + s * s);
  const den = 1 + beta * s * s;
  out[0] = (beta * rho * s) / den;
  out[1] = t / den;
}

export function ctan(x: number, y: number): void {
  ctanh(-y, x);
  const u = out[0];
  out[0] = out[1];
  out[1] = -u;
}

export function catan(x: number, y: number): void {
  x += 0;
  y += 0;
  if (y === 0) {
    out[0] = Math.atan(x);
    out[1] = 0;
    return;
  }
  const m = Math.max(Math.abs(x), Math.abs(y));
  if (m > 1e150) {
    // atan z = ±π/2 − 1/z + O(z⁻³); the scaled form keeps x² + y² from overflowing.
    out[0] = x >= 0 ? halfPi : -halfPi;
    if (m === Infinity) {
      out[1] = 0;
    } else {
      const xs = x / m;
      const ys = y / m;
      out[1] = ys / (xs * xs + ys * ys) / m;
    }
    return;
  }
  out[0] = 0.5 * Math.atan2(2 * x, (1 - y) * (1 + y) - x * x);
  // ¼ log(N/D) with N = x² + (1+y)², D = x² + (1−y)², as ¼ log1p(4y/D) or −¼ log1p(−4y/N): the argument of
  // log1p is then ≥ 0, so there is no cancellation near y = 0 (N ≈ D) nor near y = ±1 (N or D ≈ 0).
  out[1] = y >= 0
    ? 0.25 * Math.log1p((4 * y) / (x * x + (1 - y) * (1 - y)))
    : -0.25 * Math.log1p((-4 * y) / (x * x + (1 + y) * (1 + y)));
}

export function cdiv(a: number, b: number, c: number, d: number): void {
  if (d === 0) {
    if (c === 0) {
      if ((a === 0 && b === 0) || a !== a || b !== b) {
        out[0] = NaN;
        out[1] = NaN;
      } else {
        out[0] = a === 0 ? 0 : a / c;
        out[1] = b === 0 ? 0 : b / c;
      }
      return;
    }
    out[0] = a / c;
    out[1] = b / c;
    return;
  }
  if (Math.abs(c) >= Math.abs(d)) {
    const r = d / c;
    const den = c + d * r;
    out[0] = (a + b * r) / den;
    out[1] = (b - a * r) / den;
  } else {
    const r = c / d;
    const den = c * r + d;
    out[0] = (a * r + b) / den;
    out[1] = (b * r - a) / den;
  }
}

/** z^n for an integer n by repeated squaring; n < 0 inverts at the end. */
function cpowInteger(a: number, b: number, n: number): void {
  let k = Math.abs(n);
  let haveResult = false;
  let rr = 1;
  let ri = 0;
  let br = a;
  let bi = b;
  while (k > 0) {
    if (k % 2 === 1) {
      if (haveResult) {
        const t = rr * br - ri * bi;
        ri = rr * bi + ri * br;
        rr = t;
      } else {
        rr = br;
        ri = bi;
        haveResult = true;
      }
    }
    k = Math.floor(k / 2);
    if (k > 0) {
      const t = (br - bi) * (br + bi);
      bi = 2 * br * bi;
      br = t;
    }
  }
  if (n < 0) {
    cdiv(1, 0, rr, ri);
    return;
  }
  out[0] = rr;
  out[1] = ri;
}

export function cpow(a: number, b: number, c: number, d: number): void {
  if (d === 0 && Number.isInteger(c) && Math.abs(c) <= 2147483648) {
    cpowInteger(a, b, c);
    return;
  }
  if (b === 0 && d === 0 && a >= 0) {
    out[0] = Math.pow(a, c);
    out[1] = 0;
    return;
  }
  if (a === 0 && b === 0) {
    const zero = c > 0;
    out[0] = zero ? 0 : NaN;
    out[1] = zero ? 0 : NaN;
    return;
  }
  clog(a, b);
  const lr = out[0];
  const li = out[1];
  const e = Math.exp(c * lr - d * li);
  const phase = c * li + d * lr;
  out[0] = e * Math.cos(phase);
  out[1] = e * Math.sin(phase);
}

/** Unit vector of an infinite part: ±1 for an infinite part, 0 for a finite one. */
const unitOfInfinite = (x: number): number => (x === Infinity ? 1 : x === -Infinity ? -1 : 0);

export function csign(x: number, y: number): void {
  if (x === 0 && y === 0) {
    out[0] = 0;
    out[1] = 0;
    return;
  }
  let m = Math.hypot(x, y);
  if (m < 1e-290) {
    // Subnormal parts have few significant bits: scale up (exactly, by a power of two) first.
    x *= 2 ** 600;
    y *= 2 ** 600;
    m = Math.hypot(x, y);
  } else if (m === Infinity) {
    if (Math.abs(x) === Infinity || Math.abs(y) === Infinity) {
      // The direction of an infinite value: (±∞, y) points along the real axis, (±∞, ±∞) along a diagonal.
      x = unitOfInfinite(x);
      y = unitOfInfinite(y);
    } else {
      // Both parts finite but |z| overflows: scale first.
      const scale = Math.max(Math.abs(x), Math.abs(y));
      x /= scale;
      y /= scale;
    }
    m = Math.hypot(x, y);
  }
  out[0] = x / m;
  out[1] = y / m;
}
