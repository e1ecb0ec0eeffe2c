/**
 * A small seeded pseudo-random generator, so that iterative methods started from a "random" vector are
 * reproducible run to run.
 *
 * Method: mulberry32 (Tommy Ettinger, 2017; a 32-bit state advanced by the Weyl constant 0x6D2B79F5 and mixed by
 * two multiply–xorshift rounds). Not for cryptography; period 2³².
 */

/** Returns a function giving uniform numbers in [0, 1) determined by the integer `seed`. */
export function seededUniform(seed: number): () => number {
  let state = seed >>> 0;
  return () => {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}
