/**
 * The language-server part of the long fuzz run: the real server (`node server/dist/server.js --stdio`) gets a few
 * generated documents and, for M minutes, random incremental edits, hovers, completions, signature help, code
 * actions, formatting, symbols, folding, semantic tokens, definitions, references, highlights, code lenses,
 * cancellations ($/cancelRequest) and closes with reopens. Every so often it goes quiet and checks each open
 * document. Counted:
 *
 * - deaths: the server process exited (it is restarted and the documents opened again);
 * - unanswered: a request without an answer within its timeout; request errors: an error answer other than
 *   "cancelled"; handler failures: a "… failed:" line in the server's log (its guard turned an exception into an
 *   empty answer);
 * - pending forever: after quiet, `kernwright/analysisState` does not reach the document's version within the
 *   settle timeout (the numerical stage never finished);
 * - stale: after quiet and settled, the last publishDiagnostics for the document is not for its latest version, or
 *   its syntax and name diagnostics (KW1xx, KW2xx) differ from the core's analysis of the latest text;
 * - bad ranges: a published diagnostic outside the text of the version it was published for, or a range in an
 *   answer outside the text it was asked about;
 * - peak resident memory of the server process (its worker threads share it), and its memory at each quiet check.
 */
import { pathToFileURL } from 'node:url';
import path from 'node:path';
import { TextDocument } from 'vscode-languageserver-textdocument';
import { analyzeText } from '@kernwright/core';
import { fuzzDocument, generateDocument, insertable, Rng } from '../tests/fuzz/generateDocuments';
import type { FoundFolder } from './found';
import { FuzzServer, type Answer, type LspDiagnostic } from './lspServer';
import { lineLengths, rangeProblem, type LspRange, type Position } from './textLines';

export interface LspPartOptions {
  readonly root: string;
  readonly minutes: number;
  readonly seed: number;
  readonly documents: number;
  readonly requestTimeoutMs: number;
  readonly settleTimeoutMs: number;
  readonly quietEveryMs: number;
  readonly budgetMs: number;
  readonly examples: readonly string[];
  readonly found: FoundFolder;
  readonly log: (line: string) => void;
}

export interface LspCounts {
  actions: number;
  edits: number;
  requests: number;
  /** $/cancelRequest notifications sent, and requests answered "cancelled". */
  cancelsSent: number;
  cancelled: number;
  quietChecks: number;
  deaths: number;
  unanswered: number;
  requestErrors: number;
  handlerFailures: number;
  pendingForever: number;
  stale: number;
  badRanges: number;
  peakRssMb: number;
  rssAtQuietMb: number[];
  seconds: number;
}

interface OpenDoc {
  readonly uri: string;
  doc: TextDocument;
  seed: number;
  /** Texts of recent versions, to check publications against the version they name. */
  readonly texts: Map<number, string>;
  /** The last few things done to it, for the finding's detail. */
  readonly history: string[];
  /**
   * Closes whose empty publication from the server is not yet seen: publications before it belong to the text
   * before that close (the server sent them before it read the close), whatever version they name. A count, not a
   * flag: after two quick close-and-reopens, the first close's empty publication is followed by publications of
   * the text between them (version 1 as well; a run reported them as bad ranges of the newest text).
   */
  closing?: number;
}

