import { describe, expect, it } from 'vitest';
import { SHAPE_CHOICE } from '../../shared/contracts/method-choices.ts';
import { OCCURRENCE_CSV_COLUMNS } from '../../shared/contracts/occurrence-tables-api.ts';
import { MASS_UNIT_KEYS, readRowCells } from '../../shared/contracts/occurrence-row-cells.ts';
import { MASS_UNITS, SHAPE_SHORT_OPTIONS, shapeParameters } from './companion-rows.tsx';

describe('the companion-row vocabulary both row editors use', () => {
  it('offers, for each distribution shape, exactly the parameters its declared template carries', () => {
    // The templates in shared/contracts/method-choices.ts are checked against the row schema by scenario-options.test.ts.
    for (const option of SHAPE_CHOICE.options) {
      const fields = Object.keys(option.template).filter((k) => k !== 'kind');
      expect(shapeParameters(option.value).map((p) => p.key)).toEqual(fields);
      for (const p of shapeParameters(option.value)) expect(OCCURRENCE_CSV_COLUMNS).toContain(p.key);
    }
    expect(SHAPE_SHORT_OPTIONS.map((o) => o.value)).toEqual(SHAPE_CHOICE.options.map((o) => o.value));
  });

  it('reads a missing or unknown shape as a power law, as the shared row reader does', () => {
    expect(shapeParameters(undefined).map((p) => p.key)).toEqual(['massSlope', 'periodSlope']);
    expect(shapeParameters('').map((p) => p.key)).toEqual(['massSlope', 'periodSlope']);
  });

  it('names the mass units the row reader accepts, each with the row field it fills', () => {
    expect(Object.fromEntries(MASS_UNITS.map((u) => [u.value, u.key]))).toEqual(MASS_UNIT_KEYS);
    const cells = { class: 'planet', massMin: '0.1', massMax: '0.5', periodMinDays: '10', periodMaxDays: '100', occurrence: '0.1' };
    for (const unit of MASS_UNITS) {
      const read = readRowCells({ ...cells, massUnit: unit.value });
      expect(read.ok && Object.keys(read.row)).toContain(unit.key);
    }
  });
});
