import { SWEEPABLE_PARAMETERS, type SweepableParameter } from '../../../../shared/contracts/scenario.ts';
import { SWEEP_MAX_POINTS, SWEEP_MAX_VALUES_PER_AXIS } from '../../../../shared/contracts/sweeps.ts';
import { parseNumberList, parseNumberText } from '../../../lib/number-input.ts';

/** How the values of one axis are typed: an even grid from start to stop, or a list. */
export interface AxisDraft {
  path: string;
  mode: 'range' | 'list';
  start: string;
  stop: string;
  count: string;
  spacing: 'linear' | 'log';
  list: string;
}

export type AxisValues = { values: number[]; error?: undefined } | { values?: undefined; error: string };

export function parameterOf(path: string): SweepableParameter | undefined {
  return SWEEPABLE_PARAMETERS.find((p) => p.path === path);
}

/** Symbols for tight places (a stacked table row); the full label stays in headers and titles. */
const SYMBOLS: Record<string, string> = {
  'companions.multiplier': 'm',
  'envelope.alpha': 'α_CE',
  'envelope.lambda': 'λ',
  'disruption.eta': 'η',
  'field.thresholdMG': 'B threshold',
  'giant.reachAU': 'Reach',
  'giant.reimersEta': 'η_R',
  'primaries.history.ageGyr': 'Age',
};

/** "α_CE", "Reach (AU)": a parameter's short name with its unit, if it has one. */
export function parameterShortTitle(parameter: Pick<SweepableParameter, 'path' | 'label' | 'unit'>): string {
  const symbol = SYMBOLS[parameter.path] ?? parameter.label;
  return parameter.unit ? `${symbol} (${parameter.unit})` : symbol;
}

/** "α_CE (dimensionless)", "Engulfment reach (AU)": how an axis is titled, always with its unit. */
export function parameterTitle(parameter: Pick<SweepableParameter, 'label' | 'unit'>): string {
  return `${parameter.label} (${parameter.unit || 'dimensionless'})`;
}

/** A value as a person would write it: six significant figures at most, so that 0.1 + 0.2 reads 0.3. */
export function tidyValue(x: number): number {
  return Number(x.toPrecision(6));
}

/** `count` values from start to stop inclusive, evenly spaced in the value or in its logarithm. */
export function evenlySpaced(start: number, stop: number, count: number, spacing: 'linear' | 'log'): number[] {
  if (count === 1) return [tidyValue(start)];
  if (spacing === 'log') {
    const a = Math.log(start);
    const b = Math.log(stop);
    return Array.from({ length: count }, (_, i) => tidyValue(Math.exp(a + ((b - a) * i) / (count - 1))));
  }
  return Array.from({ length: count }, (_, i) => tidyValue(start + ((stop - start) * i) / (count - 1)));
}

const range = (p: SweepableParameter) => `${p.min} to ${p.max}${p.unit ? ` ${p.unit}` : ''}`;

/** The axis's values, or the sentence that says what is wrong with them (naming the allowed range). */
export function axisValues(draft: AxisDraft): AxisValues {
  const parameter = parameterOf(draft.path);
  if (!parameter) return { error: 'Choose a parameter to vary.' };
  let values: number[];
  if (draft.mode === 'range') {
    const start = parseNumberText(draft.start);
    const stop = parseNumberText(draft.stop);
    const count = parseNumberText(draft.count);
    if (start === null || stop === null || count === null) return { error: 'Give a start, a stop and a number of values.' };
    if (!Number.isFinite(start) || !Number.isFinite(stop)) return { error: `Start and stop must be numbers from ${range(parameter)}.` };
    if (!Number.isInteger(count) || count < 2 || count > SWEEP_MAX_VALUES_PER_AXIS) return { error: `The number of values must be a whole number from 2 to ${SWEEP_MAX_VALUES_PER_AXIS} (got ${draft.count.trim()}).` };
    if (start === stop) return { error: 'Start and stop must differ.' };
    if (draft.spacing === 'log' && !(start > 0 && stop > 0)) return { error: 'Logarithmic spacing needs a start and stop above 0.' };
    values = evenlySpaced(start, stop, count, draft.spacing);
  } else {
    values = parseNumberList(draft.list);
    if (values.some((v) => !Number.isFinite(v))) return { error: 'The list must hold numbers only, separated by commas or spaces.' };
    if (values.length < 2 || values.length > SWEEP_MAX_VALUES_PER_AXIS) return { error: `List from 2 to ${SWEEP_MAX_VALUES_PER_AXIS} values (got ${values.length}).` };
    if (new Set(values).size !== values.length) return { error: 'Each value may appear once.' };
  }
  const outside = values.find((v) => v < parameter.min || v > parameter.max);
  if (outside !== undefined) return { error: `${parameter.label} must be from ${range(parameter)} (got ${outside}).` };
  return { values };
}

