import type { VisualizationSpec } from 'vega-embed';
import type { ScenarioResult } from '../../../../shared/contracts/result.ts';
import { decadeAxis } from '../../../components/charts/log-axis.ts';
import { FATE_SERIES } from '../../../components/charts/result-series.ts';

type FateMap = ScenarioResult['bins']['fateMap'];

export interface FateCell {
  massLo: number;
  massHi: number;
  periodLo: number;
  periodHi: number;
  total: number;
  /** The most common fate in the cell (the first of equals, in FATE_SERIES order). */
  dominant: string;
  /** Its share of the cell's companions. */
  dominantShare: number;
  /** log10(total) / log10(largest total): how strongly the cell is drawn. */
  weight: number;
  wide: number;
  postCE: number;
  disrupted: number;
  dissolved: number;
  /** Engine-1 results only (0 otherwise). */
  merged: number;
  massRange: string;
  periodRange: string;
}

const tidy = (x: number) => String(Number(x.toPrecision(2)));

/** One cell per (companion mass, initial period) bin that holds any companion. */
export function fateCells(map: FateMap): FateCell[] {
  const index = new Map(map.fates.map((fate, i) => [fate, i]));
  const countOf = (fate: string, m: number, p: number) => {
    const i = index.get(fate as FateMap['fates'][number]);
    return i === undefined ? 0 : (map.counts[i]?.[m]?.[p] ?? 0);
  };
  const cells: Omit<FateCell, 'weight'>[] = [];
  for (let m = 0; m + 1 < map.log10MassEdgesMsun.length; m++) {
    for (let p = 0; p + 1 < map.log10PeriodEdgesDays.length; p++) {
      const byFate = Object.fromEntries(FATE_SERIES.map((f) => [f.key, countOf(f.key, m, p)])) as Record<(typeof FATE_SERIES)[number]['key'], number>;
      const total = FATE_SERIES.reduce((sum, f) => sum + byFate[f.key], 0);
      if (total === 0) continue;
      const top = FATE_SERIES.reduce((best, f) => (byFate[f.key] > byFate[best.key] ? f : best), FATE_SERIES[0]);
      const massLo = 10 ** map.log10MassEdgesMsun[m];
      const massHi = 10 ** map.log10MassEdgesMsun[m + 1];
      const periodLo = 10 ** map.log10PeriodEdgesDays[p];
      const periodHi = 10 ** map.log10PeriodEdgesDays[p + 1];
      cells.push({
        massLo,
        massHi,
        periodLo,
        periodHi,
        total,
        dominant: top.short,
        dominantShare: byFate[top.key] / total,
        ...byFate,
        massRange: `${tidy(massLo)}–${tidy(massHi)} Msun`,
        periodRange: `${tidy(periodLo)}–${tidy(periodHi)} d`,
      });
    }
  }
  const largest = Math.max(1, ...cells.map((c) => c.total));
  // Log weighting: cells span many decades of counts, and a linear scale would hide all but a few.
  return cells.map((c) => ({ ...c, weight: largest === 1 ? 1 : Math.log10(c.total + 1) / Math.log10(largest + 1) }));
}

/** Companion mass × initial period, each cell coloured by the companions' most common fate and drawn fainter where few fell. */
export function fateMapSpec(map: FateMap): VisualizationSpec {
  const cells = fateCells(map);
  // The axes span the occupied cells only; the grid covers far more of the plane than any scenario fills.
  const massDomain = cells.length ? [Math.min(...cells.map((c) => c.massLo)), Math.max(...cells.map((c) => c.massHi))] : [1e-4, 10];
  const periodDomain = cells.length ? [Math.min(...cells.map((c) => c.periodLo)), Math.max(...cells.map((c) => c.periodHi))] : [0.1, 1e11];
  const massAxis = decadeAxis(Math.log10(massDomain[0]), Math.log10(massDomain[1]));
  const periodAxis = decadeAxis(Math.log10(periodDomain[0]), Math.log10(periodDomain[1]), 7);
  return {
    height: 320,
    data: { values: cells },
    mark: { type: 'rect', stroke: null },
    encoding: {
      x: { field: 'massLo', type: 'quantitative', title: 'Companion mass (Msun, log scale)', scale: { type: 'log', nice: false, domain: massDomain }, axis: massAxis },
      x2: { field: 'massHi' },
      y: { field: 'periodLo', type: 'quantitative', title: 'Initial orbital period (days, log scale)', scale: { type: 'log', nice: false, domain: periodDomain }, axis: periodAxis },
      y2: { field: 'periodHi' },
      color: {
        field: 'dominant',
        type: 'nominal',
        // The card lists the fates with their colours and counts below the chart.
        legend: null,
        scale: { domain: FATE_SERIES.map((f) => f.short), range: FATE_SERIES.map((f) => f.colour) },
      },
      opacity: { field: 'weight', type: 'quantitative', scale: { domain: [0, 1], range: [0.25, 1] }, legend: null },
      tooltip: [
        { field: 'massRange', title: 'Companion mass' },
        { field: 'periodRange', title: 'Initial period' },
        { field: 'total', title: 'Companions', format: ',' },
        ...FATE_SERIES.map((f) => ({ field: f.key, title: f.label, format: ',' })),
      ],
    },
  } as VisualizationSpec;
}
