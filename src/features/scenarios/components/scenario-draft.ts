import canonicalize from 'canonicalize';
import { parseScenario, scenarioSchema } from '../../../../shared/contracts/scenario.ts';
import { formatNumber, formatPath, parseFields, type FieldIssue } from '../../../../shared/contracts/field-issues.ts';
import { boundsAt } from '../../../../shared/contracts/schema-bounds.ts';

/**
 * The scenario builder edits one draft document: plain JSON, possibly invalid while the user
 * types. Every input is bound to a path in it ("envelope.alpha", "companions.rows[0].occurrence"),
 * the same dotted path that fieldIssues (shared/contracts/field-issues.ts) and the server (as `document.<path>`) use to name a
 * field, so a message lands on the input that holds the value.
 */
export type Draft = Record<string, unknown>;
export type DraftPath = readonly (string | number)[];

/** The name a field goes by in messages and in the server's `field`: "companions.rows[0].occurrence". */
export const fieldKey = (path: DraftPath): string => formatPath(path);

/** A DOM id for the input at `path`, so a problem in the summary can move focus to it. */
export const inputId = (path: DraftPath | string): string =>
  `scenario-${(typeof path === 'string' ? path : fieldKey(path)).replace(/[^A-Za-z0-9_-]+/g, '-')}`;

const isRecord = (v: unknown): v is Record<string | number, unknown> => v !== null && typeof v === 'object';

export function getAt(doc: unknown, path: DraftPath): unknown {
  let node: unknown = doc;
  for (const key of path) {
    if (!isRecord(node)) return undefined;
    node = node[key];
  }
  return node;
}

/**
 * A copy of `doc` with `value` at `path` (copies only along the path). `undefined` removes an
 * object key, so an emptied input falls back to the schema's default; missing containers are
 * created (an array for a numeric key).
 */
export function setAt<T>(doc: T, path: DraftPath, value: unknown): T {
  if (path.length === 0) return value as T;
  const [key, ...rest] = path;
  const container = (Array.isArray(doc)
    ? [...(doc as unknown[])]
    : isRecord(doc)
      ? { ...doc }
      : typeof key === 'number'
        ? []
        : {}) as Record<string | number, unknown>;
  const next = setAt(container[key], rest, value);
  if (next === undefined && !Array.isArray(container)) delete container[key];
  else container[key] = next;
  return container as T;
}

/** Every problem of the draft, each naming its field and the allowed range ("must be between 0.01 and 10 (got 50)"). */
export function draftIssues(doc: unknown): FieldIssue[] {
  const parsed = parseFields(scenarioSchema, doc);
  return parsed.success ? [] : parsed.issues;
}

/**
 * The words shown beside the input: the message without the field path it starts with (the
 * label says which field it is), as a sentence. "document.envelope.alpha must be between …"
 * at field "envelope.alpha" becomes "Must be between …".
 */
export function atFieldMessage(field: string, message: string): string {
  let text = message.startsWith('document.') ? message.slice('document.'.length) : message;
  if (field && text.startsWith(`${field} `)) text = text.slice(field.length + 1);
  else if (field && text.startsWith(`${field}: `)) text = text.slice(field.length + 2);
  return text.charAt(0).toUpperCase() + text.slice(1);
}

/** The first message per field, ready to show beside its input. */
export function messagesByField(issues: readonly FieldIssue[]): Map<string, string> {
  const out = new Map<string, string>();
  for (const issue of issues) if (!out.has(issue.field)) out.set(issue.field, atFieldMessage(issue.field, issue.message));
  return out;
}

/**
 * Where a server error of a scenario save belongs: `document.<path>` → the document field
 * "<path>"; "document" alone → the document as a whole; other fields ("name", "note") → the
 * builder's own inputs of that name.
 */
export function serverErrorTarget(field: string | undefined): { kind: 'document'; field: string } | { kind: 'form'; field: string } | null {
  if (!field) return null;
  if (field === 'document') return { kind: 'document', field: 'scenario' };
  if (field.startsWith('document.')) return { kind: 'document', field: field.slice('document.'.length) };
  return { kind: 'form', field };
}

export interface AllowedRange {
  min: number | null;
  max: number | null;
  integer: boolean;
}

