import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { parseScenario, type ImfOptions } from '../../contracts/scenario.ts';
import { buildImfSampler, sampleImfLog10Msun } from '../physics/imf-sampler.ts';
import { chunkUniform } from '../random.ts';
import { buildFormationScreen, surelyNotWhiteDwarf } from './formation-screen.ts';
import { prepareScenario } from './prepare.ts';
import { runChunk } from './run-chunk.ts';
import { lifetimeAtLog10MassGyr, type PreparedLifetime } from './scenario-physics.ts';

const scaling: PreparedLifetime = { kind: 'scaling', t0Gyr: 10, exponent: 2.5 };
const table: PreparedLifetime = { kind: 'table', log10Mass: [0.8, 1, 2, 8].map(Math.log10), log10Gyr: [25, 10, 1.2, 0.04].map(Math.log10) };

describe('white-dwarf formation screen', () => {
  it('never rejects a primary whose exact lifetime is below the age (random u, cell edges, every IMF law)', () => {
    const u = chunkUniform('formation-screen', 0);
    for (const imf of [{ law: 'kroupa2001' }, { law: 'chabrier2003' }, { law: 'salpeter1955' }, { law: 'brokenPowerlaw', breaksMsun: [1.5], slopes: [1.3, 2.7] }] satisfies ImfOptions[]) {
      for (const lifetime of [scaling, table]) {
        const sampler = buildImfSampler(imf, [0.8, 8]);
        const screen = buildFormationScreen(sampler, lifetime);
        const wronglyRejected: number[] = [];
        const check = (v: number) => {
          const exact = lifetimeAtLog10MassGyr(lifetime, sampleImfLog10Msun(sampler, v)); // as the kernel computes it
          // The hardest ages for the screen are those just above the exact lifetime.
          for (const age of [exact * (1 + 2 ** -52), exact * 1.001]) {
            if (exact < age && surelyNotWhiteDwarf(screen, v, age)) wronglyRejected.push(v);
          }
        };
        for (let i = 0; i < 20_000; i++) check(u());
        for (let k = 0; k < screen.cells; k++) {
          check(k / screen.cells);
          check((k + 1) / screen.cells - 2 ** -32);
        }
        expect(wronglyRejected, `${imf.law} ${lifetime.kind}`).toEqual([]);
      }
    }
  });

  it('rejects the primaries below the turn-off of a burst: the share is the IMF mass fraction below it, to one cell', () => {
    // t_MS = 10 Gyr (M/Msun)^-2.5 and a 10 Gyr burst: the turn-off is 1 Msun. For dN/dM ∝ M^-2.3 on
    // [0.8, 8] (Kroupa 2001 above 0.5 Msun) the share below 1 Msun is (0.8^-1.3 − 1)/(0.8^-1.3 − 8^-1.3).
    const screen = buildFormationScreen(buildImfSampler({ law: 'kroupa2001' }, [0.8, 8]), scaling);
    const expected = (0.8 ** -1.3 - 1) / (0.8 ** -1.3 - 8 ** -1.3);
    let rejectedCells = 0;
    for (let k = 0; k < screen.cells; k++) if (surelyNotWhiteDwarf(screen, (k + 0.5) / screen.cells, 10)) rejectedCells++;
    expect(Math.abs(rejectedCells / screen.cells - expected)).toBeLessThanOrEqual(1 / screen.cells);
  });

  it('changes no count: a run with the screen equals one with the screen switched off', { timeout: 60_000 }, () => {
    for (const history of [{ kind: 'constant', ageGyr: 10 }, { kind: 'burst', ageGyr: 3 }]) {
      const doc = JSON.parse(readFileSync(new URL('../../scenarios/baseline-fixed-reach.json', import.meta.url), 'utf8'));
      const prepared = prepareScenario(parseScenario({ ...doc, systems: 100_000, primaries: { ...doc.primaries, history } }));
      const off = { ...prepared, formationScreen: { cells: 1, lifetimeFloorGyr: new Float64Array([-Infinity]) } };
      expect(runChunk(prepared, 1), history.kind).toEqual(runChunk(off, 1));
    }
  });
});
