/**
 * The analysis caches are keyed `${definition hash}|${options}`: this drops every entry of the given hashes,
 * whatever the options.
 */
export function forgetHashes<V>(cache: Map<string, V>, hashes: ReadonlySet<string>): void {
  for (const key of [...cache.keys()]) if (hashes.has(key.slice(0, key.indexOf('|')))) cache.delete(key);
}
