// Citations of books and papers in this file (authors, years, sections) are given from memory.
import { describe, expect, it } from 'vitest';
import {
  integrateAdaptive,
  integrateAdaptiveArray,
  QuadratureInputError,
} from '../../../src-core/numerics/quadrature/index';
import type { AdaptiveResult, ScalarIntegrand } from '../../../src-core/numerics/quadrature/index';
import { CancellationSource, CancelledError } from '../../../src-core/util/cancellation';

/** Converged, within `tol` of the closed form, and the estimate bounds the true error. */
function expectHonest(r: AdaptiveResult, re: number, im = 0, tol = 1e-10): void {
  const trueError = Math.hypot(r.value.re - re, r.value.im - im);
  expect(r.converged).toBe(true);
  expect(r.status).toBe('converged');
  expect(trueError).toBeLessThanOrEqual(r.error);
  expect(trueError).toBeLessThan(tol);
  expect(r.error).toBeLessThan(tol);
}

describe('integrateAdaptive: closed forms with honest error estimates', () => {
  it('∫_0^1 x^(−1/2) dx = 2 to 1e-10 (endpoint singularity handled by bisection)', () => {
    const r = integrateAdaptive((x) => 1 / Math.sqrt(x), 0, 1, { absTol: 1e-11, relTol: 0 });
    expectHonest(r, 2);
    expect(r.evaluations).toBeLessThan(20_000);
  });

  it('∫_0^π sin x dx = 2', () => {
    const r = integrateAdaptive(Math.sin, 0, Math.PI);
    expectHonest(r, 2, 0, 1e-13);
  });

  it('∫_0^{2π} e^{ix} dx = 0 (complex integrand)', () => {
    const r = integrateAdaptive((x) => ({ re: Math.cos(x), im: Math.sin(x) }), 0, 2 * Math.PI);
    expectHonest(r, 0, 0, 1e-12);
  });

  it('∫_0^1 |x − 1/3| dx = 5/18: with the kink as a breakpoint the first two panels already converge', () => {
    const f = (x: number) => Math.abs(x - 1 / 3);
    const withBreak = integrateAdaptive(f, 0, 1, { breakpoints: [1 / 3] });
    expectHonest(withBreak, 5 / 18, 0, 1e-14);
    expect(withBreak.evaluations).toBe(30);
    const without = integrateAdaptive(f, 0, 1);
    expectHonest(without, 5 / 18);
    expect(without.evaluations).toBeGreaterThan(withBreak.evaluations);
  });

  // Each with its closed form (common practice).
  const battery: [string, ScalarIntegrand, number, number, number, number?][] = [
    ['e^x on [0, 1] = e − 1', Math.exp, 0, 1, Math.E - 1],
    ['1/(1 + 25x²) on [−1, 1] = (2/5) atan 5', (x) => 1 / (1 + 25 * x * x), -1, 1, (2 / 5) * Math.atan(5)],
    ['log x on [0, 1] = −1', Math.log, 0, 1, -1],
    ['√x on [0, 1] = 2/3', Math.sqrt, 0, 1, 2 / 3],
    ['cos 50x on [0, 1] = sin(50)/50', (x) => Math.cos(50 * x), 0, 1, Math.sin(50) / 50],
    ['x^(−0.9) on [0, 1] = 10', (x) => x ** -0.9, 0, 1, 10],
    ['|x|^(1/3) on [−1, 2] = (3/4)(1 + 2^(4/3))', (x) => Math.cbrt(Math.abs(x)), -1, 2, 0.75 * (1 + 2 ** (4 / 3))],
    ['e^{3ix} on [0, 1] = (e^{3i} − 1)/(3i)', (x) => ({ re: Math.cos(3 * x), im: Math.sin(3 * x) }), 0, 1, Math.sin(3) / 3, (1 - Math.cos(3)) / 3],
    ['x log|x − 0.2| on [0, 1]', (x) => x * Math.log(Math.abs(x - 0.2)), 0, 1, xLogClosedForm()],
  ];
  for (const [name, f, a, b, re, im] of battery) {
    it(`estimate is honest: ${name}`, () => {
      const r = integrateAdaptive(f, a, b, { absTol: 1e-11, relTol: 1e-11 });
      expectHonest(r, re, im ?? 0, 1e-9);
    });
  }

  it('a reversed interval negates the value', () => {
    const f = (x: number) => x * x;
    const r = integrateAdaptive(f, 2, -1);
    expectHonest(r, -3);
    expect(integrateAdaptive(f, 1, 1)).toMatchObject({ value: { re: 0, im: 0 }, error: 0, evaluations: 0, converged: true });
  });
});

