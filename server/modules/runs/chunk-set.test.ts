import { describe, expect, it } from 'vitest';
import { ChunkSet } from './chunk-set.ts';

describe('ChunkSet', () => {
  it('merges consecutive indices into ranges and round-trips through them', () => {
    const set = new ChunkSet();
    for (const i of [5, 0, 1, 2, 7, 6, 9]) set.add(i);
    expect(set.ranges()).toEqual([[0, 2], [5, 7], [9, 9]]);
    const again = new ChunkSet(set.ranges());
    expect([...again.toSet()].sort((a, b) => a - b)).toEqual([0, 1, 2, 5, 6, 7, 9]);
    expect(again.size).toBe(7);
    expect(again.has(8)).toBe(false);
  });
});
