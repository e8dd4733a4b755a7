import { z } from 'zod';
import { createSampleBodySchema, type CreateSampleBody, type Sample } from '../../../../shared/contracts/samples.ts';
import { fieldIssues, projectWords } from '../../../../shared/contracts/field-issues.ts';
import { parseNumberText } from '../../../lib/number-input.ts';

/**
 * The sample form's inputs are named by the request body's own paths ("magnetic",
 * "bins.0.total"), so that the schema's issues and the server's `field` land on the input
 * that holds the value.
 */
export type SampleFormEntries = Record<string, unknown>;

const BIN_NAME = /^bins\.(\d+)\.(kind|setting|massMinMsun|massMaxMsun|magnetic|total)$/;
const NUMERIC = new Set(['magnetic', 'total', 'massMinMsun', 'massMaxMsun']);

const text = (value: unknown) => (typeof value === 'string' ? value : '');

/** A typed number, NaN for words (the schema names what is allowed), undefined for nothing. */
function numberOf(value: unknown): number | undefined {
  const parsed = parseNumberText(text(value), { grouping: true });
  return parsed === null ? undefined : parsed;
}

/** The request body the inputs describe, before validation (numbers parsed, empties left out). */
export function sampleBodyFromEntries(entries: SampleFormEntries): Record<string, unknown> {
  const bins: Record<string, unknown>[] = [];
  for (const [name, value] of Object.entries(entries)) {
    const match = BIN_NAME.exec(name);
    if (!match) continue;
    const index = Number(match[1]);
    const key = match[2];
    bins[index] ??= {};
    bins[index][key] = NUMERIC.has(key) ? numberOf(value) : text(value);
  }
  const threshold = numberOf(entries.fieldThresholdMG);
  const provenance = text(entries.provenance).trim();
  return {
    name: text(entries.name),
    magnetic: numberOf(entries.magnetic),
    total: numberOf(entries.total),
    setting: text(entries.setting) || 'all',
    ...(threshold === undefined ? {} : { fieldThresholdMG: threshold }),
    ...(provenance ? { provenance } : {}),
    // Always sent: an edit that removes every split must clear them on the server too.
    bins: bins.filter(Boolean),
  };
}

const FIELD_WORDS: [RegExp, string][] = [
  [/\bbins\[\d+\]\./g, ''],
  [/\bmassMinMsun\b/g, 'the lower mass'],
  [/\bmassMaxMsun\b/g, 'the upper mass'],
  [/\bfieldThresholdMG\b/g, 'the field threshold'],
];

/** A schema message in the form's own words: the input it sits under already says which split it is. */
export function formWords(message: string): string {
  return FIELD_WORDS.reduce((text, [pattern, words]) => text.replace(pattern, words), message);
}

/**
 * The form's schema: the inputs read into a body and checked with the server's own schema.
 * Messages are the server's own (the contract's checks word them, field-issues.ts names the
 * field), so a range message names both ends ("must be between 0.1 and 1.44 (got 2)").
 */
export const sampleFormSchema = z.unknown().transform((entries, ctx): CreateSampleBody => {
  const body = sampleBodyFromEntries((entries ?? {}) as SampleFormEntries);
  const parsed = createSampleBodySchema.safeParse(body, { error: projectWords });
  if (parsed.success) return parsed.data;
  const described = fieldIssues(parsed.error.issues);
  parsed.error.issues.forEach((issue, i) => {
    // Refinements name their field in their own words ("bins[0].magnetic must not exceed …").
    const message = issue.code === 'custom' ? issue.message : (described[i]?.message ?? issue.message);
    ctx.addIssue({ code: 'custom', path: issue.path, message: formWords(message) });
  });
  return z.NEVER;
});

/** Initial text of every input, from a saved sample (edit) or blank (new). */
export function sampleFormDefaults(sample?: Sample | null) {
  const num = (x: number | null | undefined) => (x === null || x === undefined ? '' : String(x));
  return {
    name: sample?.name ?? '',
    magnetic: num(sample?.magnetic),
    total: num(sample?.total),
    setting: sample?.setting ?? 'all',
    fieldThresholdMG: num(sample?.fieldThresholdMG ?? (sample ? null : 1)),
    provenance: sample?.provenance ?? '',
    bins: sample?.bins ?? [],
  };
}
