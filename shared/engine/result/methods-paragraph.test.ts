import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { citationOf } from '../../contracts/citations.ts';
import { METHOD_CHOICES, optionOf } from '../../contracts/method-choices.ts';
import { parseScenario, type Scenario } from '../../contracts/scenario.ts';
import { assumptionsFor } from './assumptions.ts';
import { METHODS_PARAGRAPH_MAX_CHARS, methodsParagraph, methodsText, type ParagraphResult } from './methods-paragraph.ts';

const base = JSON.parse(readFileSync(new URL('../../../tests/fixtures/check-1.json', import.meta.url), 'utf8')) as Record<string, unknown>;
const result: ParagraphResult = {
  engineVersion: '2.0.0',
  seed: 'paper-2026',
  systems: 1e8,
  scenarioHash: 'a'.repeat(64),
  fraction: { value: 0.0812, se: 0.0012, k: 812, n: 10000 },
  counts: { magnetic: 812, whiteDwarfs: 10000 } as ParagraphResult['counts'],
};

/** Every option switched on at once: the longest paragraph a document can ask for (bar a long seed). */
const everything = parseScenario({
  ...base,
  giant: { kind: 'track' },
  channels: { closeSurvivor: true, fossil: { enabled: true } },
  selection: { kind: 'magnitudeLimited' },
  field: { emergenceDelayGyr: 1, disruption: { kind: 'accretion' } },
  disruption: { dissolution: { kind: 'belowMass' } },
  primaries: { imf: { law: 'brokenPowerlaw', breaksMsun: [0.08, 0.5, 1], slopes: [0.3, 1.3, 2.3, 2.7] }, ifmr: { relation: 'cummings2018', calibration: 'parsec' } },
  observed: { magnetic: 10, total: 100 },
  companions: {
    multiplier: 2.5,
    rows: [
      { class: 'planet', massMJup: [1, 10], periodDays: [10, 1000], occurrence: 0.1, hostMassSlope: 1 },
      { class: 'brownDwarf', massMJup: [13, 80], periodDays: [10, 1000], occurrence: 0.01 },
      { class: 'star', massRatio: [0.1, 1], periodDays: [1, 1e8], occurrence: 0.3, shape: { kind: 'lognormalPeriod' } },
    ],
  },
});

/** The scenario with the choice at `path` set to `template`. */
function withChoice(scenario: Record<string, unknown>, path: readonly (string | number)[], template: Record<string, unknown>): Scenario {
  const doc = structuredClone(scenario) as Record<string | number, unknown>;
  let node = doc;
  for (const key of path.slice(0, -1)) node = node[key] as Record<string | number, unknown>;
  node[path[path.length - 1]] = template;
  return parseScenario(doc);
}

// A schema code is a camelCase identifier (brownDwarf, fixedReach, hostMassSlope); trade words never
// are. Two lower-case letters at least before the capital, so that notation such as dN/dM is not one.
const CAMEL_CASE = /\b[a-z]{2,}[A-Z][a-z]+[A-Za-z]*\b/;

describe('methods paragraph', () => {
  it(`stays within ${METHODS_PARAGRAPH_MAX_CHARS} characters with every option on`, () => {
    // Before this change the export ran to ~9,400 characters; a journal's methods paragraph is a few hundred words.
    expect(methodsParagraph(everything, result, 'r_0123456789ab').length).toBeLessThanOrEqual(METHODS_PARAGRAPH_MAX_CHARS);
    expect(methodsParagraph(parseScenario(base), result).length).toBeLessThanOrEqual(METHODS_PARAGRAPH_MAX_CHARS);
  });

  it('names the Monte Carlo size and error, the engine version, seed and document hash', () => {
    const text = methodsParagraph(everything, result);
    expect(text).toContain('100,000,000 Monte Carlo primaries');
    expect(text).toContain('engine 2.0.0');
    expect(text).toContain('seed "paper-2026"');
    expect(text).toContain('a'.repeat(64));
    expect(text).toContain('± 0.12%');
    expect(text).toContain('binomial Monte Carlo standard error');
  });

  it('prints no schema codes, in the paragraph or in the assumptions', () => {
    const text = methodsText(everything, { ...result, assumptions: assumptionsFor(everything) });
    const references = text.slice(text.indexOf('\nReferences\n'));
    const prose = text.slice(0, text.indexOf('\nReferences\n'));
    expect(prose).not.toMatch(CAMEL_CASE);
    expect(prose).not.toMatch(/fixedReach|brownDwarf|:\s*$/m);
    // References are citations (journal names such as "ApJ" are not schema codes) and end the text.
    expect(references).toContain('https://doi.org/10.1086/161701');
  });

  it('keeps the assumptions in a section of their own', () => {
    const assumptions = assumptionsFor(everything);
    const text = methodsText(everything, { ...result, assumptions });
    const [paragraph, rest] = text.split('\n\nAssumptions\n');
    expect(paragraph).toBe(methodsParagraph(everything, result));
    expect(rest.startsWith(`- ${assumptions[0]}`)).toBe(true);
  });

  // The builder shows option.cites (scenario-options.ts reads the same declarations); the paragraph
  // must cite exactly those sources for the chosen option, for every option of every choice.
  it.each(METHOD_CHOICES.map((c) => [c.path.join('.'), c] as const))('cites the builder’s sources for every option of %s', (_path, choice) => {
    const start = structuredClone(everything) as unknown as Record<string, unknown>;
    for (const option of choice.options) {
      const scenario = withChoice(start, choice.path, option.template);
      const text = methodsParagraph(scenario, result);
      const chosen = optionOf(choice, (option.template as Record<string, unknown>)[choice.discriminator]);
      expect(chosen).toBe(option);
      for (const key of option.cites) expect(text, `${choice.path.join('.')} = ${option.value}`).toContain(citationOf(key).short);
      expect(text).not.toMatch(CAMEL_CASE);
    }
  });

  it('cites the main-sequence lifetime scaling with the same source in builder and paragraph', () => {
    const text = methodsParagraph(parseScenario(base), result);
    expect(text).toContain('(Hansen, Kawaler & Trimble 2004)');
    expect(text).not.toContain('Kippenhahn');
  });
});
