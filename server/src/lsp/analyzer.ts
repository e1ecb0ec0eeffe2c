/**
 * Diagnostics in two stages. On every change the syntax and name diagnostics are computed on the main thread
 * (fast) and published at once, together with the numerical findings of the kernels that did not change. After a
 * short pause in typing the full analysis runs in the worker; a newer edit cancels it, and its result is published
 * only if the document is still at the version that was analysed, so a stale result never replaces a newer one.
 * Long analyses show work-done progress.
 */
import { MessageType, ShowMessageNotification, type Connection } from 'vscode-languageserver/node';
import { analyzeText, carryForward, compareDiagnostics, LineIndex, type Diagnostic } from '@kernwright/core';
import { DocumentState } from './documentState';
import { analysisOptions, type ServerSettings } from './settings';
import * as toLsp from './toLsp';
import type { WorkerClient } from './workerClient';

/** Above this size the numerical stage is skipped (the syntax stage still runs). */
export const maxNumericsChars = 1_000_000;
/** Above this size nothing is analysed (the command line refuses such files too). */
export const maxQuickChars = 2_000_000;
/** Above this size the quick stage waits for a pause in typing as well. */
export const quickDebounceChars = 200_000;
const quickDebounceMs = 300;
/** Analyses that take longer than this show progress. */
const progressDelayMs = 400;

export interface AnalyzerHost {
  readonly connection: Connection;
  readonly worker: WorkerClient;
  settings(): ServerSettings;
  readonly progressSupported: () => boolean;
  /** Called after each complete numerical result (e.g. to refresh code lenses). */
  readonly onNumericResult?: (state: DocumentState) => void;
  log(message: string): void;
}

export class Analyzer {
  private readonly states = new Map<string, DocumentState>();
  private warnedTooLarge = new Set<string>();

  constructor(private readonly host: AnalyzerHost) {}

  get(uri: string): DocumentState | undefined {
    return this.states.get(uri);
  }

  /**
   * A document was opened or changed: stage one now (after a short pause for large files, whose quick analysis
   * takes a noticeable time), stage two after the debounce.
   */
  update(uri: string, version: number, text: string): void {
    let st = this.states.get(uri);
    if (!st) {
      st = new DocumentState(uri);
      this.states.set(uri, st);
    }
    st.version = version;
    st.text = text;
    this.cancel(st);
    const target = st;
    if (text.length > quickDebounceChars) st.timer = setTimeout(() => this.quickStage(target), quickDebounceMs);
    else this.quickStage(st);
  }

  private quickStage(st: DocumentState): void {
    st.timer = null;
    const text = st.text;
    const tooLarge = text.length > maxQuickChars;
    st.quick = analyzeText(tooLarge ? '' : text, { numerics: false });
    st.index = new LineIndex(text);
    if (tooLarge) this.warnOnce(st.uri, `Kernwright: this file has ${text.length} characters; files above ${maxQuickChars} are not analysed.`);
    const settings = this.host.settings();
    st.numericsSkipped = !settings.numerics.enabled || text.length > maxNumericsChars;
    if (text.length > maxNumericsChars && !tooLarge) {
      this.warnOnce(st.uri, `Kernwright: this file has ${text.length} characters; only syntax and names are checked above ${maxNumericsChars}.`);
    }
    const carried = st.numeric && !st.numericsSkipped
      ? carryForward({ text: st.numeric.analysis.source.text, model: st.numeric.analysis.model }, st.numeric.diagnostics, { text, model: st.quick.model })
      : [];
    this.publish(st, [...st.quick.diagnostics, ...carried].sort(compareDiagnostics));
    if (st.numericsSkipped) return;
    st.timer = setTimeout(() => this.runNumerics(st), settings.numerics.debounceMs);
  }

  close(uri: string): void {
    const st = this.states.get(uri);
    if (!st) return;
    this.cancel(st);
    this.states.delete(uri);
    this.warnedTooLarge.delete(uri);
    void this.host.connection.sendDiagnostics({ uri, diagnostics: [] });
  }

  /** Analyses every open document again (settings changed, or the user asked). */
  reanalyseAll(clearCache: boolean): void {
    // Kernels the safety net stopped are tried again: the new settings may change their budget or resolution.
    if (clearCache) this.host.worker.clearCache();
    else this.host.worker.forgetStopped();
    for (const st of this.states.values()) {
      st.numeric = null;
      this.update(st.uri, st.version, st.text);
    }
  }

  dispose(): void {
    for (const st of this.states.values()) this.cancel(st);
  }

  private warnOnce(uri: string, message: string): void {
    if (this.warnedTooLarge.has(uri)) return;
    this.warnedTooLarge.add(uri);
    void this.host.connection.sendNotification(ShowMessageNotification.type, { type: MessageType.Warning, message });
  }

  private cancel(st: DocumentState): void {
    if (st.timer) clearTimeout(st.timer);
    st.timer = null;
    st.job?.cancel();
    st.job = null;
  }

  private publish(st: DocumentState, diagnostics: readonly Diagnostic[]): void {
    st.diagnostics = diagnostics;
    void this.host.connection.sendDiagnostics({
      uri: st.uri,
      version: st.version,
      diagnostics: diagnostics.map((d) => toLsp.diagnostic(st.index, st.uri, d)),
    });
  }

  private runNumerics(st: DocumentState): void {
    st.timer = null;
    const version = st.version;
    const quick = st.quick;
    const job = this.host.worker.analyze(st.text, analysisOptions(this.host.settings()));
    st.job = job;
    const progress = this.startProgressLater(st, version);
    void job.outcome.then((outcome) => {
      progress.done();
      if (st.job === job) st.job = null;
      if (this.states.get(st.uri) !== st || st.version !== version) return; // closed or edited meanwhile: stale
      if (outcome.kind === 'cancelled') return;
      if (outcome.kind === 'failed') {
        this.host.log(`Kernwright: the numerical analysis of ${st.uri} failed: ${outcome.message}`);
        return;
      }
      st.numeric = { version, analysis: quick, diagnostics: outcome.diagnostics, kernels: outcome.kernels, elapsedMs: outcome.elapsedMs };
      this.publish(st, outcome.diagnostics);
      this.host.onNumericResult?.(st);
    });
  }

  private startProgressLater(st: DocumentState, version: number): { done(): void } {
    if (!this.host.progressSupported()) return { done: () => undefined };
    let finished = false;
    let reporter: { done(): void } | null = null;
    const timer = setTimeout(() => {
      if (finished || st.version !== version) return;
      void this.host.connection.window.createWorkDoneProgress().then((r) => {
        if (finished) {
          r.done();
          return;
        }
        const name = decodeURIComponent(st.uri.slice(st.uri.lastIndexOf('/') + 1));
        r.begin('Kernwright', undefined, `Analysing ${name}…`, false);
        reporter = r;
      }, () => undefined);
    }, progressDelayMs);
    return {
      done: () => {
        finished = true;
        clearTimeout(timer);
        reporter?.done();
      },
    };
  }
}
