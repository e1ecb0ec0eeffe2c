/**
 * A Vega-Lite specification rendered to an SVG document in Node: compiled to Vega by vega-lite, run by a headless
 * vega View (renderer 'none', no canvas, no DOM) and written out with `View.toSVG()`. Every data set is inline, so
 * the View gets a loader that refuses to load anything: a specification can never make the renderer read a file or
 * reach the network.
 */
import * as vega from 'vega';
import { compile, type TopLevelSpec } from 'vega-lite';
import type { VegaLiteSpec } from '@kernwright/core';
import { vegaTextWidth } from './textWidth';

// Lay text out by per-character widths instead of vega's 0.8 em per character (see textWidth.ts).
(vega as unknown as { textMetrics: { width: typeof vegaTextWidth } }).textMetrics.width = vegaTextWidth;

const refuse = (what: string) => () => Promise.reject(new Error(`the pictures load no external data (${what})`));

const noLoading: vega.Loader = {
  load: refuse('load'),
  sanitize: refuse('sanitize'),
  http: refuse('http'),
  file: refuse('file'),
};

export interface RenderOptions {
  /** Receives vega-lite's and vega's warnings (by default they are dropped: nothing is printed). */
  readonly onWarning?: (message: string) => void;
}

function logger(onWarning: (message: string) => void) {
  const say = (...args: unknown[]) => onWarning(args.map(String).join(' '));
  const self = { level: () => self, error: say, warn: say, info: () => self, debug: () => self };
  return self;
}

/** The Vega specification a Vega-Lite specification compiles to. */
export function compileToVega(spec: VegaLiteSpec, options: RenderOptions = {}): vega.Spec {
  const log = logger(options.onWarning ?? (() => undefined));
  return compile(spec as unknown as TopLevelSpec, { logger: log as never }).spec as vega.Spec;
}

export async function renderSvg(spec: VegaLiteSpec, options: RenderOptions = {}): Promise<string> {
  const runtime = vega.parse(compileToVega(spec, options));
  const view = new vega.View(runtime, { renderer: 'none', loader: noLoading, logLevel: vega.Warn, logger: logger(options.onWarning ?? (() => undefined)) as never });
  try {
    return await view.toSVG();
  } finally {
    view.finalize();
  }
}
