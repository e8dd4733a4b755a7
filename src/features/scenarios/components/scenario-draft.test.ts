import { describe, expect, it } from 'vitest';
import {
  withDefaults,
  allowedRange,
  allowedText,
  atFieldMessage,
  defaultDraft,
  draftIssues,
  getAt,
  inputId,
  messagesByField,
  newSeed,
  parseDraftJson,
  runSystems,
  sameDocument,
  serverErrorTarget,
  setAt,
} from './scenario-draft.ts';

describe('draft paths', () => {
  it('reads and writes along a path without touching the original', () => {
    const doc = { envelope: { alpha: 1, lambda: 0.5 }, companions: { rows: [{ occurrence: 0.1 }] } };
    const next = setAt(doc, ['companions', 'rows', 0, 'occurrence'], 0.2);
    expect(getAt(next, ['companions', 'rows', 0, 'occurrence'])).toBe(0.2);
    expect(doc.companions.rows[0].occurrence).toBe(0.1);
    expect(next.envelope).toBe(doc.envelope);
  });

  it('removes a key for undefined and creates missing containers', () => {
    expect(setAt({ a: { b: 1, c: 2 } }, ['a', 'b'], undefined)).toEqual({ a: { c: 2 } });
    expect(setAt({}, ['x', 0], 5)).toEqual({ x: [5] });
  });

  it('makes ids that are valid and unique per path', () => {
    expect(inputId(['companions', 'rows', 2, 'occurrence'])).toBe('scenario-companions-rows-2-occurrence');
    expect(inputId('envelope.alpha')).toBe('scenario-envelope-alpha');
  });
});

describe('draft validation', () => {
  it('names the field and both ends of its range', () => {
    const doc = setAt(defaultDraft('t'), ['envelope', 'alpha'], 50);
    expect(draftIssues(doc)).toEqual([{ field: 'envelope.alpha', message: 'envelope.alpha must be between 0.01 and 10 (got 50)' }]);
    expect(messagesByField(draftIssues(doc)).get('envelope.alpha')).toBe('Must be between 0.01 and 10 (got 50)');
  });

  it('finds a row problem at the row field', () => {
    const doc = setAt(defaultDraft('t'), ['companions', 'rows'], [
      { class: 'planet', massMJup: [1, 2], periodDays: [10, 100], occurrence: 1.5 },
    ]);
    expect(messagesByField(draftIssues(doc)).get('companions.rows[0].occurrence')).toBe('Must be between 0 and 1 (got 1.5)');
  });

  it('strips the server’s document prefix from its message', () => {
    expect(atFieldMessage('envelope.alpha', 'document.envelope.alpha must be between 0.01 and 10 (got 50)')).toBe('Must be between 0.01 and 10 (got 50)');
    expect(atFieldMessage('name', 'name must not be empty')).toBe('Must not be empty');
    expect(atFieldMessage('rows.0.occurrence', 'rows.0.occurrence: Too big')).toBe('Too big');
  });

  it('sends server fields to the document or the form', () => {
    expect(serverErrorTarget('document.companions.rows[0].occurrence')).toEqual({ kind: 'document', field: 'companions.rows[0].occurrence' });
    expect(serverErrorTarget('document')).toEqual({ kind: 'document', field: 'scenario' });
    expect(serverErrorTarget('name')).toEqual({ kind: 'form', field: 'name' });
    expect(serverErrorTarget(undefined)).toBeNull();
  });

  it('reads bounds from the schema for the chosen union member', () => {
    const doc = defaultDraft('t');
    expect(allowedText(allowedRange(doc, ['envelope', 'alpha']))).toBe('0.01 to 10');
    expect(allowedText(allowedRange(doc, ['systems']))).toBe('a whole number from 1000 to 1e10');
    const track = setAt(doc, ['giant'], { kind: 'track' });
    expect(allowedText(allowedRange(track, ['giant', 'reimersEta']))).toBe('0.05 to 3');
    expect(allowedRange(doc, ['giant', 'reimersEta'])).toBeNull();
  });
});

describe('draft helpers', () => {
  it('fills every default into a blank draft', () => {
    const doc = defaultDraft('seed-1');
    expect(doc.seed).toBe('seed-1');
    expect(getAt(doc, ['disruption', 'eta'])).toBe(2.44);
    expect(getAt(doc, ['companions', 'rows'])).toEqual([]);
  });

  it('compares documents regardless of key order', () => {
    expect(sameDocument({ a: 1, b: { c: 2, d: 3 } }, { b: { d: 3, c: 2 }, a: 1 })).toBe(true);
    expect(sameDocument({ a: [1, 2] }, { a: [2, 1] })).toBe(false);
  });

  it('compares a draft holding NaN without throwing (text typed into a number field crashed the builder)', () => {
    expect(sameDocument({ envelope: { alpha: Number.NaN } }, { envelope: { alpha: 1 } })).toBe(false);
    expect(sameDocument({ rows: [[Number.NaN, 2]] }, { rows: [[Number.NaN, 2]] })).toBe(true);
  });

  it('reads pasted JSON or says why it cannot', () => {
    expect(parseDraftJson('{"seed":"x"}')).toEqual({ ok: true, doc: { seed: 'x' } });
    expect(parseDraftJson('[1]')).toMatchObject({ ok: false });
    expect(parseDraftJson('{seed:')).toMatchObject({ ok: false, message: expect.stringContaining('JSON cannot be read') });
  });

  it('quotes only valid run sizes', () => {
    expect(runSystems({ systems: 1e6 })).toBe(1e6);
    expect(runSystems({ systems: 999 })).toBeNull();
    expect(runSystems({ systems: 1.5e3 + 0.5 })).toBeNull();
  });

  it('makes dated seeds', () => {
    expect(newSeed(new Date('2026-03-03T10:00:00Z'), () => 0.5)).toBe('tf-2026-03-03-i000');
  });
});

describe('withDefaults', () => {
  it('fills missing and valid sections and leaves a bad one as it is', () => {
    const doc = withDefaults({ seed: 'x', companions: { tableId: 't1' }, envelope: { alpha: 50 }, bogus: 1 });
    expect(doc.seed).toBe('x');
    expect(doc.companions).toEqual({ multiplier: 1, tableId: 't1' });
    expect(doc.envelope).toEqual({ alpha: 50 });
    expect(getAt(doc, ['giant', 'kind'])).toBe('fixedReach');
    expect(doc.bogus).toBe(1);
    expect(draftIssues(doc).map((i) => i.field)).toEqual(['envelope.alpha', 'bogus']);
  });

  it('keeps a missing seed missing, so the form says it is required', () => {
    expect(withDefaults({}).seed).toBeUndefined();
  });
});
