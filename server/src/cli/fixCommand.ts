/**
 * `kernwright fix <files...> [--only <kind>] [--dry-run]`: applies the fixes the editor offers (the preferred fix of
 * each diagnostic, or with --only the fixes of one kind), re-checking and repeating until nothing is left
 * (src-core/review/fixLoop.ts), so that a second run changes nothing.
 *
 * Safety: every file is fixed in memory first; when any file cannot be fixed (it does not parse cleanly and no fix
 * repairs it) nothing at all is written and the exit code is 2. A file is written atomically (a temporary file in
 * the same folder, then a rename), keeps its line endings, byte-order mark and permissions, and is not written when
 * it changed on disk while it was being fixed.
 *
 * The analyses run under the safety net (parallel.ts, `NetAnalyses`): the fix loop of every file is run in attempts,
 * each stopping at the first analysis that has not run yet; those analyses then run together in workers, and the
 * loops start again, getting further each time (the passes already made are answered from the analyses done). A
 * kernel the net stops gets its KW406 or KW407, which has no fix, and is not run again in later passes; the other
 * fixes of its file are applied as usual.
 *
 * Exit codes: 0 fixed (or nothing to fix); 1 with --dry-run when a file would change (the diff is printed);
 * 2 bad usage, unreadable input, a file that cannot be fixed, or a file that cannot be written.
 */
import * as crypto from 'node:crypto';
import * as fs from 'node:fs';
import * as path from 'node:path';
import { fixText, unifiedDiff, type AnalysisOptions, type AppliedFix, type FixOutcome } from '@kernwright/core';
import type { FixOptions } from './args';
import { discoverFiles } from './discover';
import { ExitCode } from './exitCode';
import { describeFsError } from './fsErrors';
import type { CliIo } from './io';
import { NetAnalyses, PendingAnalysis } from './parallel';
import { decodeSource, maxSourceBytes } from './readSource';

interface Planned {
  readonly file: string;
  readonly bytes: Buffer;
  readonly bom: boolean;
  readonly before: string;
  readonly after: string;
  readonly applied: readonly AppliedFix[];
  readonly stopped: string;
}

const bomBytes = [0xef, 0xbb, 0xbf];

function hasBom(bytes: Uint8Array): boolean {
  return bytes.length >= 3 && bomBytes.every((b, k) => bytes[k] === b);
}

function readBytes(file: string): Buffer | string {
  try {
    const size = fs.statSync(file).size;
    if (size > maxSourceBytes) return `'${file}' is too large to fix (${size} bytes)`;
    return fs.readFileSync(file);
  } catch (error) {
    return `cannot read '${file}': ${describeFsError(error)}`;
  }
}

/** Writes `content` over `file` through a temporary file in the same folder and a rename. */
export function writeAtomically(file: string, content: Buffer, expected: Buffer): void {
  const target = fs.realpathSync(file);
  const dir = path.dirname(target);
  const tmp = path.join(dir, `.${path.basename(target)}.${process.pid}.${crypto.randomBytes(4).toString('hex')}.tmp`);
  const mode = fs.statSync(target).mode & 0o7777;
  let written = false;
  try {
    const fd = fs.openSync(tmp, 'wx', mode);
    try {
      fs.writeFileSync(fd, content);
      fs.fsyncSync(fd);
    } finally {
      fs.closeSync(fd);
    }
    if (!fs.readFileSync(target).equals(expected)) throw new Error('it changed on disk while it was being fixed');
    fs.renameSync(tmp, target);
    written = true;
  } finally {
    if (!written) fs.rmSync(tmp, { force: true });
  }
}

function plural(n: number, one: string, many: string): string {
  return `${n} ${n === 1 ? one : many}`;
}

function describeApplied(applied: readonly AppliedFix[]): string {
  const kinds = new Map<string, number>();
  for (const a of applied) kinds.set(a.kind, (kinds.get(a.kind) ?? 0) + 1);
  return [...kinds].map(([k, n]) => `${k} ×${n}`).join(', ');
}

