/**
 * Which kernel of the old version became which kernel of the new one.
 *
 * 1. Same name: the same kernel (changed or not, which the hashes tell).
 * 2. Among the rest, the same resolved definition (the hash of domain and body with constants and helpers
 *    substituted) under a new name: renamed. Each old kernel is matched at most once, in file order.
 * 3. What is left was removed (old only) or added (new only).
 *
 * The result lists the new version's kernels in its file order (matched, renamed or added), then the removed ones
 * in the old file's order.
 */

export interface KernelIdentity {
  readonly name: string;
  /** Hash of the resolved definition; null when the definition has errors. */
  readonly hash: string | null;
}

export type KernelPairing<T> =
  | { readonly kind: 'same-name'; readonly old: T; readonly new: T }
  | { readonly kind: 'renamed'; readonly old: T; readonly new: T }
  | { readonly kind: 'added'; readonly new: T }
  | { readonly kind: 'removed'; readonly old: T };

export function matchKernels<T>(
  oldKernels: readonly T[],
  newKernels: readonly T[],
  identity: (k: T) => KernelIdentity,
): KernelPairing<T>[] {
  const oldIds = oldKernels.map(identity);
  const newIds = newKernels.map(identity);
  const oldByName = new Map<string, number>();
  oldIds.forEach((k, i) => {
    if (!oldByName.has(k.name)) oldByName.set(k.name, i);
  });
  const usedOld = new Set<number>();
  const newPartner = new Map<number, number>();
  newIds.forEach((k, j) => {
    const i = oldByName.get(k.name);
    if (i !== undefined && !usedOld.has(i)) {
      usedOld.add(i);
      newPartner.set(j, i);
    }
  });
  const renamed = new Map<number, number>();
  newIds.forEach((k, j) => {
    if (newPartner.has(j) || k.hash === null) return;
    const i = oldIds.findIndex((o, idx) => !usedOld.has(idx) && o.hash === k.hash);
    if (i >= 0) {
      usedOld.add(i);
      renamed.set(j, i);
    }
  });
  const out: KernelPairing<T>[] = [];
  newKernels.forEach((k, j) => {
    const same = newPartner.get(j);
    const moved = renamed.get(j);
    if (same !== undefined) out.push({ kind: 'same-name', old: oldKernels[same], new: k });
    else if (moved !== undefined) out.push({ kind: 'renamed', old: oldKernels[moved], new: k });
    else out.push({ kind: 'added', new: k });
  });
  oldKernels.forEach((k, i) => {
    if (!usedOld.has(i)) out.push({ kind: 'removed', old: k });
  });
  return out;
}
