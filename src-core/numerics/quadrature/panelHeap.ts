/**
 * A binary max-heap of panels keyed by their error estimate (J. W. J. Williams, "Algorithm 232: Heapsort",
 * Comm. ACM 7 (1964)): the adaptive integrator always bisects the panel with the largest estimated error, as
 * QUADPACK's QAG does with its ordered error list.
 */

export interface Panel {
  readonly a: number;
  readonly b: number;
  readonly re: number;
  readonly im: number;
  readonly error: number;
}

export class PanelHeap {
  private readonly items: Panel[] = [];

  get size(): number {
    return this.items.length;
  }

  push(panel: Panel): void {
    const items = this.items;
    items.push(panel);
    let i = items.length - 1;
    while (i > 0) {
      const parent = (i - 1) >> 1;
      if (items[parent].error >= items[i].error) break;
      [items[parent], items[i]] = [items[i], items[parent]];
      i = parent;
    }
  }

  /** Removes and returns the panel with the largest error (undefined when empty). */
  pop(): Panel | undefined {
    const items = this.items;
    if (items.length === 0) return undefined;
    const top = items[0];
    const last = items.pop() as Panel;
    if (items.length > 0) {
      items[0] = last;
      let i = 0;
      for (;;) {
        const l = 2 * i + 1;
        const r = l + 1;
        let m = i;
        if (l < items.length && items[l].error > items[m].error) m = l;
        if (r < items.length && items[r].error > items[m].error) m = r;
        if (m === i) break;
        [items[m], items[i]] = [items[i], items[m]];
        i = m;
      }
    }
    return top;
  }

  /** All panels, in no particular order. */
  all(): readonly Panel[] {
    return this.items;
  }
}
