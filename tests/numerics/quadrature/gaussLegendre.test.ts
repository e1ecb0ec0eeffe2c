import { describe, expect, it } from 'vitest';
import { all, create } from 'mathjs';
import { gaussLegendre, mapRule, QuadratureInputError } from '../../../src-core/numerics/quadrature/index';

/** ∫_{-1}^{1} x^k dx = 2/(k+1) for even k, 0 for odd k. */
const monomialIntegral = (k: number): number => (k % 2 === 0 ? 2 / (k + 1) : 0);

function checkMonomials(n: number, degrees: number[]): void {
  const { nodes, weights } = gaussLegendre(n);
  for (const k of degrees) {
    let s = 0;
    let scale = 0;
    for (let i = 0; i < n; i++) {
      const t = weights[i] * nodes[i] ** k;
      s += t;
      scale += Math.abs(t);
    }
    expect(Math.abs(s - monomialIntegral(k)), `n = ${n}, x^${k}`).toBeLessThanOrEqual(4e-16 * Math.max(n, 4) * scale);
  }
}

describe('gaussLegendre: published values', () => {
  // Abramowitz & Stegun, Handbook of Mathematical Functions, 1964, Table 25.4 (values printed to 15 decimals).
  const table: Record<number, [number, number][]> = {
    2: [[0.577350269189626, 1.0]],
    3: [
      [0.0, 0.888888888888889],
      [0.774596669241483, 0.555555555555556],
    ],
    5: [
      [0.0, 0.568888888888889],
      [0.538469310105683, 0.478628670499366],
      [0.906179845938664, 0.236926885056189],
    ],
  };
  for (const [nText, rows] of Object.entries(table)) {
    const n = Number(nText);
    it(`n = ${n} matches A&S Table 25.4 to the printed digits`, () => {
      const { nodes, weights } = gaussLegendre(n);
      for (const [x, w] of rows) {
        const i = nodes.findIndex((v) => Math.abs(v - x) < 1e-6);
        const j = nodes.findIndex((v) => Math.abs(v + x) < 1e-6);
        expect(i).toBeGreaterThanOrEqual(0);
        expect(Math.abs(nodes[i] - x)).toBeLessThan(1e-15);
        expect(Math.abs(nodes[j] + x)).toBeLessThan(1e-15);
        expect(Math.abs(weights[i] - w)).toBeLessThan(1e-15);
        expect(weights[j]).toBe(weights[i]);
      }
    });
  }

  it('matches the closed forms for n = 2, 3, 5 (common practice)', () => {
    const r2 = gaussLegendre(2);
    expect(r2.nodes[1]).toBeCloseTo(1 / Math.sqrt(3), 15);
    const r3 = gaussLegendre(3);
    expect(r3.nodes[2]).toBeCloseTo(Math.sqrt(3 / 5), 15);
    expect(r3.weights[1]).toBeCloseTo(8 / 9, 15);
    expect(r3.weights[2]).toBeCloseTo(5 / 9, 15);
    const r5 = gaussLegendre(5);
    const s = 2 * Math.sqrt(10 / 7);
    expect(r5.nodes[3]).toBeCloseTo(Math.sqrt(5 - s) / 3, 15);
    expect(r5.nodes[4]).toBeCloseTo(Math.sqrt(5 + s) / 3, 15);
    expect(r5.weights[2]).toBeCloseTo(128 / 225, 15);
    expect(r5.weights[3]).toBeCloseTo((322 + 13 * Math.sqrt(70)) / 900, 15);
    expect(r5.weights[4]).toBeCloseTo((322 - 13 * Math.sqrt(70)) / 900, 15);
  });
});

