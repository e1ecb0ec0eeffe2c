/** Small utilities over IR trees shared by the symbolic analyses: bindings, closures, variable dependence. */
import type { IrNode } from './ir';

/** Children of a node, in evaluation order. */
export function irChildren(n: IrNode): IrNode[] {
  switch (n.op) {
    case 'const': case 'var': return [];
    case 'neg': case 'not': return [n.a];
    case 'call': return [...n.args];
    case 'cond': return [n.test, n.then, n.otherwise];
    case 'let': return [n.value, n.body];
    default: return [n.a, n.b];
  }
}

/**
 * Pre-order position of the first node whose source range is `range` (−1 when none). Two kernels with the same
 * definition hash have trees of the same shape, so a position found in one names the same node in the other:
 * results cached by hash keep positions, not ranges, and find the ranges in the document at hand.
 */
export function positionOfRange(root: IrNode, range: { readonly start: number; readonly end: number }): number {
  let index = 0;
  const stack: IrNode[] = [root];
  while (stack.length > 0) {
    const n = stack.pop()!;
    if (n.range.start === range.start && n.range.end === range.end) return index;
    index++;
    const kids = irChildren(n);
    for (let i = kids.length - 1; i >= 0; i--) stack.push(kids[i]);
  }
  return -1;
}

/** The node at a pre-order position (see positionOfRange), or null. */
export function nodeAtPosition(root: IrNode, position: number): IrNode | null {
  if (position < 0) return null;
  let index = 0;
  const stack: IrNode[] = [root];
  while (stack.length > 0) {
    const n = stack.pop()!;
    if (index === position) return n;
    index++;
    const kids = irChildren(n);
    for (let i = kids.length - 1; i >= 0; i--) stack.push(kids[i]);
  }
  return null;
}

/** slot → bound value for every `let` in the tree (slots are unique within one tree). */
export function collectBindings(root: IrNode): Map<number, IrNode> {
  const out = new Map<number, IrNode>();
  const stack = [root];
  while (stack.length > 0) {
    const n = stack.pop()!;
    if (n.op === 'let') out.set(n.slot, n.value);
    stack.push(...irChildren(n));
  }
  return out;
}

/** Highest slot used in the tree, plus one. */
export function slotCountOf(root: IrNode, arity = 2): number {
  let max = arity - 1;
  const stack = [root];
  while (stack.length > 0) {
    const n = stack.pop()!;
    if (n.op === 'var' || n.op === 'let') max = Math.max(max, n.slot);
    stack.push(...irChildren(n));
  }
  return max + 1;
}

/**
 * The node as a closed function of the free variables: wrapped in the `let` bindings it refers to, transitively.
 * Only slots bound *outside* the node (and outside the values pulled in) are wrapped: a `let` inside them already
 * binds its slot, and wrapping it again would bind one slot twice in one tree. Slots are unique within the tree and
 * every use of a slot lies in its let's body, so a slot bound anywhere in the collected parts is bound around all
 * of its uses there.
 */
export function closeOver(node: IrNode, bindings: ReadonlyMap<number, IrNode>, arity = 2): IrNode {
  const used = new Set<number>();
  const boundInside = new Set<number>();
  const stack = [node];
  while (stack.length > 0) {
    const n = stack.pop()!;
    if (n.op === 'let') boundInside.add(n.slot);
    if (n.op === 'var' && n.slot >= arity && !used.has(n.slot)) {
      used.add(n.slot);
      const b = bindings.get(n.slot);
      if (b) stack.push(b);
    }
    stack.push(...irChildren(n));
  }
  const needed = [...used].filter((slot) => !boundInside.has(slot));
  let body = node;
  for (const slot of needed.sort((x, y) => y - x)) {
    const value = bindings.get(slot);
    if (value) body = { op: 'let', slot, value, body, range: node.range };
  }
  return body;
}

/** Bit mask of the free variables a node depends on (bit k = slot k < arity), following bindings; memoised. */
export function dependenceOf(bindings: ReadonlyMap<number, IrNode>, arity = 2): (n: IrNode) => number {
  const memo = new Map<IrNode, number>();
  const dep = (root: IrNode): number => {
    // Iterative post-order so deep trees cannot overflow.
    const stack: { n: IrNode; done: boolean }[] = [{ n: root, done: false }];
    while (stack.length > 0) {
      const top = stack.pop()!;
      if (memo.has(top.n)) continue;
      const kids = top.n.op === 'var' && top.n.slot >= arity && bindings.has(top.n.slot)
        ? [bindings.get(top.n.slot)!] : irChildren(top.n);
      if (!top.done) {
        stack.push({ n: top.n, done: true });
        for (const c of kids) if (!memo.has(c)) stack.push({ n: c, done: false });
        continue;
      }
      let m = 0;
      if (top.n.op === 'var' && top.n.slot < arity) m = 1 << top.n.slot;
      for (const c of kids) m |= memo.get(c) ?? 0;
      memo.set(top.n, m);
    }
    return memo.get(root)!;
  };
  return dep;
}
