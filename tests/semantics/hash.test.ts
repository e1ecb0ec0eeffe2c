/**
 * The hash of a kernel fingerprints its mathematics (domain and resolved expression), so that cached results survive
 * edits that change nothing and are recomputed after edits that do. Each case is a file before and after an edit,
 * and whether the hash of kernel `k` stays the same.
 */
import { describe, expect, it } from 'vitest';
import { analyzeText } from '../../src-core/analysis/analyze';

function hashOf(text: string, name = 'k'): string {
  const r = analyzeText(text, { numerics: false });
  expect(r.diagnostics.filter((d) => d.severity === 'error'), text).toEqual([]);
  const kernel = r.model.kernels.find((x) => x.name === name);
  expect(kernel?.hash, text).toMatch(/^[0-9a-f]{28}$/);
  return kernel!.hash!;
}

const base = `domain [0, 1]
const rate = 2
fn decay(x) = exp(-rate * x)
kernel k(t, s) = decay(abs(t - s)) + t * s
`;

type Case = readonly [what: string, after: string];

const unchanged: Case[] = [
  ['changing spaces, blank lines and line breaks', `domain [ 0 , 1 ]

const   rate=2
fn decay( x )=exp( -rate*x )
kernel k( t, s ) = decay(abs(t - s))
    + t * s
`],
  ['adding comments', `# a comment
domain [0, 1]   # the rod
const rate = 2  # per metre
fn decay(x) = exp(-rate * x)
# the kernel
kernel k(t, s) = decay(abs(t - s)) + t * s
  # trailing note
`],
  ['renaming the constant (same value)', base.replace(/rate/g, 'speed')],
  ['renaming the helper and its parameter', base.replace(/decay/g, 'fade').replace('(x) = exp(-rate * x)', '(u) = exp(-rate * u)')],
  ['renaming the kernel’s variables', base.replace('k(t, s) = decay(abs(t - s)) + t * s', 'k(x, y) = decay(abs(x - y)) + x * y')],
  ['writing the same value differently', base.replace('const rate = 2', 'const rate = 4 / 2')],
  ['computing the constant from others', base.replace('const rate = 2', 'const rate = half * 4\nconst half = 0.5')],
  ['adding redundant parentheses and a unary plus', base.replace('+ t * s', '+ (+(t) * (s))')],
  ['writing the default domain as the kernel’s own', base.replace('domain [0, 1]\n', '').replace('k(t, s) =', 'k(t, s) on [0, 1] =')],
  ['writing the domain ends as expressions', base.replace('domain [0, 1]', 'domain [rate - 2, rate / 2]')],
  ['reordering the declarations', `kernel k(t, s) = decay(abs(t - s)) + t * s
fn decay(x) = exp(-rate * x)
const rate = 2
domain [0, 1]
`],
  ['adding another kernel', `${base}kernel other(t, s) = k(s, t) * 2\n`],
  ['adding a claim', `${base}  expect hermitian, norm <= 3\n`],
  ['adding an unused constant and helper', `${base}const spare = 7\nfn unused(x) = x\n`],
];

const changed: Case[] = [
  ['the constant’s value', base.replace('const rate = 2', 'const rate = 3')],
  ['the constant’s value by one unit in the last place', base.replace('const rate = 2', 'const rate = 2.0000000000000004')],
  ['the domain', base.replace('domain [0, 1]', 'domain [0, 2]')],
  ['the kernel’s own domain', base.replace('k(t, s) =', 'k(t, s) on [-1, 1] =')],
  ['the helper’s body', base.replace('exp(-rate * x)', 'exp(-rate * x * x)')],
  ['the variables swapped', base.replace('decay(abs(t - s)) + t * s', 'decay(abs(t - s)) + t * t')],
  ['an operator', base.replace('+ t * s', '- t * s')],
  ['the helper inlined (its argument is no longer bound once)', base.replace('decay(abs(t - s))', 'exp(-rate * abs(t - s))')],
];

describe('kernel hash', () => {
  const before = hashOf(base);

  for (const [what, after] of unchanged) {
    it(`stays the same after ${what}`, () => expect(hashOf(after)).toBe(before));
  }
  for (const [what, after] of changed) {
    it(`changes with ${what}`, () => expect(hashOf(after)).not.toBe(before));
  }

  it('tells a constant of minus zero from one of zero (1 / -0 is -∞, 1 / 0 is +∞)', () => {
    const kernel = (z: string) => `domain [0, 1]\nconst zero = ${z}\nkernel k(t, s) = exp(1 / (zero * (t + 2))) + t\n`;
    expect(hashOf(kernel('-0'))).not.toBe(hashOf(kernel('0')));
  });

  it('is the same for a kernel calling a helper and one calling a kernel with the same body', () => {
    const text = `domain [0, 1]
fn g(a, b) = min(a, b) * exp(a - b)
kernel h(a, b) = min(a, b) * exp(a - b)
kernel viaHelper(t, s) = g(t, s) + 2 * g(s, t)
kernel viaKernel(t, s) = h(t, s) + 2 * h(s, t)
`;
    expect(hashOf(text, 'viaHelper')).toBe(hashOf(text, 'viaKernel'));
  });

  it('differs between kernels of one file that differ', () => {
    const text = `${base}kernel swapped(t, s) = decay(abs(s - t)) + s * t\n`;
    expect(hashOf(text, 'swapped')).not.toBe(hashOf(text, 'k'));
  });

  it('is absent when the kernel has an error or no domain', () => {
    const r = analyzeText('kernel k(t, s) = t\nkernel bad(t, s) on [0, 1] = t + nope\n', { numerics: false });
    expect(r.model.kernels.map((k) => k.hash)).toEqual([null, null]);
  });
});
