import { describe, expect, it } from 'vitest';
import { documentChanges } from './version-changes.ts';

describe('documentChanges', () => {
  it('lists changed, added and removed fields by path', () => {
    const before = { seed: 'a', envelope: { alpha: 1, lambda: 0.5 }, primaries: { massRangeMsun: [0.8, 8] } };
    const after = { seed: 'a', envelope: { alpha: 0.5, lambda: 0.5 }, primaries: { massRangeMsun: [1, 8] }, title: 'T' };
    expect(documentChanges(before, after)).toEqual([
      { field: 'envelope.alpha', before: '1', after: '0.5' },
      { field: 'primaries.massRangeMsun', before: '[0.8, 8]', after: '[1, 8]' },
      { field: 'title', before: '—', after: '"T"' },
    ]);
  });

  it('compares companion rows inside', () => {
    const row = { class: 'planet', occurrence: 0.1 };
    const changes = documentChanges({ companions: { rows: [row] } }, { companions: { rows: [{ ...row, occurrence: 0.2 }, row] } });
    expect(changes.map((c) => c.field)).toEqual(['companions.rows[0].occurrence', 'companions.rows[1]']);
  });

  it('finds nothing in equal documents', () => {
    expect(documentChanges({ a: { b: [1, 2] } }, { a: { b: [1, 2] } })).toEqual([]);
  });
});

describe('documentChanges of long values', () => {
  it('cuts what would not fit on a line', () => {
    const [change] = documentChanges({ rows: [] }, { rows: [{ source: 'x'.repeat(500) }] });
    expect(change.after.length).toBe(120);
    expect(change.after.endsWith('…')).toBe(true);
  });
});
