/**
 * Stands in for the package `vega-canvas` in the esbuild bundles (scripts/build.mjs aliases it here). Its Node build
 * tries `await import('canvas')` at the top level, which a CommonJS bundle cannot hold; the pictures never need a
 * canvas: SVG is written as text, and text is measured by textWidth.ts. Same exports, no canvas.
 */
export function domCanvas(): null {
  return null;
}
export function nodeCanvas(): null {
  return null;
}
export function canvas(): null {
  return null;
}
export function image(): null {
  return null;
}
