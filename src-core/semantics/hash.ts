/**
 * A stable fingerprint of a kernel's resolved definition (domain and IR without source ranges), so that results
 * can be cached and an edit that does not change the mathematics (formatting, comments, renaming a constant)
 * does not trigger recomputation. cyrb53-style 53-bit mixing, run twice with different seeds for 106 bits.
 */
import type { IrNode } from './ir';

/** A number as text that tells -0 from 0 (String(-0) is "0", yet 1/-0 = -∞ and 1/0 = ∞). */
function numberKey(x: number): string {
  return Object.is(x, -0) ? '-0' : String(x);
}

export function canonicalIr(root: IrNode): string {
  const out: string[] = [];
  const stack: (IrNode | string)[] = [root];
  while (stack.length > 0) {
    const n = stack.pop()!;
    if (typeof n === 'string') {
      out.push(n);
      continue;
    }
    switch (n.op) {
      case 'const': out.push(`c(${numberKey(n.re)},${numberKey(n.im)})`); break;
      case 'var': out.push(`v${n.slot}`); break;
      case 'neg': case 'not': out.push(`${n.op}(`); stack.push(')', n.a); break;
      case 'call': {
        out.push(`${n.fn}(`);
        stack.push(')');
        for (let k = n.args.length - 1; k >= 0; k--) stack.push(n.args[k], k > 0 ? ',' : '');
        break;
      }
      case 'cond': out.push('cond('); stack.push(')', n.otherwise, ',', n.then, ',', n.test); break;
      case 'let': out.push(`let${n.slot}(`); stack.push(')', n.body, ',', n.value); break;
      default: out.push(`${n.op}(`); stack.push(')', n.b, ',', n.a); break;
    }
  }
  return out.join('');
}

function mix(text: string, seed: number): number {
  let h1 = 0xdeadbeef ^ seed;
  let h2 = 0x41c6ce57 ^ seed;
  for (let i = 0; i < text.length; i++) {
    const ch = text.charCodeAt(i);
    h1 = Math.imul(h1 ^ ch, 2654435761);
    h2 = Math.imul(h2 ^ ch, 1597334677);
  }
  h1 = Math.imul(h1 ^ (h1 >>> 16), 2246822507) ^ Math.imul(h2 ^ (h2 >>> 13), 3266489909);
  h2 = Math.imul(h2 ^ (h2 >>> 16), 2246822507) ^ Math.imul(h1 ^ (h1 >>> 13), 3266489909);
  return 4294967296 * (2097151 & h2) + (h1 >>> 0);
}

export function hashText(text: string): string {
  return mix(text, 1).toString(16).padStart(14, '0') + mix(text, 2).toString(16).padStart(14, '0');
}
