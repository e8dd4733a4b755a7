import type { Cell, ExportColumn } from './export-table.ts';
import { TableRegistry } from './table-registry.ts';

/** What the sweep tables read of a sweep (the fields of GET /api/sweeps/:id). */
export interface SweepTableSource {
  axes: { path: string; label: string; unit: string; values: number[] }[];
  points: { index: number; values: number[]; status: string; whiteDwarfs: number | null; magnetic: number | null; fraction: number | null; fractionSe: number | null }[];
}

export const sweepTables = new TableRegistry<SweepTableSource>().register({
  name: 'curve',
  title: 'Magnetic fraction across the sweep',
  description: 'One row per grid point: the parameter values, the predicted magnetic fraction and its Monte Carlo error.',
  build: ({ axes, points }) => ({
    name: 'curve',
    title: 'Magnetic fraction across the sweep',
    description: 'One row per grid point of the sweep (row-major: the last axis varies fastest): the swept parameter values, the point\'s status, white dwarfs, magnetic white dwarfs and the magnetic fraction with its binomial Monte Carlo standard error (empty until the point has succeeded). All points share one seed (common random numbers).',
    columns: [
      { name: 'point', datatype: 'int64', description: 'index of the grid point' },
      ...axes.map((a): ExportColumn => ({ name: a.path.replace(/\./g, '_'), datatype: 'float64', unit: a.unit || undefined, description: `${a.label} (scenario field ${a.path})` })),
      { name: 'status', datatype: 'string', description: "the point's run status" },
      { name: 'white_dwarfs', datatype: 'int64', description: 'white dwarfs in the sample (empty until finished)' },
      { name: 'magnetic', datatype: 'int64', description: 'magnetic white dwarfs (empty until finished)' },
      { name: 'fraction', datatype: 'float64', description: 'magnetic / white_dwarfs' },
      { name: 'fraction_se', datatype: 'float64', description: 'Monte Carlo standard error of the fraction' },
    ],
    rows: points.map((p): Cell[] => [p.index, ...p.values, p.status, p.whiteDwarfs, p.magnetic, p.fraction, p.fractionSe]),
  }),
});
