import { describe, expect, it } from 'vitest';
import { defaultDraft, draftIssues, setAt } from './scenario-draft.ts';
import {
  DISRUPTION_FIELD_CHOICE,
  GIANT_CHOICE,
  HISTORY_CHOICE,
  IFMR_CHOICE,
  IMF_CHOICE,
  LIFETIME_CHOICE,
  SELECTION_CHOICE,
  SHAPE_CHOICE,
  SUPERWIND_CHOICE,
  TIDE_CHOICE,
} from '../../../../shared/contracts/method-choices.ts';
import { newCompanionRow } from './scenario-options.ts';

describe('scenario options', () => {
  const base = defaultDraft('options-test');

  it('starts from a valid document', () => {
    expect(draftIssues(base)).toEqual([]);
  });

  // Every template, put where its union lives, must give a valid scenario: choosing an option
  // in the builder never produces an error the user did not cause.
  it.each([IMF_CHOICE, HISTORY_CHOICE, LIFETIME_CHOICE, IFMR_CHOICE, GIANT_CHOICE, DISRUPTION_FIELD_CHOICE, SELECTION_CHOICE])(
    'every template of $path.0 $discriminator is valid',
    (choice) => {
      for (const option of choice.options) {
        expect(option.template[choice.discriminator]).toBe(option.value);
        expect(draftIssues(setAt(base, choice.path, option.template))).toEqual([]);
      }
    },
  );

  it('the giant track sub-choices are valid inside a track', () => {
    const track = setAt(base, GIANT_CHOICE.path, GIANT_CHOICE.options[1].template);
    for (const choice of [SUPERWIND_CHOICE, TIDE_CHOICE]) {
      for (const option of choice.options) expect(draftIssues(setAt(track, choice.path, option.template))).toEqual([]);
    }
  });

  it('a new companion row and each shape are valid rows', () => {
    for (const shape of SHAPE_CHOICE.options) {
      const doc = setAt(base, ['companions', 'rows'], [{ ...newCompanionRow(), shape: shape.template }]);
      expect(draftIssues(doc)).toEqual([]);
    }
  });
});
