/**
 * The command-line part of the long fuzz run: generated and mutated documents are written in batches to a
 * temporary folder and checked by the real program, `node server/dist/cli.js check --format json --time-budget B
 * <folder>`, with a timeout per invocation. Counted:
 *
 * - crashes: exit 2 with "internal error" (the program names the file), or exit 0/1 without a valid JSON report;
 * - hangs: the invocation passed its timeout; the batch is bisected until the file that hangs is named;
 * - refused: exit 2 without "internal error" (an input the program will not check: binary, not UTF-8, too large);
 * - bad ranges: a diagnostic (or related) range of the JSON report outside the file as written;
 * - unknown codes: a diagnostic code that is not in the catalogue;
 * - stopped kernels: KW406 (analysis stopped by the safety net) and KW407 (out of memory), counted apart: they are
 *   the safety net's answer, not failures;
 * - the peak resident memory of the program.
 */
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { entryByCode } from '@kernwright/core';
import { fuzzDocument, type FuzzDocument } from '../tests/fuzz/generateDocuments';
import { runProcess, type RunResult } from './childProcess';
import type { FoundFolder } from './found';
import { lineLengths, rangeProblem, type LspRange } from './textLines';

export interface CliPartOptions {
  readonly root: string;
  readonly docs: number;
  readonly seed: number;
  readonly batch: number;
  readonly budgetMs: number;
  /** Timeout of one invocation: this much plus `timeoutPerFileMs` per file. */
  readonly timeoutBaseMs: number;
  readonly timeoutPerFileMs: number;
  readonly examples: readonly string[];
  readonly found: FoundFolder;
  readonly log: (line: string) => void;
}

export interface CliCounts {
  documents: number;
  kernels: number;
  invocations: number;
  crashes: number;
  hangs: number;
  refused: number;
  badRanges: number;
  unknownCodes: number;
  stopped406: number;
  outOfMemory407: number;
  peakRssMb: number;
  seconds: number;
}

interface JsonFile {
  path: string;
  diagnostics: { code: string; message: string; range: LspRange; related?: { range: LspRange }[] }[];
  kernels?: unknown[];
}

interface Written {
  readonly doc: FuzzDocument;
  readonly file: string;
  /** The text the program reads (it drops a leading byte-order mark). */
  readonly seen: string;
}

