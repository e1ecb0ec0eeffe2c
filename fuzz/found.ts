/**
 * Keeps the failing documents of a run so that they can become tests: each one as `<symptom>-<part>-<seed>.kw`
 * (the text exactly as the CLI or the server saw it) with a `.txt` beside it that says what went wrong and how to
 * regenerate it. The folder (fuzz/found/ by default) may be committed.
 */
import { mkdirSync, writeFileSync } from 'node:fs';
import path from 'node:path';

export interface Finding {
  readonly part: 'cli' | 'lsp';
  /** crash, hang, bad-range, unknown-code, refused, death, unanswered, stale, pending, handler-error, … */
  readonly symptom: string;
  /** The document's seed, or a label when it has none (an edited document in the server). */
  readonly seed: number | string;
  readonly text: string;
  /** One or more lines: the message, the command, what was expected. */
  readonly detail: string;
}

export class FoundFolder {
  readonly findings: Finding[] = [];
  private readonly names = new Set<string>();

  constructor(readonly folder: string, private readonly runSeed: number) {}

  add(f: Finding): string {
    this.findings.push(f);
    mkdirSync(this.folder, { recursive: true });
    let base = `${f.symptom}-${f.part}-${f.seed}`.replace(/[^A-Za-z0-9_.-]/g, '_');
    for (let k = 2; this.names.has(base); k++) base = `${f.symptom}-${f.part}-${f.seed}-${k}`.replace(/[^A-Za-z0-9_.-]/g, '_');
    this.names.add(base);
    writeFileSync(path.join(this.folder, `${base}.kw`), f.text);
    writeFileSync(path.join(this.folder, `${base}.txt`), [
      `symptom: ${f.symptom} (${f.part} part of npm run fuzz, run seed ${this.runSeed}, document ${f.seed})`,
      f.detail.trim(),
      '',
    ].join('\n'));
    return `${base}.kw`;
  }
}