export async function runFix(options: FixOptions, io: CliIo): Promise<number> {
  const discovery = discoverFiles(options.paths);
  const problems = [...discovery.problems];
  const analysis: Partial<AnalysisOptions> = options.timeBudgetMs !== undefined ? { timeBudgetMs: options.timeBudgetMs } : {};
  const net = new NetAnalyses();
  const analyze = (text: string) => {
    const result = net.need(text, analysis);
    if (!result.ok) throw new Error(result.message);
    return result.diagnostics;
  };
  interface Source {
    readonly file: string;
    readonly bytes: Buffer;
    readonly text: string;
  }
  // One slot per file, in file order: a problem, or the file read and (once its loop has finished) its plan.
  const slots: (string | { source: Source; outcome?: FixOutcome | string })[] = [];
  for (const file of discovery.files) {
    const bytes = readBytes(file);
    if (typeof bytes === 'string') { slots.push(bytes); continue; }
    const decoded = decodeSource(file, bytes);
    if (!decoded.ok) { slots.push(decoded.message); continue; }
    slots.push({ source: { file, bytes, text: decoded.text } });
  }
  // Attempts end: each one gets every unfinished loop at least one analysis further, and a loop makes at most
  // `maxRounds` passes.
  for (;;) {
    for (const slot of slots) {
      if (typeof slot === 'string' || slot.outcome !== undefined) continue;
      try {
        slot.outcome = fixText(slot.source.text, analyze, { only: options.only });
      } catch (error) {
        if (error instanceof PendingAnalysis) continue;
        slot.outcome = `internal error while fixing '${slot.source.file}': ${error instanceof Error ? error.message : String(error)} (please report this)`;
      }
    }
    if (!net.pending) break;
    await net.run();
  }
  const plans: Planned[] = [];
  for (const slot of slots) {
    if (typeof slot === 'string') { problems.push(slot); continue; }
    const { source, outcome } = slot;
    if (outcome === undefined) {
      // Not reached: the attempts end only when every loop has finished.
      problems.push(`internal error while fixing '${source.file}': its analyses did not finish (please report this)`);
      continue;
    }
    if (typeof outcome === 'string') { problems.push(outcome); continue; }
    if (!outcome.ok) { problems.push(`not fixing '${source.file}': ${outcome.reason}`); continue; }
    plans.push({
      file: source.file, bytes: source.bytes, bom: hasBom(source.bytes), before: source.text,
      after: outcome.text, applied: outcome.applied, stopped: outcome.stopped,
    });
  }
  if (problems.length > 0) {
    problems.forEach(io.err);
    if (plans.length > 0) io.err('nothing was written');
    return ExitCode.usage;
  }

  let changed = false;
  for (const p of plans) {
    if (p.after === p.before) {
      if (!options.dryRun) io.out(`${p.file}: nothing to fix\n`);
      continue;
    }
    changed = true;
    if (options.dryRun) {
      io.out(unifiedDiff(p.before, p.after, `a/${p.file.split(path.sep).join('/')}`, `b/${p.file.split(path.sep).join('/')}`));
      continue;
    }
    try {
      writeAtomically(p.file, Buffer.concat([p.bom ? Buffer.from(bomBytes) : Buffer.alloc(0), Buffer.from(p.after, 'utf8')]), p.bytes);
    } catch (error) {
      io.err(`cannot write '${p.file}': ${error instanceof Error && !(error as NodeJS.ErrnoException).code ? error.message : describeFsError(error)}`);
      return ExitCode.usage;
    }
    const rounds = new Set(p.applied.map((a) => a.round)).size;
    const cut = p.stopped === 'done' ? '' : ` (stopped: ${p.stopped === 'cycle' ? 'the fixes undo each other' : 'too many passes'})`;
    io.out(`${p.file}: applied ${plural(p.applied.length, 'fix', 'fixes')} in ${plural(rounds, 'pass', 'passes')} (${describeApplied(p.applied)})${cut}\n`);
  }
  return options.dryRun && changed ? ExitCode.findings : ExitCode.ok;
}
