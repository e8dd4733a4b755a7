import { z } from 'zod';

/**
 * How the contracts word their problems, with zod 4's own means: every check carries its own
 * `error` function (the `number` helper below), zod's other codes get the project's words from
 * one per-parse error map (`projectWords`), and `fieldIssues` is the one place where zod issues
 * become `{ field, message }` with the field's dotted path in front ("envelope.alpha must be
 * between 0.01 and 10 (got 50)"). Messages written in the contracts are the tail after the
 * field ("must be …"); the path is added here, once.
 */

/** One problem with a submitted document: the dotted field path and a sentence naming it. */
export interface FieldIssue {
  field: string;
  message: string;
}

/** A number in [lo, hi] whose every message names both ends and the value it got. */
export function number(lo: number, hi: number, options: { integer?: boolean } = {}) {
  const kind = options.integer ? 'an integer' : 'a number';
  const range = `between ${formatNumber(lo)} and ${formatNumber(hi)}`;
  const outside = (issue: { input?: unknown }) => `must be ${range} (got ${formatValue(issue.input)})`;
  const base = z.number({
    error: (issue) => (issue.input === undefined ? 'is required' : `must be ${kind} ${range} (got ${describeType(issue.input)})`),
  });
  const checked = options.integer ? base.int({ error: (issue) => `must be ${kind} ${range} (got ${formatValue(issue.input)})` }) : base;
  return checked.min(lo, { error: outside }).max(hi, { error: outside });
}

/** An integer in [lo, hi]; see `number`. */
export const integer = (lo: number, hi: number) => number(lo, hi, { integer: true });

/**
 * zod's own codes in the project's words (without the field, which `fieldIssues` adds). Pass
 * it to every parse of a contract (`safeParse(input, { error: projectWords })`); a check's own
 * `error` function or message wins over it.
 */
export const projectWords: z.core.$ZodErrorMap = (issue) => {
  const got = issue.input;
  switch (issue.code) {
    case 'invalid_type':
      if (got === undefined) return 'is required';
      return `must be ${article(issue.expected)} (got ${describeType(got)})`;
    case 'too_small':
    case 'too_big': {
      const low = issue.code === 'too_small';
      const bound = formatNumber(Number(low ? issue.minimum : issue.maximum));
      const side = low ? 'at least' : 'at most';
      if (issue.origin === 'array' || issue.origin === 'set') return `must have ${side} ${bound} entries (got ${Array.isArray(got) ? got.length : formatValue(got)})`;
      if (issue.origin === 'string') return `must be ${side} ${bound} characters long`;
      return `must be ${side} ${bound} (got ${formatValue(got)})`;
    }
    case 'invalid_union':
      if (issue.discriminator && Array.isArray(issue.options)) {
        // zod hands over the whole object; the value that chose no member is its discriminator.
        const chosen = got !== null && typeof got === 'object' ? (got as Record<string, unknown>)[issue.discriminator] : got;
        return `must be one of ${(issue.options as unknown[]).map(String).join(', ')} (got ${formatValue(chosen)})`;
      }
      return `does not match any allowed form (got ${formatValue(got)})`;
    case 'invalid_value':
      return `must be one of ${issue.values.map((v) => String(v)).join(', ')} (got ${formatValue(got)})`;
    case 'unrecognized_keys': {
      const allowed = issue.inst instanceof z.ZodObject ? Object.keys(issue.inst.shape) : [];
      return `is not a field here${allowed.length > 0 ? ` (allowed: ${allowed.join(', ')})` : ''}`;
    }
    default:
      return undefined;
  }
};

/**
 * The one place where zod issues become `{ field, message }`: the field is the issue's dotted
 * path and the message that path followed by the issue's words ("must be …"). An unknown key is
 * one issue per key. A message that already opens with the field's own name (some contracts
 * write whole sentences: "password must be at least 10 characters") has that name replaced by
 * the full path; any other sentence follows the path after a colon.
 */
