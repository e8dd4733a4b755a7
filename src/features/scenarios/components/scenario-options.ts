import type { DraftPath } from './scenario-draft.ts';
import type { MethodChoice, MethodOption } from '../../../../shared/contracts/method-choices.ts';
import { SHAPE_CHOICE } from '../../../../shared/contracts/method-choices.ts';

/**
 * The builder's view of the scenario's choices between published methods. Each choice (label,
 * summary, citations, starting values) is declared once in shared/contracts/method-choices.ts,
 * which the methods paragraph reads too; the builder imports the choices from there.
 */
export type KindOption = MethodOption;
export type KindChoice = MethodChoice & { path: DraftPath };

export const CALIBRATION_OPTIONS = [
  { value: 'mist', label: 'MIST-based' },
  { value: 'parsec', label: 'PARSEC-based' },
] as const;

/** A row's distribution shapes (the options of SHAPE_CHOICE). */
export const SHAPE_OPTIONS: readonly KindOption[] = SHAPE_CHOICE.options;

export const COMPANION_CLASS_OPTIONS = [
  { value: 'planet', label: 'Planet' },
  { value: 'brownDwarf', label: 'Brown dwarf' },
  { value: 'star', label: 'Low-mass star' },
] as const;

/** The three ways a row may give its mass range; exactly one is used. */
export const MASS_UNITS = [
  { key: 'massMJup', value: 'MJup', label: 'Jupiter masses', unit: 'MJup' },
  { key: 'massMsun', value: 'Msun', label: 'Solar masses', unit: 'Msun' },
  { key: 'massRatio', value: 'q', label: 'Mass ratio q = M2/M1', unit: 'q' },
] as const;
export type MassKey = (typeof MASS_UNITS)[number]['key'];

/** The mass key a row uses (the first present; a new row starts in Jupiter masses). */
export function massKeyOf(row: Record<string, unknown>): MassKey {
  return MASS_UNITS.find((u) => row[u.key] !== undefined)?.key ?? 'massMJup';
}

/** A new companion row: a log-uniform band of giant planets, to be edited. */
export function newCompanionRow(): Record<string, unknown> {
  return {
    label: 'New row',
    class: 'planet',
    massMJup: [1, 10],
    periodDays: [10, 1000],
    occurrence: 0.05,
    shape: { kind: 'powerlaw', massSlope: 0, periodSlope: 0 },
  };
}

export function optionOf(options: readonly KindOption[], value: unknown): KindOption | undefined {
  return options.find((o) => o.value === value);
}

