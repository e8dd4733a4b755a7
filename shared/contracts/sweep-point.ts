import { SWEEPABLE_PARAMETERS } from './scenario.ts';

/** One parameter value of a sweep's grid point, with the words the pages use for it. */
export interface SweepPointValue {
  path: string;
  label: string;
  unit: string;
  value: number;
}

/** Every grid point of the axes, row-major (the last axis varies fastest). */
export function gridPoints(axes: readonly { values: readonly number[] }[]): number[][] {
  return axes.reduce<number[][]>((points, axis) => points.flatMap((p) => axis.values.map((v) => [...p, v])), [[]]);
}

/** The parameter values of grid point `index` (0-based), or null when the index lies outside the grid. */
export function sweepPointValues(axes: readonly { path: string; values: readonly number[] }[], index: number): SweepPointValue[] | null {
  const values = gridPoints(axes)[index];
  if (!values) return null;
  return axes.map((axis, i) => {
    const known = SWEEPABLE_PARAMETERS.find((p) => p.path === axis.path);
    return { path: axis.path, label: known?.label ?? axis.path, unit: known?.unit ?? '', value: values[i] };
  });
}

/** "Occurrence multiplier = 3, Engulfment reach = 2 AU". */
export function sweepPointText(values: readonly SweepPointValue[]): string {
  return values.map((v) => `${v.label} = ${v.value}${v.unit ? ` ${v.unit}` : ''}`).join(', ');
}