/** Grid points of the axes (the product of their lengths), or null while an axis has no values. */
export function gridPointCount(axes: readonly AxisValues[]): number | null {
  if (axes.some((a) => !a.values)) return null;
  return axes.reduce((n, a) => n * (a.values?.length ?? 0), 1);
}

export function gridTooLarge(points: number | null): string | null {
  return points !== null && points > SWEEP_MAX_POINTS ? `The grid has ${points} points; a sweep may have at most ${SWEEP_MAX_POINTS}.` : null;
}

/** The value at a dotted path of a resolved scenario document, or undefined where the path does not exist. */
export function valueAt(document: Record<string, unknown> | undefined, path: string): unknown {
  let node: unknown = document;
  for (const key of path.split('.')) {
    if (node === null || typeof node !== 'object') return undefined;
    node = (node as Record<string, unknown>)[key];
  }
  return node;
}

/** Whether the scenario has the parameter (giant.reachAU only with a fixed reach, say). */
export function parameterApplies(document: Record<string, unknown> | undefined, path: string): boolean {
  return typeof valueAt(document, path) === 'number';
}

/**
 * The server names a bad axis value "axes[0].values[2]"; the form shows it at the axis's
 * values ("axes.0.values"). Other fields keep their names with dots ("axes.1.path", "systems").
 */
export function sweepFieldKey(field: string): string {
  const dotted = field.replace(/\[(\d+)\]/g, '.$1');
  return dotted.replace(/^(axes\.\d+\.values)\.\d+$/, '$1');
}

/**
 * A fresh axis for `path`: five values from half to twice the scenario's own value (within the
 * allowed range), or across the whole range when the scenario has none to start from.
 */
export function newAxisDraft(path: string, current?: unknown): AxisDraft {
  const parameter = parameterOf(path);
  const draft: AxisDraft = { path, mode: 'range', start: '', stop: '', count: '5', spacing: 'linear', list: '' };
  if (!parameter) return draft;
  const clamp = (x: number) => tidyValue(Math.min(parameter.max, Math.max(parameter.min, x)));
  const around = typeof current === 'number' && current > 0;
  return { ...draft, start: String(around ? clamp(current / 2) : parameter.min), stop: String(around ? clamp(current * 2) : parameter.max) };
}

/** The inputs of one axis that can be in error. */
export type AxisField = 'start' | 'stop' | 'count' | 'list';
export type AxisFieldErrors = Partial<Record<AxisField, string>>;

/**
 * Every problem of an axis's inputs at once, each at the input it belongs to (start, stop,
 * number of values, or the list), so that the form shows them all on the first Start.
 */
export function axisFieldErrors(draft: AxisDraft): AxisFieldErrors {
  const parameter = parameterOf(draft.path);
  if (!parameter) return {};
  const errors: AxisFieldErrors = {};
  const allowed = range(parameter);
  if (draft.mode === 'list') {
    const result = axisValues(draft);
    if (result.error) {
      const values = parseNumberList(draft.list);
      const outside = values.filter((v) => Number.isFinite(v) && (v < parameter.min || v > parameter.max));
      errors.list = outside.length > 1 ? `${parameter.label} must be from ${allowed} (got ${outside.join(', ')}).` : result.error;
    }
    return errors;
  }
  const end = (name: 'Start' | 'Stop', text: string): number | null => {
    const value = parseNumberText(text);
    const key = name === 'Start' ? 'start' : 'stop';
    if (value === null) errors[key] = `Give a ${name.toLowerCase()} from ${allowed}.`;
    else if (!Number.isFinite(value)) errors[key] = `${name} must be a number from ${allowed} (got “${text.trim()}”).`;
    else if (value < parameter.min || value > parameter.max) errors[key] = `${name} must be from ${allowed} (got ${value}).`;
    else if (draft.spacing === 'log' && !(value > 0)) errors[key] = `Logarithmic spacing needs a ${name.toLowerCase()} above 0.`;
    else return value;
    return null;
  };
  const start = end('Start', draft.start);
  const stop = end('Stop', draft.stop);
  const count = parseNumberText(draft.count);
  if (count === null || !Number.isInteger(count) || count < 2 || count > SWEEP_MAX_VALUES_PER_AXIS) {
    errors.count = `The number of values must be a whole number from 2 to ${SWEEP_MAX_VALUES_PER_AXIS}${draft.count.trim() ? ` (got ${draft.count.trim()})` : ''}.`;
  }
  if (start !== null && stop !== null && start === stop) errors.stop = 'Stop must differ from start.';
  return errors;
}
