import type { DraftPath } from './scenario-draft.ts';
import type { MethodChoice, MethodOption } from '../../../../shared/contracts/method-choices.ts';

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

