import type { Piscina } from 'piscina';
import type { Scenario } from '../../../shared/contracts/scenario.ts';
import type { EngulfmentGrid } from '../../../shared/engine/kernel/engulfment.ts';
import { engulfmentGridInputFor } from '../../../shared/engine/kernel/engulfment.ts';
import { buildEngulfmentGrid, engulfmentGridKey } from '../../../shared/engine/physics/engulfment-grid.ts';
import type { Db } from '../../db/client.ts';
import { findGrid, saveGrid } from './runs.repository.ts';

/**
 * The `track` giant's engulfment grid for a scenario: read from the engulfment_grids cache by
 * the hash of its physics inputs, or built once on the worker pool and stored.
 */
export function createGridResolver(db: Db, pool: Piscina | undefined) {
  const building = new Map<string, Promise<EngulfmentGrid>>();
  return async (scenario: Scenario): Promise<EngulfmentGrid | undefined> => {
    if (scenario.giant.kind !== 'track') return undefined;
    const input = engulfmentGridInputFor(scenario);
    const key = engulfmentGridKey(input);
    const cached = await findGrid(db, key);
    if (cached) return JSON.parse(cached.grid) as EngulfmentGrid;
    let pending = building.get(key);
    if (!pending) {
      pending = (async () => {
        const started = performance.now();
        const grid = pool
          ? ((await pool.run({ input }, { name: 'buildEngulfmentGrid' })) as EngulfmentGrid)
          : buildEngulfmentGrid(input);
        await saveGrid(db, key, JSON.stringify(grid), Math.round(performance.now() - started));
        return grid;
      })().finally(() => building.delete(key));
      building.set(key, pending);
    }
    return pending;
  };
}
