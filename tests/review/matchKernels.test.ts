/** Which old kernel became which new one (src-core/review/matchKernels.ts). */
import { describe, expect, it } from 'vitest';
import { matchKernels, type KernelIdentity } from '@kernwright/core';

const k = (name: string, hash: string | null): KernelIdentity => ({ name, hash });

function check(oldK: KernelIdentity[], newK: KernelIdentity[], expected: string[]): void {
  const got = matchKernels(oldK, newK, (x) => x).map((p) => {
    switch (p.kind) {
      case 'added': return `+${p.new.name}`;
      case 'removed': return `-${p.old.name}`;
      case 'renamed': return `${p.old.name}->${p.new.name}`;
      case 'same-name': return `=${p.new.name}`;
    }
  });
  expect(got).toEqual(expected);
}

describe('matchKernels', () => {
  it('pairs by name first, whatever the hashes', () => check([k('a', '1'), k('b', '2')], [k('b', '9'), k('a', '1')], ['=b', '=a']));
  it('finds a rename by the hash of the definition', () => check([k('a', '1'), k('b', '2')], [k('c', '1'), k('b', '2')], ['a->c', '=b']));
  it('does not take a copy for a rename when the original is still there', () => check([k('a', '1')], [k('a', '1'), k('c', '1')], ['=a', '+c']));
  it('matches each old kernel once, in file order', () => check([k('a', '1'), k('b', '1')], [k('c', '1'), k('d', '1'), k('e', '1')], ['a->c', 'b->d', '+e']));
  it('never renames definitions with errors (no hash)', () => check([k('a', null)], [k('b', null)], ['+b', '-a']));
  it('lists new kernels in order, then the removed ones', () => check([k('x', '1'), k('y', '2')], [k('z', '3')], ['+z', '-x', '-y']));
});
