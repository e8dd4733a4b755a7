import { describe, expect, it } from 'vitest';
import { OCCURRENCE_CSV_COLUMNS } from '../../../shared/contracts/occurrence-tables-api.ts';
import { nearestColumn } from './column-suggestion.ts';

describe('nearestColumn', () => {
  it('suggests the column a renamed header most likely meant', () => {
    expect(nearestColumn('kind', OCCURRENCE_CSV_COLUMNS)).toBe('class');
    expect(nearestColumn('mass_unit', OCCURRENCE_CSV_COLUMNS)).toBe('massUnit');
    expect(nearestColumn('ocurrence', OCCURRENCE_CSV_COLUMNS)).toBe('occurrence');
    expect(nearestColumn('period_min_days', OCCURRENCE_CSV_COLUMNS)).toBe('periodMinDays');
  });

  it('suggests nothing for a header unlike any column', () => {
    expect(nearestColumn('temperature', OCCURRENCE_CSV_COLUMNS)).toBeNull();
  });
});
