import { describe, expect, it } from 'vitest';
import { z } from 'zod';
import { CITATIONS, doiAmong, fullCitations, shortCitations } from './citations.ts';
import { number, parseFields } from './field-issues.ts';
import { byOption, citationsOfChoices, clause, defineChoice, option, optionOf, unionOf } from './method-option.ts';

// An invented source written inline (not in citations.ts), beside a keyed one. The DOI is the
// reserved example prefix 10.5555 (common practice for made-up DOIs, no source).
const INVENTED = { short: 'Doe 2099', full: 'Doe, J. 2099, Invented Journal, 1, 1', doi: '10.5555/invented.1' };

const CHOICE = defineChoice(['thing'], 'kind', [
  option({ schema: z.strictObject({ kind: z.literal('keyed') }), label: 'Keyed', summary: '', cites: ['kroupa'], words: () => 'a keyed method' }),
  option({
    schema: z.strictObject({ kind: z.literal('inline'), width: number(0, 3).default(0.5) }),
    label: 'Inline',
    summary: '',
    cites: [INVENTED, 'salpeter'],
    words: (o) => `an inline method of width ${o.width}`,
  }),
]);

describe('a choice declared with its variants', () => {
  it('reads each value from its schema and builds the template from the defaults', () => {
    expect(CHOICE.options.map((o) => o.value)).toEqual(['keyed', 'inline']);
    expect(optionOf(CHOICE, 'inline')?.template).toEqual({ kind: 'inline', width: 0.5 });
  });

  it('builds the union in the options’ order, with the field’s own messages', () => {
    const schema = z.strictObject({ thing: unionOf(CHOICE) });
    expect(parseFields(schema, { thing: { kind: 'other' } })).toEqual({ success: false, issues: [{ field: 'thing.kind', message: 'thing.kind must be one of keyed, inline (got "other")' }] });
    expect(parseFields(schema, { thing: { kind: 'inline', width: 5 } })).toEqual({ success: false, issues: [{ field: 'thing.width', message: 'thing.width must be between 0 and 3 (got 5)' }] });
  });

  it('prints inline citations as it prints keyed ones', () => {
    expect(clause(CHOICE, { kind: 'inline', width: 1 })).toBe('an inline method of width 1 (Doe 2099; Salpeter 1955)');
    expect(shortCitations(['kroupa', INVENTED])).toBe('Kroupa 2001; Doe 2099');
    expect(fullCitations([INVENTED])).toBe(INVENTED.full);
    expect(citationsOfChoices([CHOICE])).toEqual([CITATIONS.kroupa, INVENTED, CITATIONS.salpeter]);
  });

  it('finds the DOI of an inline citation from its full or short form', () => {
    const known = citationsOfChoices([CHOICE]);
    expect(doiAmong(`${INVENTED.full}, table 2`, known)).toBe(INVENTED.doi);
    expect(doiAmong('Doe 2099', known)).toBe(INVENTED.doi);
    expect(doiAmong('Doe 2099', [])).toBeUndefined();
    expect(doiAmong(CITATIONS.kroupa.full, [])).toBe(CITATIONS.kroupa.doi);
  });

  it('dispatches on the option by a table with one entry per value', () => {
    type Thing = z.output<ReturnType<typeof unionOf<'kind', typeof CHOICE.options>>>;
    const widthOf = byOption<Thing, 'kind', number>('kind', { keyed: () => 0, inline: (o) => o.width });
    expect(widthOf({ kind: 'inline', width: 2 })).toBe(2);
    expect(widthOf({ kind: 'keyed' })).toBe(0);
    // @ts-expect-error a table without the entry of every value does not type-check
    byOption<Thing, 'kind', number>('kind', { keyed: () => 0 });
  });
});
