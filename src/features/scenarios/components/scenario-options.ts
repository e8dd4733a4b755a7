import { getAt, type DraftPath } from './scenario-draft.ts';
import { optionOf, SHAPE_CHOICE, type MethodChoice, type MethodOption, type ValueOf } from '../../../../shared/contracts/method-choices.ts';

/**
 * The builder's view of the scenario's choices between published methods. Each choice (values,
 * labels, summary, citations, starting values) is declared once in shared/contracts/method-choices.ts
 * (the published IFMRs and Cummings et al.'s calibrations in ifmr-relations.ts), which the
 * methods paragraph reads too; the builder imports the choices from there and repeats none of them.
 */
export type KindOption = MethodOption;
export type KindChoice = MethodChoice & { path: DraftPath };

/**
 * The option a document chose, typed as one of the choice's values (undefined when it names none),
 * so that a section's test for a variant is checked against the declaration. `at` is where the
 * union sits when it is not the choice's own path (a row's shape).
 */
export function chosenValue<C extends MethodChoice>(doc: unknown, choice: C, at: DraftPath = choice.path): ValueOf<C> | undefined {
  return optionOf(choice, getAt(doc, [...at, choice.discriminator]))?.value as ValueOf<C> | undefined;
}

/** A new companion row: a log-uniform band of giant planets, to be edited. */
export function newCompanionRow(): Record<string, unknown> {
  return {
    label: 'New row',
    class: 'planet',
    massMJup: [1, 10],
    periodDays: [10, 1000],
    occurrence: 0.05,
    shape: structuredClone(SHAPE_CHOICE.options[0].template),
  };
}
