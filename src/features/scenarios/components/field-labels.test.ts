import { describe, expect, it } from 'vitest';
import { draftIssues, fieldKey, defaultDraft, setAt } from './scenario-draft.ts';
import { mergeIssues, rangeOrderIssues } from './draft-checks.ts';
import { fieldLabel, problemSentence } from './field-labels.ts';

const ROW = { class: 'planet', massMJup: [1, 10], periodDays: [10, 1000], occurrence: 0.1 };

describe('problems in plain words', () => {
  it('names a companion row from 1 and the end of a range, with no schema path left', () => {
    expect(fieldLabel('companions.rows[1].periodDays[0]')).toBe('Companion row 2: initial orbital period, lower end');
    expect(problemSentence('companions.rows[1].periodDays[0]', 'companions.rows[1].periodDays[0] is required')).toBe(
      'Companion row 2: initial orbital period, lower end: needs a value',
    );
    expect(fieldLabel('primaries.history.ageGyr')).toBe('Age of the population');
    expect(fieldLabel('primaries.ifmr.points[2].finalMsun')).toBe('IFMR table, final mass, point 3');
  });

  it('every message the schema gives for a broken draft reads without the dotted path', () => {
    let doc = defaultDraft('s');
    doc = setAt(doc, ['companions', 'rows'], [ROW, { ...ROW, periodDays: [null, 5] }]);
    doc = setAt(doc, ['envelope', 'alpha'], 50);
    for (const issue of draftIssues(doc)) expect(problemSentence(issue.field, issue.message)).not.toMatch(/[a-z]\.[a-z]|\[\d\]/i);
  });
});

describe('range-order checks', () => {
  it('are found while another value is still missing (the schema alone would wait)', () => {
    let doc = defaultDraft('s');
    // The same row lacks its occurrence, so the row's own order check does not run.
    doc = setAt(doc, ['companions', 'rows'], [{ ...ROW, occurrence: undefined, periodDays: [1000, 10] }]);
    doc = setAt(doc, ['systems'], 'lots');
    const schema = draftIssues(doc);
    expect(schema.map((i) => i.field)).not.toContain('companions.rows[0].periodDays');
    const all = mergeIssues(schema, rangeOrderIssues(doc, fieldKey));
    expect(all.map((i) => i.field)).toContain('companions.rows[0].periodDays');
    expect(all.map((i) => i.field)).toContain('systems');
  });

  it('are not repeated when the schema already reports the same field', () => {
    let doc = defaultDraft('s');
    doc = setAt(doc, ['primaries', 'massRangeMsun'], [5, 2]);
    const schema = draftIssues(doc);
    const all = mergeIssues(schema, rangeOrderIssues(doc, fieldKey));
    expect(all.filter((i) => i.field === 'primaries.massRangeMsun')).toHaveLength(1);
  });
});

describe("the server's answer", () => {
  it('places every listed issue at its builder field, and falls back to the single field', async () => {
    const { ApiError } = await import('../../../lib/api-client.ts');
    const { serverIssuesOf } = await import('./draft-checks.ts');
    const listed = new ApiError({
      status: 400,
      code: 'invalid_input',
      message: 'document.envelope.alpha must be between 0.01 and 10 (got 50)',
      field: 'document.envelope.alpha',
      issues: [
        { field: 'document.envelope.alpha', message: 'document.envelope.alpha must be between 0.01 and 10 (got 50)' },
        { field: 'name', message: 'name must not be empty' },
      ],
    });
    expect(serverIssuesOf(listed)).toEqual([
      { field: 'envelope.alpha', message: 'envelope.alpha must be between 0.01 and 10 (got 50)' },
      { field: 'name', message: 'name must not be empty' },
    ]);
    const single = new ApiError({ status: 409, code: 'conflict', message: 'A scenario is already called "A".', field: 'name' });
    expect(serverIssuesOf(single)).toEqual([{ field: 'name', message: 'A scenario is already called "A".' }]);
  });
});
