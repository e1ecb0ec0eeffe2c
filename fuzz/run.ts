/**
 * The long fuzz run, outside the test suite: `npm run fuzz [-- options]` (scripts/fuzz.mjs bundles this file and
 * runs it from the repository root). It drives the built command-line program (cliPart.ts) on N generated and
 * mutated documents and the built language server (lspPart.ts) through M minutes of random editing, then prints
 * one table of counts and peak memory. Exit code 1 when a failure count is nonzero (crashes, hangs, bad ranges,
 * unknown codes, deaths, unanswered requests, request errors, handler failures, stale or pending-forever
 * documents); KW406/KW407 (kernels stopped by the safety net) and refused inputs are reported, not failures.
 *
 * Options: --docs N (2000)  --lsp-minutes M (1)  --seed S (1)  --part cli|lsp|all (all)  --batch B (25)
 *          --time-budget MS (20, the CLI's per-kernel budget; the server gets the same)  --lsp-docs D (4)
 *          --found DIR (fuzz/found)
 */
import { existsSync, readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { parseArgs } from 'node:util';
import { runCliPart, type CliCounts } from './cliPart';
import { FoundFolder } from './found';
import { runLspPart, type LspCounts } from './lspPart';

const root = process.cwd();

function fail(message: string): never {
  process.stderr.write(`fuzz: ${message}\n`);
  process.exit(2);
}

function integer(value: string | undefined, fallback: number, name: string): number {
  if (value === undefined) return fallback;
  const n = Number(value);
  if (!Number.isFinite(n) || n < 0) fail(`--${name} needs a non-negative number, not '${value}'`);
  return n;
}

function examples(): string[] {
  const out: string[] = [];
  for (const dir of ['examples', path.join('examples', 'broken')]) {
    const full = path.join(root, dir);
    if (!existsSync(full)) continue;
    for (const f of readdirSync(full).filter((x) => x.endsWith('.kw')).sort()) out.push(readFileSync(path.join(full, f), 'utf8'));
  }
  return out;
}

function table(rows: [string, string, string][]): string {
  const w0 = Math.max(...rows.map((r) => r[0].length));
  const w1 = Math.max(...rows.map((r) => r[1].length));
  return rows.map(([a, b, c]) => `  ${a.padEnd(w0)}  ${b.padStart(w1)}  ${c}`).join('\n');
}

async function main(): Promise<void> {
  const { values } = parseArgs({
    options: {
      docs: { type: 'string' }, 'lsp-minutes': { type: 'string' }, seed: { type: 'string' }, part: { type: 'string' },
      batch: { type: 'string' }, 'time-budget': { type: 'string' }, 'lsp-docs': { type: 'string' }, found: { type: 'string' },
      help: { type: 'boolean', short: 'h' },
    },
    strict: true,
  });
  if (values.help) {
    console.log('npm run fuzz -- [--docs N] [--lsp-minutes M] [--seed S] [--part cli|lsp|all] [--batch B] [--time-budget MS] [--lsp-docs D] [--found DIR]');
    return;
  }
  const part = values.part ?? 'all';
  if (!['cli', 'lsp', 'all'].includes(part)) fail(`--part is cli, lsp or all, not '${part}'`);
  const seed = integer(values.seed, 1, 'seed');
  const budgetMs = integer(values['time-budget'], 20, 'time-budget');
  const found = new FoundFolder(path.resolve(root, values.found ?? path.join('fuzz', 'found')), seed);
  const log = (line: string) => console.log(line);
  const ex = examples();
  for (const bundle of part === 'lsp' ? ['server.js', 'worker.js'] : part === 'cli' ? ['cli.js'] : ['cli.js', 'server.js', 'worker.js']) {
    if (!existsSync(path.join(root, 'server', 'dist', bundle))) fail(`server/dist/${bundle} is missing: run node scripts/build.mjs first`);
  }

  let cli: CliCounts | null = null;
  let lsp: LspCounts | null = null;
  if (part !== 'lsp') {
    cli = await runCliPart({
      root, docs: integer(values.docs, 2000, 'docs'), seed, batch: Math.max(1, integer(values.batch, 25, 'batch')), budgetMs,
      timeoutBaseMs: 20_000, timeoutPerFileMs: 2_000, examples: ex, found, log,
    });
  }
  if (part !== 'cli') {
    lsp = await runLspPart({
      root, minutes: integer(values['lsp-minutes'], 1, 'lsp-minutes'), seed, documents: Math.max(1, integer(values['lsp-docs'], 4, 'lsp-docs')),
      requestTimeoutMs: 10_000, settleTimeoutMs: 30_000, quietEveryMs: 15_000, budgetMs, examples: ex, found, log,
    });
  }

  const rows: [string, string, string][] = [];
  let failures = 0;
  const row = (name: string, n: number, note: string, failing: boolean) => {
    rows.push([name, String(n), note]);
    if (failing) failures += n;
  };
  if (cli) {
    rows.push([`cli (${cli.seconds.toFixed(0)} s)`, '', '']);
    row('documents', cli.documents, `${cli.kernels} kernels reported, ${cli.invocations} invocations`, false);
    row('crashes', cli.crashes, 'exit 2 with an internal error, or no valid JSON report', true);
    row('hangs', cli.hangs, 'no answer within the timeout (bisected to the file)', true);
    row('bad ranges', cli.badRanges, 'files with a diagnostic range outside the file', true);
    row('unknown codes', cli.unknownCodes, 'files with a code that is not in the catalogue', true);
    row('refused', cli.refused, 'exit 2 without an internal error (input the program will not check)', false);
    row('stopped (KW406)', cli.stopped406, 'kernels stopped by the safety net (its answer, not a failure)', false);
    row('out of memory (KW407)', cli.outOfMemory407, 'kernels stopped by the memory limit (its answer, not a failure)', false);
    rows.push(['peak memory', `${cli.peakRssMb.toFixed(0)} MB`, 'largest VmRSS of one CLI process']);
  }
  if (lsp) {
    rows.push([`lsp (${lsp.seconds.toFixed(0)} s)`, '', '']);
    row('actions', lsp.actions, `${lsp.edits} edits, ${lsp.requests} requests (${lsp.cancelsSent} with $/cancelRequest, ${lsp.cancelled} answered cancelled), ${lsp.quietChecks} quiet checks`, false);
    row('deaths', lsp.deaths, 'the server process exited', true);
    row('unanswered', lsp.unanswered, 'requests without an answer within the timeout', true);
    row('request errors', lsp.requestErrors, 'error answers other than "cancelled"', true);
    row('handler failures', lsp.handlerFailures, '"... failed:" lines in the server log', true);
    row('pending forever', lsp.pendingForever, 'analysis not finished after the settle timeout of quiet', true);
    row('stale', lsp.stale, 'last publication not for the latest version, or not matching its text', true);
    row('bad ranges', lsp.badRanges, 'published or answered ranges outside the text', true);
    const q = lsp.rssAtQuietMb;
    rows.push(['peak memory', `${lsp.peakRssMb.toFixed(0)} MB`, `server VmRSS; at the quiet checks: ${q.map((x) => x.toFixed(0)).join(', ')} MB`]);
  }
  console.log(`\nfuzz summary (seed ${seed}, --time-budget ${budgetMs} ms)\n${table(rows)}`);
  if (found.findings.length > 0) console.log(`\n${found.findings.length} failing documents kept in ${path.relative(root, found.folder)}/`);
  process.exit(failures > 0 ? 1 : 0);
}

main().catch((error: unknown) => {
  process.stderr.write(`fuzz: ${error instanceof Error ? error.stack ?? error.message : String(error)}\n`);
  process.exit(2);
});