describe('gaussLegendre: invariants', () => {
  it('is exact for x^k, k ≤ 2n − 1, for n = 1..60', () => {
    for (let n = 1; n <= 60; n++) {
      checkMonomials(n, Array.from({ length: 2 * n }, (_, k) => k));
    }
  });

  it('misses ∫ x^(2n) by exactly the Gauss remainder 2^(2n+1)(n!)^4 / ((2n+1)((2n)!)^2)', () => {
    // Remainder of the Gauss–Legendre rule (A&S §25.4, quoted from memory) with f^(2n) = (2n)!.
    const factorial = (k: number): number => (k <= 1 ? 1 : k * factorial(k - 1));
    for (const n of [1, 2, 3, 5, 8, 10]) {
      const { nodes, weights } = gaussLegendre(n);
      let s = 0;
      for (let i = 0; i < n; i++) s += weights[i] * nodes[i] ** (2 * n);
      const remainder = (2 ** (2 * n + 1) * factorial(n) ** 4) / ((2 * n + 1) * factorial(2 * n) ** 2);
      expect(2 / (2 * n + 1) - s).toBeCloseTo(remainder, 14);
      expect(Math.abs((2 / (2 * n + 1) - s) / remainder - 1)).toBeLessThan(1e-9);
    }
  });

  it('is exact for spot monomials at n = 500', () => {
    checkMonomials(500, [0, 1, 2, 10, 101, 400, 998, 999]);
  });

  it('has ascending symmetric nodes in (-1, 1), positive weights summing to 2', () => {
    for (const n of [1, 2, 3, 7, 64, 257, 1000]) {
      const { nodes, weights } = gaussLegendre(n);
      let sum = 0;
      for (let i = 0; i < n; i++) {
        expect(nodes[i]).toBeGreaterThan(-1);
        expect(nodes[i]).toBeLessThan(1);
        if (i > 0) expect(nodes[i]).toBeGreaterThan(nodes[i - 1]);
        expect(nodes[i] + nodes[n - 1 - i]).toBe(0);
        expect(weights[i]).toBe(weights[n - 1 - i]);
        expect(weights[i]).toBeGreaterThan(0);
        sum += weights[i];
      }
      expect(Math.abs(sum - 2)).toBeLessThan(1e-14);
    }
  });

  it('returns copies: changing a returned rule leaves the cache intact', () => {
    const first = gaussLegendre(4);
    first.nodes[0] = 42;
    first.weights[0] = 42;
    const second = gaussLegendre(4);
    expect(second.nodes[0]).toBeCloseTo(-0.861136311594053, 15); // A&S Table 25.4, n = 4
    expect(second.weights[0]).toBeCloseTo(0.347854845137454, 15);
  });

  it('rejects bad n with a message naming it', () => {
    for (const n of [0, -1, 2.5, Number.NaN, 1e9]) {
      expect(() => gaussLegendre(n)).toThrow(QuadratureInputError);
    }
    expect(() => gaussLegendre(0)).toThrow(/number of points n/);
  });
});

describe('gaussLegendre: full double accuracy at n = 1000 against a 40-digit reference', () => {
  // Reference: each node is refined by Newton's method on Bonnet's recurrence in 40-digit arithmetic
  // (mathjs BigNumber), and the weight 2/((1 − x²)P_n'(x)²) is evaluated there.
  const m = create(all, { number: 'BigNumber', precision: 40 });
  const big = (v: number) => m.bignumber(v.toPrecision(21));
  function reference(n: number, start: number): { x: number; w: number } {
    let x = big(start);
    const one = m.bignumber(1);
    for (let iter = 0; ; iter++) {
      let p0 = m.bignumber(1);
      let p1 = x;
      for (let k = 1; k < n; k++) {
        const p2 = m.divide(
          m.subtract(m.multiply(m.multiply(m.bignumber(2 * k + 1), x), p1), m.multiply(m.bignumber(k), p0)),
          m.bignumber(k + 1),
        ) as typeof x;
        p0 = p1;
        p1 = p2;
      }
      const oneMinus = m.subtract(one, m.multiply(x, x));
      const dp = m.divide(m.multiply(m.bignumber(n), m.subtract(p0, m.multiply(x, p1))), oneMinus) as typeof x;
      if (iter === 2) {
        const w = m.divide(m.bignumber(2), m.multiply(oneMinus, m.multiply(dp, dp))) as typeof x;
        return { x: m.number(x) as number, w: m.number(w) as number };
      }
      x = m.subtract(x, m.divide(p1, dp)) as typeof x;
    }
  }

  it('nodes within 1.2e-16 and weights within 1.5e-14 relative, including the ones crowding at ±1', () => {
    const n = 1000;
    const { nodes, weights } = gaussLegendre(n);
    for (const i of [0, 1, 2, 5, 20, 100, 333, 499, 500, 998, 999]) {
      const ref = reference(n, nodes[i]);
      expect(Math.abs(nodes[i] - ref.x), `node ${i}`).toBeLessThanOrEqual(1.2e-16);
      expect(Math.abs(weights[i] - ref.w) / ref.w, `weight ${i}`).toBeLessThan(1.5e-14);
    }
  });
});

describe('mapRule', () => {
  it('maps to [a, b]: ∫_1^3 x^3 dx = 20 and the weights sum to b − a', () => {
    const r = mapRule(gaussLegendre(3), 1, 3);
    let s = 0;
    let sw = 0;
    for (let i = 0; i < 3; i++) {
      s += r.weights[i] * r.nodes[i] ** 3;
      sw += r.weights[i];
    }
    expect(s).toBeCloseTo(20, 13);
    expect(sw).toBeCloseTo(2, 15);
    expect(r.nodes[0]).toBeGreaterThan(1);
    expect(r.nodes[2]).toBeLessThan(3);
  });

  it('rejects infinite ends', () => {
    expect(() => mapRule(gaussLegendre(2), 0, Infinity)).toThrow(QuadratureInputError);
  });
});