const features: readonly { method: string; params: (d: OpenDoc, p: Position, r: LspRange) => unknown }[] = [
  { method: 'textDocument/hover', params: (d, p) => ({ textDocument: { uri: d.uri }, position: p }) },
  { method: 'textDocument/completion', params: (d, p) => ({ textDocument: { uri: d.uri }, position: p }) },
  { method: 'textDocument/signatureHelp', params: (d, p) => ({ textDocument: { uri: d.uri }, position: p }) },
  { method: 'textDocument/definition', params: (d, p) => ({ textDocument: { uri: d.uri }, position: p }) },
  { method: 'textDocument/references', params: (d, p) => ({ textDocument: { uri: d.uri }, position: p, context: { includeDeclaration: true } }) },
  { method: 'textDocument/documentHighlight', params: (d, p) => ({ textDocument: { uri: d.uri }, position: p }) },
  { method: 'textDocument/prepareRename', params: (d, p) => ({ textDocument: { uri: d.uri }, position: p }) },
  { method: 'textDocument/rename', params: (d, p) => ({ textDocument: { uri: d.uri }, position: p, newName: 'renamed' }) },
  { method: 'textDocument/formatting', params: (d) => ({ textDocument: { uri: d.uri }, options: { tabSize: 2, insertSpaces: true } }) },
  { method: 'textDocument/documentSymbol', params: (d) => ({ textDocument: { uri: d.uri } }) },
  { method: 'textDocument/foldingRange', params: (d) => ({ textDocument: { uri: d.uri } }) },
  { method: 'textDocument/semanticTokens/full', params: (d) => ({ textDocument: { uri: d.uri } }) },
  { method: 'textDocument/codeLens', params: (d) => ({ textDocument: { uri: d.uri } }) },
  { method: 'kernwright/analysisState', params: (d) => ({ uri: d.uri }) },
  { method: 'kernwright/kernelData', params: (d) => ({ uri: d.uri }) },
];

/** Every { start, end } position pair inside a JSON value (ranges of hovers, edits, symbols, locations). */
function rangesIn(value: unknown, out: LspRange[] = [], depth = 0): LspRange[] {
  if (depth > 12 || value === null || typeof value !== 'object') return out;
  const v = value as Record<string, unknown>;
  const s = v.start as Position | undefined;
  const e = v.end as Position | undefined;
  if (s && e && typeof s === 'object' && typeof e === 'object' && 'line' in s && 'character' in s) out.push(v as unknown as LspRange);
  for (const child of Array.isArray(value) ? value : Object.values(v)) rangesIn(child, out, depth + 1);
  return out;
}

function syntaxKey(d: { code?: string | number; range: LspRange }): string {
  return `${d.code}@${d.range.start.line}:${d.range.start.character}-${d.range.end.line}:${d.range.end.character}`;
}

