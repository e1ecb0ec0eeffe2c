/** Results are cached by the hash of a kernel's resolved definition; long analyses stop when cancelled. */
import { describe, expect, it } from 'vitest';
import { analyzeText, CancellationSource, CancelledError, clearSpectralCache } from '@kernwright/core';

const file = (lengthScale: string) => `domain [0, 1]
const ell = ${lengthScale}
kernel a(t, s) = exp(-abs(t - s)/ell)
kernel b(t, s) = min(t, s)   # untouched by the edit
`;

describe('spectral cache', () => {
  it('recomputes only the kernel whose resolved definition changed', () => {
    clearSpectralCache();
    const first = analyzeText(file('0.3'));
    const second = analyzeText(file('0.4'));
    expect(second.kernels[1].spectrum).toBe(first.kernels[1].spectrum); // same object: taken from the cache
    expect(second.kernels[0].spectrum).not.toBe(first.kernels[0].spectrum);
    expect(second.kernels[0].hash).not.toBe(first.kernels[0].hash);
  });

  it('ignores edits that do not change the mathematics (comments, spacing, a renamed constant)', () => {
    clearSpectralCache();
    const first = analyzeText(file('0.3'));
    const renamed = analyzeText(file('0.3').replace(/ell/g, 'scale').replace('exp(-abs', 'exp( - abs') + '# a comment\n');
    expect(renamed.kernels[0].hash).toBe(first.kernels[0].hash);
    expect(renamed.kernels[0].spectrum).toBe(first.kernels[0].spectrum);
  });
});

describe('cancellation', () => {
  it('throws CancelledError when the token is already set, and caches nothing', () => {
    clearSpectralCache();
    const source = new CancellationSource();
    source.cancel();
    expect(() => analyzeText('domain [0, 1]\nkernel k(t, s) = log(abs(t - s))', {}, source.token)).not.toThrow();
    const r = analyzeText('domain [0, 1]\nkernel k(t, s) = log(abs(t - s))', {}, source.token);
    expect(r.kernels[0].spectrum).toBeNull(); // skipped: cancelled before it started
    let calls = 0;
    const token = { get isCancellationRequested() { calls++; return calls > 3; } };
    expect(() => analyzeText('domain [0, 1]\nkernel k2(t, s) = abs(t - s)^(-0.25)', {}, token)).toThrow(CancelledError);
    const again = analyzeText('domain [0, 1]\nkernel k2(t, s) = abs(t - s)^(-0.25)');
    expect(again.kernels[0].spectrum).not.toBeNull();
  });
});