export async function runCliPart(o: CliPartOptions): Promise<CliCounts> {
  const counts: CliCounts = {
    documents: 0, kernels: 0, invocations: 0, crashes: 0, hangs: 0, refused: 0, badRanges: 0, unknownCodes: 0,
    stopped406: 0, outOfMemory407: 0, peakRssMb: 0, seconds: 0,
  };
  const started = performance.now();
  const tmp = mkdtempSync(path.join(os.tmpdir(), 'kw-fuzz-'));
  const cli = path.join(o.root, 'server', 'dist', 'cli.js');
  o.log(`cli: ${o.docs} documents in batches of ${o.batch}, --time-budget ${o.budgetMs}, files in ${tmp}`);

  const run = async (files: readonly Written[]): Promise<RunResult> => {
    counts.invocations++;
    const folder = path.join(tmp, `run-${counts.invocations}`);
    mkdirSync(folder);
    for (const w of files) writeFileSync(path.join(folder, w.file), w.doc.text);
    const timeout = o.timeoutBaseMs + o.timeoutPerFileMs * files.length;
    const r = await runProcess(process.execPath, [cli, 'check', '--format', 'json', '--fail-on', 'never', '--time-budget', String(o.budgetMs), folder], o.root, timeout);
    rmSync(folder, { recursive: true, force: true });
    counts.peakRssMb = Math.max(counts.peakRssMb, r.peakMb);
    return r;
  };

  const record = (w: Written, symptom: string, detail: string): void => {
    const name = o.found.add({ part: 'cli', symptom, seed: w.doc.seed, text: w.doc.text, detail });
    o.log(`  ${symptom}: ${name} — ${detail.split('\n')[0]}`);
  };

  const account = (files: readonly Written[], report: { files?: JsonFile[] }): void => {
    const byName = new Map(files.map((w) => [w.file, w]));
    for (const f of report.files ?? []) {
      const w = byName.get(path.basename(f.path));
      if (!w) continue;
      counts.kernels += f.kernels?.length ?? 0;
      const lengths = lineLengths(w.seen);
      const bad: string[] = [];
      const unknown: string[] = [];
      const stopped: string[] = [];
      for (const d of f.diagnostics ?? []) {
        if (d.code === 'KW406') counts.stopped406++;
        if (d.code === 'KW407') counts.outOfMemory407++;
        if (d.code === 'KW406' || d.code === 'KW407') stopped.push(`${d.code}: ${d.message}`);
        if (!entryByCode(d.code)) unknown.push(d.code);
        for (const r of [d.range, ...(d.related ?? []).map((x) => x.range)]) {
          const p = rangeProblem(r, lengths);
          if (p) bad.push(`${d.code}: ${p} (${d.message})`);
        }
      }
      if (bad.length > 0) {
        counts.badRanges++;
        record(w, 'bad-range', bad.join('\n'));
      }
      if (stopped.length > 0) {
        // Not a failure (the safety net answered), but a kernel whose analysis ran far past its budget.
        record(w, 'stopped', `${stopped.join('\n')}\n(the safety net's answer, not counted as a failure)`);
      }
      if (unknown.length > 0) {
        counts.unknownCodes++;
        record(w, 'unknown-code', `codes not in the catalogue: ${unknown.join(', ')}`);
      }
    }
  };

  const command = `node server/dist/cli.js check --format json --time-budget ${o.budgetMs} <file>`;

  /** Checks the files; on a crash or a hang, names the culprit (from the message, else by bisection). */
  const check = async (files: readonly Written[]): Promise<void> => {
    if (files.length === 0) return;
    const r = await run(files);
    if (!r.timedOut && (r.code === 0 || r.code === 1)) {
      try {
        account(files, JSON.parse(r.stdout) as { files?: JsonFile[] });
        return;
      } catch (error) {
        if (files.length === 1) {
          counts.crashes++;
          record(files[0], 'crash', `exit ${r.code} without a valid JSON report (${(error as Error).message})\n${command}\nstderr: ${r.stderr.slice(0, 2000)}`);
          return;
        }
      }
    } else if (!r.timedOut && r.code === 2) {
      const named = files.filter((w) => r.stderr.includes(w.file));
      const internal = r.stderr.includes('internal error');
      if (named.length > 0 || files.length === 1) {
        for (const w of named.length > 0 ? named : files) {
          const line = r.stderr.split('\n').find((l) => l.includes(w.file)) ?? r.stderr.trim();
          if (internal) counts.crashes++;
          else counts.refused++;
          record(w, internal ? 'crash' : 'refused', `exit 2: ${line}\n${command}`);
        }
        await check(files.filter((w) => !named.includes(w)).filter(() => named.length > 0));
        return;
      }
    } else if (files.length === 1) {
      if (r.timedOut) {
        counts.hangs++;
        record(files[0], 'hang', `no answer within ${(r.ms / 1000).toFixed(1)} s (killed)\n${command}`);
      } else {
        counts.crashes++;
        record(files[0], 'crash', `exit ${r.code} signal ${r.signal}\n${command}\nstderr: ${r.stderr.slice(0, 2000)}`);
      }
      return;
    }
    // A failure that names no file: bisect.
    const half = Math.ceil(files.length / 2);
    o.log(`  ${r.timedOut ? 'timeout' : `exit ${r.code}`} on ${files.length} files: bisecting`);
    await check(files.slice(0, half));
    await check(files.slice(half));
  };

  for (let first = 0; first < o.docs; first += o.batch) {
    const files: Written[] = [];
    for (let k = first; k < Math.min(o.docs, first + o.batch); k++) {
      const doc = fuzzDocument(o.seed + k, o.examples);
      files.push({ doc, file: `doc-${doc.seed}.kw`, seen: doc.text.replace(/^\ufeff/, '') });
    }
    await check(files);
    counts.documents += files.length;
    const s = ((performance.now() - started) / 1000).toFixed(0);
    o.log(`cli: ${counts.documents}/${o.docs} documents, ${counts.crashes} crashes, ${counts.hangs} hangs, ${counts.badRanges} bad ranges, peak ${counts.peakRssMb.toFixed(0)} MB, ${s} s`);
  }
  rmSync(tmp, { recursive: true, force: true });
  counts.seconds = (performance.now() - started) / 1000;
  return counts;
}
