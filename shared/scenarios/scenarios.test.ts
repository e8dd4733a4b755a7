import { readdirSync, readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { occurrenceTableSchema } from '../contracts/occurrence-table.ts';
import { parseScenario } from '../contracts/scenario.ts';

const dir = new URL('./', import.meta.url);
const load = (name: string) => JSON.parse(readFileSync(new URL(name, dir), 'utf8'));
const scenarioFiles = readdirSync(dir).filter((f) => f.endsWith('.json') && f !== 'baseline-occurrence.json');

describe('stored scenarios and the default occurrence table', () => {
  it('the baseline table is valid and every row cites its source and says what was assumed', () => {
    const table = occurrenceTableSchema.parse(load('baseline-occurrence.json'));
    expect(table.rows.map((r) => r.class)).toEqual(['planet', 'planet', 'brownDwarf', 'star']);
    for (const row of table.rows) {
      expect(row.source?.length, row.label).toBeGreaterThan(20);
      expect(row.assumed?.length, row.label).toBeGreaterThan(20);
    }
    // Cumming et al. 2008: 10.5% for 0.3–10 MJup at 2–2000 d with dN ∝ M^-0.31 P^0.26 dlnM dlnP.
    expect(table.rows[0]).toMatchObject({ massMJup: [0.3, 10], periodDays: [2, 2000], occurrence: 0.105, shape: { massSlope: -0.31, periodSlope: 0.26 } });
    // Raghavan et al. 2010: log-normal periods, mean 5.03, σ 2.28.
    expect(table.rows[3].shape).toEqual({ kind: 'lognormalPeriod', meanLog10PeriodDays: 5.03, sigmaLog10Period: 2.28 });
  });

  it.each(scenarioFiles)('%s parses; presets carry a title and description', (name) => {
    const s = parseScenario(load(name));
    expect(s.title).toBeTruthy();
    expect(s.description).toBeTruthy();
  });

  it('presets built on the baseline table carry its rows unchanged', () => {
    const rows = load('baseline-occurrence.json').rows;
    for (const name of ['baseline-fixed-reach.json', 'baseline-track.json', 'magnitude-limited.json']) expect(load(name).companions.rows, name).toEqual(rows);
    expect(load('planets-only.json').companions.rows).toEqual(rows.slice(0, 2));
  });
});
