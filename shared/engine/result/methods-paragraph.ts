import { citationOf, shortCitations, type Citation, type Cite, type CitationKey } from '../../contracts/citations.ts';
import {
  clause,
  DISRUPTION_FIELD_CHOICE,
  DISSOLUTION_CHOICE,
  GIANT_CHOICE,
  HISTORY_CHOICE,
  IFMR_CHOICE,
  IMF_CHOICE,
  LIFETIME_CHOICE,
  METHOD_CHOICES,
  optionOf,
  SELECTION_CHOICE,
  SHAPE_CHOICE,
  SUPERWIND_CHOICE,
  TIDE_CHOICE,
} from '../../contracts/method-choices.ts';
import type { ScenarioResult } from '../../contracts/result.ts';
import type { Scenario } from '../../contracts/scenario.ts';
import { formatPercentWithError } from '../stats/format.ts';

/** What the paragraph needs of a result: the Monte Carlo size, seed, engine version, hash and the headline. */
export type ParagraphResult = Pick<ScenarioResult, 'engineVersion' | 'seed' | 'systems' | 'scenarioHash' | 'fraction' | 'counts'>;

/** The methods paragraph stays a paragraph a journal would print. */
export const METHODS_PARAGRAPH_MAX_CHARS = 2500;

const cite = (keys: readonly CitationKey[]) => `(${shortCitations(keys)})`;
const capital = (s: string) => s.charAt(0).toUpperCase() + s.slice(1);

/**
 * The methods paragraph of one run, in the trade's words: every choice between published methods
 * with its citation (the same as the builder's: both read shared/contracts/method-choices.ts), the
 * Monte Carlo size and error, the engine version, seed and scenario hash. At most
 * METHODS_PARAGRAPH_MAX_CHARS; the long list of assumptions is a section of its own
 * (`assumptions` of the result). Reusable: any caller with a parsed scenario and a result.
 */
export function methodsParagraph(scenario: Scenario, result: ParagraphResult, runId?: string): string {
  const p = scenario.primaries;
  const s: string[] = [];
  s.push(
    `We drew ${result.systems.toLocaleString('en-US')} Monte Carlo primaries with Tidefield (engine ${result.engineVersion}, seed "${result.seed}") between ${p.massRangeMsun[0]} and ${p.massRangeMsun[1]} Msun from ${clause(IMF_CHOICE, p.imf)}, with ${clause(HISTORY_CHOICE, p.history)}, ${clause(LIFETIME_CHOICE, p.lifetime)} and ${clause(IFMR_CHOICE, p.ifmr)}.`,
  );
  const rows = scenario.companions.rows ?? [];
  const shapes = [...new Set(rows.map((r) => r.shape.kind))].map((kind) => clause(SHAPE_CHOICE, { kind }));
  if (rows.length > 0) {
    const multiplier = scenario.companions.multiplier === 1 ? '' : `, occurrences × ${scenario.companions.multiplier}`;
    const host = rows.some((r) => (r.hostMassSlope ?? 0) !== 0) ? ` and rising with host mass ${cite(['johnson'])}` : '';
    s.push(`Companions are drawn from ${rows.length} occurrence row${rows.length === 1 ? '' : 's'} with ${shapes.join(' or ')}${multiplier}${host}.`);
  } else {
    s.push('The primaries have no companions.');
  }
  const g = scenario.giant;
  let giant = capital(clause(GIANT_CHOICE, g));
  if (g.kind === 'track') giant += `, with ${clause(SUPERWIND_CHOICE, g.superwind)} and ${clause(TIDE_CHOICE, g.tide)}`;
  s.push(`${giant}.`);
  const dissolution = scenario.disruption.dissolution.kind === 'none' ? '' : `; ${clause(DISSOLUTION_CHOICE, scenario.disruption.dissolution)}`;
  s.push(
    `The common envelope follows the energy formalism ${cite(['webbink', 'dekool'])} with α_CE = ${scenario.envelope.alpha} and λ = ${scenario.envelope.lambda} and the giant's state at onset; a companion that cannot eject it is tidally disrupted near the core ${cite(['tout', 'nordhaus'])}${dissolution}.`,
  );
  const f = scenario.field;
  const channels: string[] = [];
  if (scenario.channels.disruption) channels.push(`disrupted companions give ${clause(DISRUPTION_FIELD_CHOICE, f.disruption)}`);
  if (scenario.channels.closeSurvivor) channels.push(`post-CE survivors below ${f.closeSurvivor.maxPeriodDays} d get log-normal fields of median ${f.closeSurvivor.medianMG} MG ${cite(['tout'])}`);
  if (scenario.channels.fossil.enabled) channels.push(`${scenario.channels.fossil.fraction} of progenitors of ${scenario.channels.fossil.massRangeMsun[0]}–${scenario.channels.fossil.massRangeMsun[1]} Msun keep a flux-conserved fossil field ${cite(['wickramasinghe'])}`);
  const delay = f.emergenceDelayGyr > 0 ? `, companion-made fields appearing after ${f.emergenceDelayGyr} Gyr of cooling` : '';
  s.push(`${channels.length > 0 ? capital(channels.join('; ')) : 'No field channel is on'}${delay}; magnetic means B ≥ ${f.thresholdMG} MG, and white-dwarf radii are zero-temperature ones ${cite(['nauenberg'])}.`);
  s.push(`Fractions refer to ${clause(SELECTION_CHOICE, scenario.selection)}.`);
  const value = result.fraction.value;
  s.push(
    value !== null && result.fraction.se !== null
      ? `The predicted magnetic fraction is ${formatPercentWithError(value, result.fraction.se)} (${result.counts.magnetic.toLocaleString('en-US')} of ${result.counts.whiteDwarfs.toLocaleString('en-US')} model white dwarfs; binomial Monte Carlo standard error).`
      : 'The run produced no white dwarfs, so no magnetic fraction is defined.',
  );
  if (scenario.observed) s.push(`Observed counts are tested with an exact two-sided binomial test and exact binomial confidence intervals ${cite(['clopper'])}.`);
  s.push(`The scenario document (SHA-256 ${result.scenarioHash}), seed and engine version reproduce all counts exactly${runId ? ` (Tidefield run ${runId})` : ''}.`);
  return s.join(' ');
}

