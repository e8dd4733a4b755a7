import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { parseScenario } from '../../contracts/scenario.ts';
import { prepareScenario } from '../kernel/prepare.ts';

describe('prepared tables on shared memory', () => {
  it('a structured clone of a prepared scenario (what a worker receives) shares its tables instead of copying them', () => {
    const doc = JSON.parse(readFileSync(new URL('../../scenarios/baseline-fixed-reach.json', import.meta.url), 'utf8'));
    const prepared = prepareScenario(parseScenario(doc));
    const clone = structuredClone(prepared);
    const tables = [
      [prepared.primary.nodes, clone.primary.nodes],
      [prepared.whiteDwarfs.cumulative, clone.whiteDwarfs.cumulative],
      [prepared.rows[0].log10PeriodTable!.values, clone.rows[0].log10PeriodTable!.values],
    ] as const;
    for (const [original, cloned] of tables) {
      expect(cloned.buffer).toBeInstanceOf(SharedArrayBuffer);
      const before = original[1];
      original[1] = 12345.5;
      expect(cloned[1]).toBe(12345.5);
      original[1] = before;
    }
  });
});