/** ∫_0^1 x log|x − c| dx with c = 0.2: substitute y = x − c, ∫ (y + c) log|y| over [−c, 1 − c]. */
function xLogClosedForm(): number {
  const c = 0.2;
  // ∫ y log|y| = y²/2 log|y| − y²/4, ∫ log|y| = y log|y| − y
  const F = (y: number) => (y * y * Math.log(Math.abs(y))) / 2 - (y * y) / 4 + c * (y * Math.log(Math.abs(y)) - y);
  return F(1 - c) - F(-c);
}

describe('integrateAdaptive: non-convergence is reported as data', () => {
  it('an evaluation budget too small gives converged: false with the best value and an honest estimate', () => {
    const r = integrateAdaptive((x) => x ** -0.9, 0, 1, { maxEvaluations: 300 });
    expect(r.converged).toBe(false);
    expect(r.status).toBe('maxEvaluations');
    expect(r.evaluations).toBeLessThanOrEqual(300);
    expect(Math.abs(r.value.re - 10)).toBeLessThanOrEqual(r.error);
  });

  it('a non-finite integrand value stops with status nonFiniteValue and the abscissa', () => {
    const r = integrateAdaptive((x) => 1 / x, -1, 1); // the centre of the first panel is 0
    expect(r.converged).toBe(false);
    expect(r.status).toBe('nonFiniteValue');
    expect(r.nonFiniteAt).toBe(0);
  });

  it('a jump that bisection cannot resolve in floating point ends with roundoffLimit, not a loop', () => {
    const r = integrateAdaptive((x) => (x < Math.SQRT1_2 ? 0 : 1e6), 0, 1, { absTol: 1e-30, relTol: 0 });
    expect(r.converged).toBe(false);
    expect(['roundoffLimit', 'maxEvaluations']).toContain(r.status);
    expect(Math.abs(r.value.re - 1e6 * (1 - Math.SQRT1_2))).toBeLessThanOrEqual(r.error);
  });

  it('a cancelled token stops the computation', () => {
    const source = new CancellationSource();
    source.cancel();
    expect(() => integrateAdaptive((x) => 1 / Math.sqrt(x), 0, 1, { token: source.token })).toThrow(CancelledError);
  });
});

describe('integrateAdaptiveArray', () => {
  it('gives the same result as the pointwise form and fills whole panels per call', () => {
    const sizes: number[] = [];
    const r = integrateAdaptiveArray(
      (xs, re, im) => {
        sizes.push(xs.length);
        for (let i = 0; i < xs.length; i++) {
          re[i] = Math.cos(xs[i]) / Math.sqrt(xs[i]);
          im[i] = xs[i];
        }
      },
      0,
      1,
      { breakpoints: [0.5] },
    );
    const p = integrateAdaptive((x) => ({ re: Math.cos(x) / Math.sqrt(x), im: x }), 0, 1, { breakpoints: [0.5] });
    expect(r.value.re).toBe(p.value.re);
    expect(r.value.im).toBe(p.value.im);
    expect(r.evaluations).toBe(p.evaluations);
    expect(sizes[0]).toBe(30);
    for (const s of sizes) expect(s % 15).toBe(0);
    expect(r.value.im).toBeCloseTo(0.5, 14);
  });

  it('zeroes outIm before each call, so a real integrand may ignore it', () => {
    const r = integrateAdaptiveArray((xs, re) => xs.forEach((x, i) => (re[i] = x)), 0, 2);
    expect(r.value).toEqual({ re: 2, im: 0 });
  });
});

describe('integrateAdaptive: input checks', () => {
  it('rejects non-finite ends, breakpoints outside, bad tolerances and budgets', () => {
    expect(() => integrateAdaptive(Math.sin, 0, Infinity)).toThrow(QuadratureInputError);
    expect(() => integrateAdaptive(Math.sin, 0, 1, { breakpoints: [2] })).toThrow(/breakpoint 2/);
    expect(() => integrateAdaptive(Math.sin, 0, 1, { absTol: 0, relTol: 0 })).toThrow(/not both zero/);
    expect(() => integrateAdaptive(Math.sin, 0, 1, { absTol: -1 })).toThrow(/absTol/);
    expect(() => integrateAdaptive(Math.sin, 0, 1, { maxEvaluations: 10 })).toThrow(/maxEvaluations/);
  });
});
