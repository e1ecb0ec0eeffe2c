/**
 * Finds definitions that depend on themselves (constants and helpers referring to each other in a loop) by a
 * depth-first search with an explicit stack; reports each cycle once, on the name of its first member.
 */
import type { Diagnostic } from '../diagnostics/types';
import { makeDiagnostic } from '../diagnostics/make';
import type { DraftSymbol } from './scope';

export function findCycles(
  all: readonly DraftSymbol[],
  uses: ReadonlyMap<DraftSymbol, readonly DraftSymbol[]>,
  diagnostics: Diagnostic[],
): Set<DraftSymbol> {
  const inCycle = new Set<DraftSymbol>();
  const state = new Map<DraftSymbol, 'active' | 'done'>();
  for (const start of all) {
    if (state.has(start)) continue;
    const path: DraftSymbol[] = [];
    const stack: { sym: DraftSymbol; next: number }[] = [{ sym: start, next: 0 }];
    state.set(start, 'active');
    path.push(start);
    while (stack.length > 0) {
      const top = stack[stack.length - 1];
      const deps = uses.get(top.sym) ?? [];
      if (top.next >= deps.length) {
        state.set(top.sym, 'done');
        stack.pop();
        path.pop();
        continue;
      }
      const dep = deps[top.next++];
      const st = state.get(dep);
      if (st === 'active') {
        const cycle = path.slice(path.indexOf(dep));
        if (!cycle.some((c) => inCycle.has(c))) {
          const chain = [...cycle, dep].map((c) => c.name).join(' → ');
          diagnostics.push(makeDiagnostic('definition-cycle', dep.nameRange, { name: dep.name, chain }, {
            related: cycle.slice(1).map((c) => ({ range: c.nameRange, message: `“${c.name}” is part of the cycle` })),
          }));
        }
        for (const c of cycle) inCycle.add(c);
      } else if (st === undefined) {
        state.set(dep, 'active');
        path.push(dep);
        stack.push({ sym: dep, next: 0 });
      }
    }
  }
  return inCycle;
}
