/**
 * The worker's idle-time warm-up set: every step is a valid kernel file whose kernel gets a spectrum (so each step
 * really runs the numerical path it is there to warm), and the steps cover the engine's solver paths.
 */
import { describe, expect, it } from 'vitest';
import { analyzeText } from '@kernwright/core';
import { runWarmUpStep, warmUpSteps, warmUpText } from '../../server/src/lsp/warmUp';

describe('warm-up steps', () => {
  it('are valid files whose kernel is analysed, with a different text each round', () => {
    const texts = new Set<string>();
    for (let step = 0; step < warmUpSteps; step++) texts.add(warmUpText(step));
    expect(texts.size).toBe(warmUpSteps);
    const kinds = new Set<string>();
    for (let step = 0; step < 8; step++) {
      const result = analyzeText(warmUpText(step), { timeBudgetMs: 40, maxResolution: 192 });
      expect(result.diagnostics.filter((d) => d.code.startsWith('KW1') || d.code.startsWith('KW2') || d.code.startsWith('KW3'))).toEqual([]);
      const k = result.kernels[0];
      expect(k.spectrum).not.toBeNull();
      kinds.add(`${k.complex ? 'complex' : 'real'}-${k.hermitian?.holds ? 'hermitian' : 'general'}`);
      expect(() => runWarmUpStep(step)).not.toThrow();
    }
    expect(kinds).toEqual(new Set(['real-hermitian', 'real-general', 'complex-hermitian']));
  });
});