/** Every published source the paragraph cites for this scenario, in first-cited order. */
export function paragraphCitations(scenario: Scenario): Citation[] {
  const cited: Citation[] = [];
  const add = (cites: readonly Cite[]) => cites.map(citationOf).forEach((c) => cited.includes(c) || cited.push(c));
  const chosen = (choice: (typeof METHOD_CHOICES)[number], value: Record<string, unknown>) => add(optionOf(choice, value[choice.discriminator])?.cites ?? []);
  const p = scenario.primaries;
  chosen(IMF_CHOICE, p.imf);
  chosen(LIFETIME_CHOICE, p.lifetime);
  chosen(IFMR_CHOICE, p.ifmr);
  const rows = scenario.companions.rows ?? [];
  for (const kind of new Set(rows.map((r) => r.shape.kind))) chosen(SHAPE_CHOICE, { kind });
  if (rows.some((r) => (r.hostMassSlope ?? 0) !== 0)) add(['johnson']);
  chosen(GIANT_CHOICE, scenario.giant);
  if (scenario.giant.kind === 'track') {
    chosen(SUPERWIND_CHOICE, scenario.giant.superwind);
    chosen(TIDE_CHOICE, scenario.giant.tide);
  }
  add(['webbink', 'dekool', 'tout', 'nordhaus']);
  if (scenario.channels.disruption) chosen(DISRUPTION_FIELD_CHOICE, scenario.field.disruption);
  if (scenario.channels.fossil.enabled) add(['wickramasinghe']);
  add(['nauenberg']);
  chosen(SELECTION_CHOICE, scenario.selection);
  if (scenario.observed) add(['clopper']);
  return cited;
}

/**
 * The text of a run's methods export: the paragraph, then the assumptions as a section of their
 * own, then the references (full, with DOI links where known).
 */
export function methodsText(scenario: Scenario, result: ParagraphResult & Pick<ScenarioResult, 'assumptions'>, runId?: string): string {
  return [
    methodsParagraph(scenario, result, runId),
    '',
    'Assumptions',
    ...result.assumptions.map((a) => `- ${a}`),
    '',
    'References',
    ...paragraphCitations(scenario).map((c) => `- ${c.full}${c.doi ? `, https://doi.org/${c.doi}` : ''}`),
    '',
  ].join('\n');
}
