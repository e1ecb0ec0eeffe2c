/**
 * Fixing whole files (src-core/review/fixLoop.ts) with the fixes the analysis offers: several passes until nothing
 * is left, idempotence, line endings, `--only`, and the refusals that keep a file untouched.
 */
import { describe, expect, it } from 'vitest';
import { analyzeText, fixText, type Diagnostic, type FixOutcome } from '@kernwright/core';

const analyze = (text: string) => analyzeText(text, { timeBudgetMs: 20_000 }).diagnostics;

function fixed(outcome: FixOutcome): Extract<FixOutcome, { ok: true }> {
  if (!outcome.ok) throw new Error(outcome.reason);
  return outcome;
}

const messy = [
  '# Invented test scenario: three slips in one file.',
  'domain [1, 0]',
  'const width = 0.3',
  'kernel k(t, s) = exp(-abs(t - s) / widht)',
  'kernel m(t, s) on [0, 1] = 2t * s',
  '',
].join('\n');

describe('fixText', () => {
  const first = fixed(fixText(messy, analyze));

  it('applies the preferred fixes pass after pass until none is left', () => {
    expect(first.stopped).toBe('done');
    expect(first.text).toContain('domain [0, 1]');
    expect(first.text).toContain('exp(-abs(t - s) / width)');
    expect(first.text).toContain('= 2*t * s');
    const kinds = new Set(first.applied.map((a) => a.kind));
    expect(kinds).toEqual(new Set(['swap-domain', 'did-you-mean', 'insert-operator', 'declare-property']));
    // The properties can only be declared once the definitions are sound: a second pass.
    expect(first.applied.filter((a) => a.kind === 'declare-property').every((a) => a.round === 2)).toBe(true);
    expect(first.rounds).toBe(2);
    expect(analyze(first.text).filter((d) => d.severity === 'error')).toEqual([]);
  });

  it('changes nothing the second time', () => {
    const again = fixed(fixText(first.text, analyze));
    expect(again.text).toBe(first.text);
    expect(again.applied).toEqual([]);
    expect(again.rounds).toBe(0);
  });

  it('keeps CRLF line endings, also in the lines it inserts', () => {
    const crlf = fixed(fixText(messy.replace(/\n/g, '\r\n'), analyze));
    expect(crlf.text).toBe(first.text.replace(/\n/g, '\r\n'));
    expect(crlf.text).not.toMatch(/[^\r]\n/);
  });

  it('applies only the fixes of the kind asked for', () => {
    const parses = messy.replace('2t', '2*t');
    const only = fixed(fixText(parses, analyze, { only: 'did-you-mean' }));
    expect(only.text).toBe(parses.replace('widht', 'width'));
    expect(only.applied.map((a) => a.kind)).toEqual(['did-you-mean']);
  });

  it('applies a fix that is not preferred when its kind is asked for, once', () => {
    const skew = '# Invented test scenario.\ndomain [0, 1]\nkernel d(t, s) = exp(-abs(t - s)) * (1 + 0.2 * (t - s))\n';
    expect(fixed(fixText(skew, analyze)).applied.some((a) => a.kind === 'symmetrize')).toBe(false);
    const sym = fixed(fixText(skew, analyze, { only: 'symmetrize' }));
    expect(sym.applied.map((a) => a.kind)).toEqual(['symmetrize']);
    expect(analyzeText(sym.text, { timeBudgetMs: 20_000 }).kernels[0].hermitian?.holds).toBe(true);
    expect(fixed(fixText(sym.text, analyze, { only: 'symmetrize' })).text).toBe(sym.text);
  });

  it('refuses a file with a syntax error that no fix repairs', () => {
    const r = fixText('# Invented.\ndomain [0, 1]\nconst width = 0.3\nkernel k(t, s) = (t + widht\n', analyze);
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.reason).toMatch(/^it does not parse cleanly and no fix repairs it \(line 4, column \d+: .+\)$/);
  });

  it('refuses a syntax error whose fix is of another kind than the one asked for', () => {
    const r = fixText('# Invented.\ndomain [0, 1]\nkernel k(t, s) = 2t\n', analyze, { only: 'did-you-mean' });
    expect(r.ok).toBe(false);
  });

  it('stops after a bounded number of passes, and when fixes undo each other', () => {
    const grow = (text: string): Diagnostic[] => [{
      code: 'KW999', severity: 'hint', range: { start: 0, end: 0 }, message: 'more',
      fixes: [{ kind: 'grow', title: 'grow', preferred: true, edits: [{ range: { start: text.length, end: text.length }, newText: 'x' }] }],
    }];
    const limited = fixed(fixText('', grow, { maxRounds: 3 }));
    expect(limited).toMatchObject({ text: 'xxx', rounds: 3, stopped: 'round-limit' });
    const toggle = (text: string): Diagnostic[] => [{
      code: 'KW999', severity: 'hint', range: { start: 0, end: 1 }, message: 'flip',
      fixes: [{ kind: 'flip', title: 'flip', preferred: true, edits: [{ range: { start: 0, end: 1 }, newText: text === 'a' ? 'b' : 'a' }] }],
    }];
    expect(fixed(fixText('a', toggle))).toMatchObject({ text: 'b', rounds: 1, stopped: 'cycle' });
  });
});
