import { describe, expect, it } from 'vitest';
import { moveItem } from './move-item.ts';

describe('moveItem', () => {
  it('moves one item and keeps the others in order, without touching the list', () => {
    const list = ['a', 'b', 'c', 'd'];
    expect(moveItem(list, 0, 1)).toEqual(['b', 'a', 'c', 'd']);
    expect(moveItem(list, 3, 2)).toEqual(['a', 'b', 'd', 'c']);
    expect(moveItem(list, 1, 3)).toEqual(['a', 'c', 'd', 'b']);
    expect(list).toEqual(['a', 'b', 'c', 'd']);
  });
});