export async function runLspPart(o: LspPartOptions): Promise<LspCounts> {
  const counts: LspCounts = {
    actions: 0, edits: 0, requests: 0, cancelsSent: 0, cancelled: 0, quietChecks: 0, deaths: 0, unanswered: 0, requestErrors: 0,
    handlerFailures: 0, pendingForever: 0, stale: 0, badRanges: 0, peakRssMb: 0, rssAtQuietMb: [], seconds: 0,
  };
  const r = new Rng(o.seed ^ 0x1f2e3d4c);
  const started = performance.now();
  const deadline = Date.now() + o.minutes * 60_000;
  const settings = { numerics: { timeBudgetMs: o.budgetMs } };
  let server = await FuzzServer.start(o.root, settings);
  let logsSeen = 0;
  let nextSeed = o.seed + 1_000_000;
  /** At most this many findings of one symptom are saved (the counts go on). */
  const saved = new Map<string, number>();
  const record = (d: OpenDoc | null, symptom: string, detail: string, text?: string): void => {
    const n = saved.get(symptom) ?? 0;
    saved.set(symptom, n + 1);
    if (n >= 10) return;
    const name = o.found.add({
      part: 'lsp', symptom, seed: d ? `${d.seed}-v${d.doc.version}` : 'server', text: text ?? d?.doc.getText() ?? '',
      detail: `${detail}\n${d ? `last actions on this document:\n  ${d.history.slice(-12).join('\n  ')}` : ''}`,
    });
    o.log(`  ${symptom}: ${name} — ${detail.split('\n')[0]}`);
  };

  const docs: OpenDoc[] = [];
  const open = (d: OpenDoc): void => {
    d.texts.set(d.doc.version, d.doc.getText());
    server.notify('textDocument/didOpen', { textDocument: { uri: d.uri, languageId: 'kernwright', version: d.doc.version, text: d.doc.getText() } });
  };
  for (let k = 0; k < o.documents; k++) {
    const seed = nextSeed++;
    const uri = pathToFileURL(path.join(o.root, '.cache', 'fuzz', `open-${k}.kw`)).href;
    const d: OpenDoc = { uri, doc: TextDocument.create(uri, 'kernwright', 1, fuzzDocument(seed, o.examples).text), seed, texts: new Map(), history: [`opened document ${seed}`] };
    docs.push(d);
    open(d);
  }

  const checkServer = async (): Promise<void> => {
    for (; logsSeen < server.logs.length; logsSeen++) {
      const line = server.logs[logsSeen];
      if (/ failed[:\s]/.test(line)) {
        counts.handlerFailures++;
        const d = docs.find((x) => line.includes(x.uri)) ?? null;
        record(d, 'handler-failure', line.slice(0, 3000));
      }
    }
    counts.peakRssMb = Math.max(counts.peakRssMb, server.memory.peakMb);
    if (!server.exited) return;
    counts.deaths++;
    record(docs[0] ?? null, 'death', `the server exited with code ${server.exitCode}\nstderr (end):\n${server.stderr.slice(-4000)}`,
      docs.map((d) => `# ${d.uri}\n${d.doc.getText()}`).join('\n'));
    server = await FuzzServer.start(o.root, settings);
    logsSeen = 0;
    for (const d of docs) { d.closing = 0; open(d); }
  };

  const checkPublications = (): void => {
    for (const d of docs) {
      for (const p of server.published.get(d.uri) ?? []) {
        if ((p as { checked?: boolean }).checked) continue;
        (p as { checked?: boolean }).checked = true;
        if (p.version === undefined) { // the empty publication after a close
          d.closing = Math.max(0, (d.closing ?? 0) - 1);
          continue;
        }
        if ((d.closing ?? 0) > 0) continue;
        const text = d.texts.get(p.version);
        if (text === undefined) continue;
        const lengths = lineLengths(text);
        const bad = p.diagnostics.flatMap((x: LspDiagnostic) =>
          [x.range, ...(x.relatedInformation ?? []).filter((ri) => ri.location.uri === d.uri).map((ri) => ri.location.range)]
            .map((rg) => rangeProblem(rg, lengths)).filter((m): m is string => m !== null).map((m) => `${x.code}: ${m}`));
        if (bad.length > 0) {
          counts.badRanges++;
          record(d, 'bad-range', `published diagnostics of version ${p.version}: ${bad.join('; ')}`, text);
        }
      }
    }
  };

  const ask = async (d: OpenDoc, method: string, params: unknown, cancel: boolean): Promise<Answer<unknown>> => {
    counts.requests++;
    if (cancel) counts.cancelsSent++;
    const version = d.doc.version;
    const text = d.doc.getText();
    const answer = await server.request<unknown>(method, params, o.requestTimeoutMs, cancel ? r.int(0, 5) : undefined);
    if (answer.kind === 'timeout') {
      if (!server.exited) {
        counts.unanswered++;
        record(d, 'unanswered', `${method} ${JSON.stringify(params)} had no answer within ${o.requestTimeoutMs} ms`, text);
      }
    } else if (answer.kind === 'error') {
      if (answer.code === -32800) counts.cancelled++;
      else if (answer.code === -32602 && method === 'textDocument/rename') {
        // Renaming something that is not a name: the protocol's way to say so is this error, with a message.
      } else {
        counts.requestErrors++;
        record(d, 'request-error', `${method} ${JSON.stringify(params)} answered error ${answer.code}: ${answer.message}`, text);
      }
    } else if (d.doc.version === version && method !== 'textDocument/semanticTokens/full') {
      const lengths = lineLengths(text);
      const bad = rangesIn(answer.value).map((rg) => rangeProblem(rg, lengths)).filter((m): m is string => m !== null);
      if (bad.length > 0) {
        counts.badRanges++;
        record(d, 'bad-range', `${method} ${JSON.stringify(params)} answered ranges outside the text: ${bad.slice(0, 5).join('; ')}`, text);
      }
    }
    return answer;
  };

  const randomOffset = (text: string): number => {
    let at = r.int(0, text.length);
    const c = text.charCodeAt(at);
    if (c >= 0xdc00 && c <= 0xdfff) at--; // never between the halves of a surrogate pair
    return at;
  };

  const edit = (d: OpenDoc): void => {
    const changes: { range: LspRange; text: string }[] = [];
    // A scratch copy: TextDocument.update changes the document it is given, and d.doc gets all changes at once below.
    let doc = TextDocument.create(d.uri, 'kernwright', d.doc.version, d.doc.getText());
    for (let k = 0, n = r.chance(0.2) ? r.int(2, 4) : 1; k < n; k++) {
      const text = doc.getText();
      const a = randomOffset(text);
      const b = Math.min(text.length, a + (r.chance(0.5) ? 0 : r.int(1, 12)));
      const roll = r.next();
      const insert = roll < 0.25 ? '' : roll < 0.8 ? r.pick(insertable)
        : roll < 0.95 ? `\n${generateDocument(nextSeed++).split('\n')[r.int(1, 4)] ?? ''}` : r.pick(o.examples).slice(0, r.int(0, 300));
      const end = b > a && (text.charCodeAt(b) & 0xfc00) === 0xdc00 ? b + 1 : b;
      const change = { range: { start: doc.positionAt(a), end: doc.positionAt(end) }, text: insert };
      changes.push(change);
      doc = TextDocument.update(doc, [change], doc.version);
    }
    d.doc = TextDocument.update(d.doc, changes, d.doc.version + 1);
    d.texts.set(d.doc.version, d.doc.getText());
    if (d.texts.size > 400) d.texts.delete(d.texts.keys().next().value as number);
    d.history.push(`v${d.doc.version}: ${JSON.stringify(changes)}`);
    if (d.history.length > 40) d.history.splice(0, d.history.length - 40);
    counts.edits++;
    server.notify('textDocument/didChange', { textDocument: { uri: d.uri, version: d.doc.version }, contentChanges: changes });
  };

  const quiet = async (): Promise<void> => {
    counts.quietChecks++;
    for (const d of docs) {
      const version = d.doc.version;
      const until = Date.now() + o.settleTimeoutMs;
      type State = { version: number; numericVersion: number | null; pending: boolean; state: string } | null;
      let state: State = null;
      let settled = false;
      while (Date.now() < until && !server.exited) {
        const a: Answer<State> = await server.request<State>('kernwright/analysisState', { uri: d.uri }, o.requestTimeoutMs);
        if (a.kind === 'result') state = a.value;
        if (state && state.version === version && !state.pending && (state.numericVersion === version || state.state === 'off')) {
          settled = true;
          break;
        }
        await new Promise((res) => setTimeout(res, 100));
      }
      if (server.exited) return;
      if (!settled) {
        counts.pendingForever++;
        record(d, 'pending', `after ${o.settleTimeoutMs} ms of quiet the analysis of version ${version} has not finished: ${JSON.stringify(state)}`);
        continue;
      }
      await new Promise((res) => setTimeout(res, 50)); // the publication travels after the state changed
      const pubs = server.published.get(d.uri) ?? [];
      const last = pubs[pubs.length - 1];
      if (!last || last.version !== version) {
        counts.stale++;
        record(d, 'stale', `settled at version ${version}, but the last publication is for version ${last?.version}`);
        continue;
      }
      const expected = analyzeText(d.doc.getText(), { numerics: false }).diagnostics.filter((x) => /^KW[12]/.test(x.code));
      const lines = TextDocument.create(d.uri, 'kernwright', 0, d.doc.getText());
      const want = expected.map((x) => syntaxKey({ code: x.code, range: { start: lines.positionAt(x.range.start), end: lines.positionAt(x.range.end) } })).sort();
      const got = last.diagnostics.filter((x) => /^KW[12]/.test(String(x.code))).map(syntaxKey).sort();
      if (want.join(' ') !== got.join(' ')) {
        counts.stale++;
        record(d, 'stale', `the published syntax and name diagnostics of version ${version} differ from the core's analysis of that text:\npublished: ${got.join(' ')}\nexpected:  ${want.join(' ')}`);
      }
    }
    const mb = server.memory.lastMb;
    counts.rssAtQuietMb.push(mb);
    o.log(`lsp: ${((performance.now() - started) / 1000).toFixed(0)} s, ${counts.actions} actions, ${counts.edits} edits, ${counts.requests} requests; server ${mb.toFixed(0)} MB now, peak ${server.memory.peakMb.toFixed(0)} MB; ${counts.deaths} deaths, ${counts.unanswered} unanswered, ${counts.pendingForever} pending, ${counts.stale} stale, ${counts.badRanges} bad ranges`);
  };

  o.log(`lsp: ${o.documents} documents for ${o.minutes} min, a quiet check every ${(o.quietEveryMs / 1000).toFixed(0)} s`);
  let lastQuiet = Date.now();
  while (Date.now() < deadline) {
    counts.actions++;
    const d = r.pick(docs);
    const roll = r.next();
    if (roll < 0.45) {
      edit(d);
      if (r.chance(0.6)) await new Promise((res) => setTimeout(res, r.int(0, 400)));
    } else if (roll < 0.9) {
      const f = r.pick(features);
      const text = d.doc.getText();
      const a = randomOffset(text);
      const p = d.doc.positionAt(a);
      const range = { start: p, end: d.doc.positionAt(Math.min(text.length, a + r.int(0, 30))) };
      if (r.chance(0.2)) {
        const pubs = server.published.get(d.uri) ?? [];
        const diagnostics = pubs[pubs.length - 1]?.diagnostics ?? [];
        await ask(d, 'textDocument/codeAction', { textDocument: { uri: d.uri }, range, context: { diagnostics } }, r.chance(0.15));
      } else {
        await ask(d, f.method, f.params(d, p, range), r.chance(0.15));
      }
    } else if (roll < 0.95) {
      // Close and reopen: the same text or a new document, its version starting again at 1.
      server.notify('textDocument/didClose', { textDocument: { uri: d.uri } });
      if (r.chance(0.5)) await new Promise((res) => setTimeout(res, r.int(0, 300)));
      const fresh = r.chance(0.5);
      if (fresh) d.seed = nextSeed++;
      const text = fresh ? fuzzDocument(d.seed, o.examples).text : d.doc.getText();
      d.doc = TextDocument.create(d.uri, 'kernwright', 1, text);
      d.texts.clear();
      server.published.delete(d.uri);
      d.closing = (d.closing ?? 0) + 1;
      d.history.push(`closed and reopened (document ${d.seed})`);
      open(d);
    } else {
      // A whole new text in one change (a paste over everything).
      const text = fuzzDocument(nextSeed++, o.examples).text;
      d.doc = TextDocument.update(d.doc, [{ text }], d.doc.version + 1);
      d.texts.set(d.doc.version, text);
      d.history.push(`v${d.doc.version}: replaced by a new document`);
      server.notify('textDocument/didChange', { textDocument: { uri: d.uri, version: d.doc.version }, contentChanges: [{ text }] });
    }
    checkPublications();
    await checkServer();
    if (Date.now() - lastQuiet > o.quietEveryMs) {
      await quiet();
      checkPublications();
      await checkServer();
      lastQuiet = Date.now();
    }
  }
  await quiet();
  checkPublications();
  await checkServer();
  counts.peakRssMb = Math.max(counts.peakRssMb, server.memory.peakMb);
  await server.stop();
  counts.seconds = (performance.now() - started) / 1000;
  return counts;
}
