/**
 * Declared claims against findings: a claim replaces the finding it covers, severities are settings (failed claims
 * excepted), and properties that hold but are not declared get one hint whose fixes append the claims.
 */
import { describe, expect, it } from 'vitest';
import { analyse } from './helpers';

describe('a declared claim replaces the finding it covers', () => {
  it('unbounded: the bounded claim fails instead of the warning', () => {
    const r = analyse('kernel a(t, s) = 1 / abs(t - s)\n  expect bounded\nkernel b(t, s) = 1 / abs(t - s)\n  expect hilbert-schmidt\nkernel c(t, s) = 1 / abs(t - s)');
    expect(r.codes('a')).toEqual(['KW604']);
    expect(r.codes('b')).toEqual(['KW605']);
    expect(r.codes('c')).toEqual(['KW510']);
  });
  it('not Hermitian: the claim fails on its own range instead of the information on the name', () => {
    const r = analyse('kernel a(t, s) = t * s^2\n  expect hermitian, continuous, rank = 1');
    const d = r.diagnostics('a');
    expect(d.map((x) => x.code)).toEqual(['KW601']);
    expect(r.text.slice(d[0].range.start, d[0].range.end)).toBe('hermitian');
    expect(d[0].fixes?.[0].kind).toBe('symmetrize');
  });
  it('a jump: the continuous claim fails instead of the information', () => {
    const r = analyse('kernel a(t, s) = t < s ? i : -i\n  expect hermitian, hilbert-schmidt, continuous');
    expect(r.codes('a')).toContain('KW603');
    expect(r.codes('a')).not.toContain('KW520');
  });
});

describe('settings', () => {
  it('severities by name or code, or off', () => {
    const body = 'kernel a(t, s) = exp(-abs(t - s))';
    expect(analyse(body, { severities: { kink: 'hint' } }).diagnostics('a').find((d) => d.code === 'KW521')?.severity).toBe('hint');
    expect(analyse(body, { severities: { KW521: 'off', 'undeclared-property': 'off' } }).codes('a')).toEqual([]);
  });
});

describe('properties that hold but are not declared', () => {
  it('are named once, without the ones implied by declared or suggested claims', () => {
    const r = analyse('kernel a(t, s) = exp(-(t - s)^2)\nkernel b(t, s) = exp(-(t - s)^2)\n  expect positive\nkernel c(t, s) = exp(-(t - s)^2)\n  expect hermitian, positive, continuous');
    expect(r.diagnostics('a').find((d) => d.code === 'KW610')!.message).toContain('also satisfies “positive” and “continuous”;');
    expect(r.diagnostics('b').find((d) => d.code === 'KW610')!.message).toContain('also satisfies “continuous”;');
    expect(r.codes('c')).toEqual([]);
  });
  it('include a finite rank only when it is certain', () => {
    const r = analyse('kernel a(t, s) = 1 + t * s\n  expect positive, continuous\nkernel b(t, s) = exp(t * s)\n  expect positive, continuous');
    expect(r.diagnostics('a').find((d) => d.code === 'KW610')!.message).toContain('“rank = 2”');
    expect(r.codes('b')).toEqual([]);
  });
  it('are not suggested for an unbounded kernel', () => {
    expect(analyse('kernel a(t, s) = 1 / abs(t - s)').codes('a')).not.toContain('KW610');
  });
});