export function fieldIssues(issues: readonly z.core.$ZodIssue[], name: (path: readonly PropertyKey[]) => string = formatPath): FieldIssue[] {
  const out: FieldIssue[] = [];
  for (const issue of issues) {
    if (issue.code === 'unrecognized_keys') {
      for (const key of issue.keys) {
        const field = name([...issue.path, key]);
        out.push({ field, message: `${field} ${issue.message}` });
      }
      continue;
    }
    const field = name(issue.path);
    out.push({ field, message: withField(field, issue.path, issue.message) });
  }
  return out;
}

const TAIL = /^(must|is|are|has|have|holds|does|cannot|names|needs)\b/;

function withField(field: string, path: readonly PropertyKey[], message: string): string {
  if (TAIL.test(message)) return `${field} ${message}`;
  const own = [...path].reverse().find((k) => typeof k === 'string');
  const space = message.indexOf(' ');
  const head = space > 0 ? message.slice(0, space) : '';
  const name = head.replace(/\[\d*\]/g, '');
  if (own !== undefined && head !== '' && (name === own || name.endsWith(`.${own}`))) return `${field}${message.slice(head.length)}`;
  return path.length === 0 ? message : `${field}: ${message}`;
}

export type FieldParse<T> = { success: true; data: T } | { success: false; issues: FieldIssue[] };

/** Parses with the project's words and answers every problem at once as `{ field, message }`. */
export function parseFields<S extends z.ZodType>(schema: S, input: unknown): FieldParse<z.output<S>> {
  const parsed = schema.safeParse(input, { error: projectWords });
  return parsed.success ? { success: true, data: parsed.data } : { success: false, issues: fieldIssues(parsed.error.issues) };
}

/** "rows.0.occurrence" from ['rows', 0, 'occurrence']: how request bodies name a field ("body" for the whole). */
export const dottedPath = (path: readonly PropertyKey[]): string => (path.length === 0 ? 'body' : path.map(String).join('.'));

/** "companions.rows[2].occurrence" from ['companions', 'rows', 2, 'occurrence']. */
export function formatPath(path: readonly PropertyKey[]): string {
  let out = '';
  for (const key of path) {
    if (typeof key === 'number') out += `[${key}]`;
    else out += out === '' ? String(key) : `.${String(key)}`;
  }
  return out === '' ? 'scenario' : out;
}

/** A number as a person would write it: 1e10 rather than 10000000000. */
export function formatNumber(v: number): string {
  if (Number.isNaN(v)) return 'NaN';
  if (!Number.isFinite(v)) return v > 0 ? 'Infinity' : '-Infinity';
  const abs = Math.abs(v);
  // 12 significant digits: a product such as 0.23 × 6 prints 1.38, not 1.3800000000000001.
  const rounded = Number(v.toPrecision(12));
  if (abs !== 0 && (abs >= 1e6 || abs < 1e-4)) return rounded.toExponential().replace('e+', 'e');
  return String(rounded);
}

function formatValue(v: unknown): string {
  if (typeof v === 'number') return formatNumber(v);
  if (typeof v === 'string') return JSON.stringify(v);
  if (v === undefined) return 'nothing';
  try {
    const text = JSON.stringify(v);
    return text.length > 80 ? `${text.slice(0, 77)}...` : text;
  } catch {
    return String(v);
  }
}

function describeType(v: unknown): string {
  if (typeof v === 'number') return formatNumber(v);
  if (v === null) return 'null';
  if (Array.isArray(v)) return 'a list';
  if (typeof v === 'string') return JSON.stringify(v);
  if (typeof v === 'function') return 'a function';
  return typeof v === 'object' ? 'an object' : `${typeof v} ${formatValue(v)}`;
}

function article(expected: string): string {
  if (expected === 'array') return 'a list';
  if (expected === 'object') return 'an object';
  if (expected === 'int') return 'an integer';
  return /^[aeiou]/.test(expected) ? `an ${expected}` : `a ${expected}`;
}