/** The bounds the schema puts on the number at `path`, for the union members the draft has chosen. */
export function allowedRange(doc: unknown, path: DraftPath): AllowedRange | null {
  return boundsAt(scenarioSchema, path, doc);
}

/** "0.01 to 10", "a whole number from 1000 to 1e10", "at least 0". */
export function allowedText(range: AllowedRange | null): string | null {
  if (!range) return null;
  const whole = range.integer ? 'a whole number ' : '';
  if (range.min !== null && range.max !== null) return `${whole}${range.integer ? 'from ' : ''}${formatNumber(range.min)} to ${formatNumber(range.max)}`;
  if (range.min !== null) return `${whole}at least ${formatNumber(range.min)}`;
  if (range.max !== null) return `${whole}at most ${formatNumber(range.max)}`;
  return null;
}

/** The document with every default filled in (what the engine sees); for a draft that is not valid, see withDefaults. */
export function resolvedDraft(doc: unknown): Draft {
  try {
    return parseScenario(doc) as unknown as Draft;
  } catch {
    return withDefaults(doc);
  }
}

/**
 * Fills in the defaults of a draft that may not be valid, one top-level section at a time:
 * a missing section takes its default, a valid one gets its own defaults filled by the schema,
 * and one with a problem is left as it is (so the problem stays where the user can see it).
 * The form then shows a value in every field of a pasted partial document.
 */
export function withDefaults(doc: unknown): Draft {
  const draft = (isRecord(doc) && !Array.isArray(doc) ? doc : {}) as Draft;
  const defaults = parseScenario({ seed: 'defaults' }) as unknown as Draft;
  const out: Draft = {};
  for (const key of new Set([...Object.keys(defaults), ...Object.keys(draft)])) {
    if (draft[key] === undefined) {
      if (key !== 'seed') out[key] = defaults[key];
      continue;
    }
    const alone = scenarioSchema.safeParse({ seed: 'defaults', [key]: draft[key] });
    out[key] = alone.success && key !== 'seed' ? (alone.data as unknown as Draft)[key] : draft[key];
  }
  return out;
}

/** A new seed: readable, dated, and different each time ("tf-2026-03-03-k7q2"). */
export function newSeed(now: Date = new Date(), random: () => number = Math.random): string {
  const tail = Math.floor(random() * 36 ** 4)
    .toString(36)
    .padStart(4, '0');
  return `tf-${now.toISOString().slice(0, 10)}-${tail}`;
}

/** A blank scenario: every default of the schema, no companions yet. */
export function defaultDraft(seed: string = newSeed()): Draft {
  return resolvedDraft({ seed });
}

/**
 * Key order does not matter; everything else does (RFC 8785 canonical JSON, as the scenario hash
 * uses). A draft may hold NaN (text typed into a number field), which JSON and canonicalize
 * refuse: it is compared as the word "NaN".
 */
export function sameDocument(a: unknown, b: unknown): boolean {
  return canonicalize(jsonSafe(a)) === canonicalize(jsonSafe(b));
}

const jsonSafe = (value: unknown): unknown =>
  value === undefined ? value : JSON.parse(JSON.stringify(value, (_key, v: unknown) => (typeof v === 'number' && !Number.isFinite(v) ? String(v) : v)));

/** The draft as the JSON a power user reads or pastes (NaN, which JSON lacks, shows as null). */
export function draftJson(doc: unknown): string {
  return JSON.stringify(doc, null, 2);
}

/** Reads pasted JSON: the document, or why it is not one. */
export function parseDraftJson(text: string): { ok: true; doc: Draft } | { ok: false; message: string } {
  let value: unknown;
  try {
    value = JSON.parse(text);
  } catch (error) {
    return { ok: false, message: `The JSON cannot be read: ${error instanceof Error ? error.message : String(error)}` };
  }
  if (!isRecord(value) || Array.isArray(value)) return { ok: false, message: 'A scenario document is a JSON object ({ … }), not a list or a single value.' };
  return { ok: true, doc: value as Draft };
}

/** The number of systems when it is a valid run size, else null (no cost can be quoted). */
export function runSystems(doc: unknown): number | null {
  const systems = getAt(doc, ['systems']);
  return typeof systems === 'number' && Number.isInteger(systems) && systems >= 1e3 && systems <= 1e10 ? systems : null;
}
