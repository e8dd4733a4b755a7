import { describe, expect, it } from 'vitest';
import { parseScenario } from '../../contracts/scenario.ts';
import { MJUP_MSUN } from '../constants.ts';
import { buildEngulfmentGrid, criticalSeparationAU, engulfmentGridKey } from '../physics/engulfment-grid.ts';
import { buildResult } from '../result/build-result.ts';
import { engulfmentGridInputFor } from './engulfment.ts';
import { prepareScenario } from './prepare.ts';
import { runChunk } from './run-chunk.ts';
import { addTally, emptyTallyFor } from './tally.ts';

const scenario = parseScenario({
  seed: 'track-wiring',
  systems: 400_000,
  primaries: { imf: { law: 'salpeter1955' }, massRangeMsun: [1, 4], history: { kind: 'burst', ageGyr: 12 }, ifmr: { relation: 'kalirai2008' } },
  companions: { multiplier: 1, rows: [{ class: 'planet', massMJup: [0.5, 5], periodDays: [50, 5000], occurrence: 1 }] },
  giant: { kind: 'track' },
  envelope: { alpha: 1, lambda: 0.5 },
});

describe('giant.kind = "track" wiring', { timeout: 60_000 }, () => {
  const input = engulfmentGridInputFor(scenario);
  const grid = buildEngulfmentGrid(input);

  it('asks for a grid over the white-dwarf progenitors and the rows’ companion masses', () => {
    expect(input.primaryMassesMsun[0]).toBeCloseTo(1, 6); // every primary of 1–4 Msun is a white dwarf at 12 Gyr
    expect(input.primaryMassesMsun[input.primaryMassesMsun.length - 1]).toBeCloseTo(4, 6);
    expect(input.companionMassesMsun[0]).toBeCloseTo(0.5 * MJUP_MSUN, 8);
    expect(input.finalCoreMassesMsun[0]).toBeCloseTo(0.109 + 0.394, 8);
    const prepared = prepareScenario(scenario, { engulfmentGrid: grid });
    expect(prepared.giant.kind === 'track' && prepared.giant.gridKey).toBe(engulfmentGridKey(input));
    expect(structuredClone(prepared)).toEqual(prepared);
  });

  it('engulfs exactly the companions inside a_crit(M1, M2): the engulfed share matches quadrature over the grid', () => {
    const prepared = prepareScenario(scenario, { engulfmentGrid: grid });
    let tally = emptyTallyFor(prepared.scenarioHash);
    for (let i = 0; i < prepared.chunkCount; i++) tally = addTally(tally, runChunk(prepared, i));
    const result = buildResult(scenario, tally, { prepared });
    const fates = result.counts.companionFates;
    const n = fates.wide + fates.postCE + fates.disrupted + fates.merged;
    expect(n).toBe(400_000); // occurrence 1: every white dwarf has one companion
    const engulfed = (fates.postCE + fates.disrupted + fates.merged) / n;

    // Quadrature: M1 ∝ M^-2.35 on [1, 4] (in ln M: M^-1.35), M2 and P log-uniform; engulfed iff a0 < a_crit.
    const k = 120;
    let num = 0;
    let den = 0;
    for (let i = 0; i < k; i++) {
      const m1 = Math.exp(Math.log(1) + ((i + 0.5) / k) * Math.log(4));
      const w1 = Math.pow(m1, -1.35);
      for (let j = 0; j < k; j++) {
        const m2 = Math.exp(Math.log(0.5) + ((j + 0.5) / k) * Math.log(10)) * MJUP_MSUN;
        const aCrit = criticalSeparationAU(grid, m1, m2);
        // fraction of log-uniform periods in [50, 5000] d whose Kepler separation is below a_crit
        const pCrit = ((2 * Math.PI) / 0.01720209895) * Math.sqrt((aCrit * aCrit * aCrit) / (m1 + m2)); // Kepler, Gaussian constant
        const f = Math.min(1, Math.max(0, Math.log(pCrit / 50) / Math.log(100)));
        num += w1 * f;
        den += w1;
      }
    }
    const expected = num / den;
    const se = Math.sqrt((expected * (1 - expected)) / n);
    // Midpoint quadrature on a 120 × 120 grid is good to ~1e-4 here, below 3 SE ≈ 2e-3.
    expect(Math.abs(engulfed - expected)).toBeLessThan(3 * se + 2e-4);
    expect(engulfed).toBeGreaterThan(0.05);
    expect(engulfed).toBeLessThan(0.95);
  });
});
