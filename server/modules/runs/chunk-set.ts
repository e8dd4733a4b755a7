/**
 * The set of finished chunk indices of a run, stored as sorted, merged [first, last] ranges:
 * chunks finish roughly in order, so a run of 150,000 chunks is a handful of ranges, not a list.
 */
export class ChunkSet {
  private readonly done = new Set<number>();

  constructor(ranges: readonly (readonly [number, number])[] = []) {
    for (const [first, last] of ranges) for (let i = first; i <= last; i++) this.done.add(i);
  }

  add(index: number): void {
    this.done.add(index);
  }

  has(index: number): boolean {
    return this.done.has(index);
  }

  get size(): number {
    return this.done.size;
  }

  toSet(): Set<number> {
    return new Set(this.done);
  }

  ranges(): [number, number][] {
    const sorted = [...this.done].sort((a, b) => a - b);
    const out: [number, number][] = [];
    for (const i of sorted) {
      const last = out[out.length - 1];
      if (last && i === last[1] + 1) last[1] = i;
      else out.push([i, i]);
    }
    return out;
  }
}
