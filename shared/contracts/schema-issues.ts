import type { z } from 'zod';

/** One problem with a submitted document: the dotted field path and a sentence naming it. */
export interface FieldIssue {
  field: string;
  message: string;
}

/**
 * Turns zod issues into sentences of one fixed form: "<field> must be between <lo> and <hi>
 * (got <value>)", "<field> must be one of a, b (got "x")", "<field> is not a known field".
 * Numeric bounds are read from the schema at the issue's path, so every range message names
 * both ends even when zod reports only the one that was crossed (and even for schemas written
 * elsewhere, such as the giant-track options).
 */
export function describeIssues(schema: z.ZodType, input: unknown, issues: readonly z.core.$ZodIssue[]): FieldIssue[] {
  const out: FieldIssue[] = [];
  for (const issue of issues) {
    const path = issue.path as (string | number)[];
    if (issue.code === 'unrecognized_keys') {
      const allowed = objectKeysAt(schema, path, input);
      for (const key of issue.keys) {
        const field = formatPath([...path, key]);
        const list = allowed.length > 0 ? ` (allowed: ${allowed.join(', ')})` : '';
        out.push({ field, message: `${field} is not a known field${list}` });
      }
      continue;
    }
    const field = formatPath(path);
    out.push({ field, message: `${field} ${describeOne(schema, input, issue, path)}` });
  }
  return out;
}

function describeOne(schema: z.ZodType, input: unknown, issue: z.core.$ZodIssue, path: (string | number)[]): string {
  const got = (issue as { input?: unknown }).input;
  switch (issue.code) {
    case 'too_small':
    case 'too_big': {
      if (issue.origin === 'number' || issue.origin === 'int') return numberRange(schema, path, input, got);
      if (issue.origin === 'array') {
        const bound = issue.code === 'too_small' ? (issue as { minimum: number }).minimum : (issue as { maximum: number }).maximum;
        const side = issue.code === 'too_small' ? 'at least' : 'at most';
        return `must have ${side} ${String(bound)} entries (got ${Array.isArray(got) ? got.length : formatValue(got)})`;
      }
      if (issue.origin === 'string') {
        const bound = issue.code === 'too_small' ? (issue as { minimum: number }).minimum : (issue as { maximum: number }).maximum;
        const side = issue.code === 'too_small' ? 'at least' : 'at most';
        return `must be ${side} ${String(bound)} characters long`;
      }
      return plain(issue.message, got);
    }
    case 'invalid_type': {
      if (got === undefined) return 'is required';
      if (issue.expected === 'number' || issue.expected === 'int') return numberRange(schema, path, input, got);
      return `must be ${article(issue.expected)} (got ${describeType(got)})`;
    }
    case 'invalid_union': {
      const withOptions = issue as { discriminator?: string; options?: unknown[] };
      if (withOptions.discriminator && withOptions.options) {
        const value = got !== null && typeof got === 'object' ? (got as Record<string, unknown>)[withOptions.discriminator] : got;
        const allowed = withOptions.options.map(String).join(', ');
        return `must be one of ${allowed} (got ${formatValue(value)})`;
      }
      return plain('does not match any allowed form', got);
    }
    case 'invalid_value':
      return `must be one of ${issue.values.map((v) => String(v)).join(', ')} (got ${formatValue(got)})`;
    case 'custom':
      return issue.message;
    default:
      return plain(issue.message, got);
  }
}

function plain(message: string, got: unknown): string {
  return got === undefined ? message : `${message} (got ${formatValue(got)})`;
}

function numberRange(schema: z.ZodType, path: (string | number)[], input: unknown, got: unknown): string {
  const node = schemaAt(schema, path, input);
  const bounds = node ? numberBounds(node) : null;
  const kind = bounds?.integer ? 'an integer' : 'a number';
  const value = formatValue(got);
  if (bounds && bounds.min !== null && bounds.max !== null) {
    const head = typeof got === 'number' && Number.isFinite(got) && (!bounds.integer || Number.isInteger(got)) ? '' : `${kind} `;
    return `must be ${head}between ${formatNumber(bounds.min)} and ${formatNumber(bounds.max)} (got ${value})`;
  }
  if (bounds && bounds.min !== null) return `must be ${kind} of at least ${formatNumber(bounds.min)} (got ${value})`;
  if (bounds && bounds.max !== null) return `must be ${kind} of at most ${formatNumber(bounds.max)} (got ${value})`;
  return `must be ${kind} (got ${value})`;
}

interface NumberBounds {
  min: number | null;
  max: number | null;
  integer: boolean;
}

/** Bounds of a zod number schema (zod 4 exposes them as minValue / maxValue). */
export function numberBounds(node: z.ZodType): NumberBounds | null {
  const inner = unwrap(node);
  const def = defOf(inner);
  if (def.type !== 'number') return null;
  const n = inner as unknown as { minValue: number | null; maxValue: number | null; isInt?: boolean; format?: string | null };
  const integer = n.isInt === true || (typeof n.format === 'string' && n.format.includes('int'));
  const finite = (v: number | null) => (v === null || !Number.isFinite(v) || Math.abs(v) >= Number.MAX_SAFE_INTEGER ? null : v);
  return { min: finite(n.minValue), max: finite(n.maxValue), integer };
}

type Def = { type: string; [key: string]: unknown };

function defOf(node: unknown): Def {
  return (node as { _zod: { def: Def } })._zod.def;
}

/** Strips the wrappers that do not change what a value must look like. */
function unwrap(node: z.ZodType): z.ZodType {
  let current = node;
  for (let i = 0; i < 16; i++) {
    const def = defOf(current);
    if (['default', 'prefault', 'optional', 'nullable', 'readonly', 'catch', 'nonoptional'].includes(def.type)) {
      current = def.innerType as z.ZodType;
    } else if (def.type === 'pipe') {
      current = def.in as z.ZodType;
    } else {
      return current;
    }
  }
  return current;
}

/** The schema node that validates `path`, choosing union members by the input's shape. */
export function schemaAt(schema: z.ZodType, path: readonly (string | number)[], input: unknown): z.ZodType | null {
  let node: z.ZodType | null = schema;
  let value: unknown = input;
  for (const key of path) {
    if (!node) return null;
    node = pickUnionMember(unwrap(node), value);
    if (!node) return null;
    const def = defOf(node);
    if (def.type === 'object') {
      node = ((def.shape as Record<string, z.ZodType>)[String(key)] ?? null) as z.ZodType | null;
    } else if (def.type === 'array') {
      node = def.element as z.ZodType;
    } else if (def.type === 'tuple') {
      node = ((def.items as z.ZodType[])[Number(key)] ?? (def.rest as z.ZodType | null) ?? null) as z.ZodType | null;
    } else if (def.type === 'record') {
      node = def.valueType as z.ZodType;
    } else {
      return null;
    }
    value = value !== null && typeof value === 'object' ? (value as Record<string | number, unknown>)[key] : undefined;
  }
  return node ? pickUnionMember(unwrap(node), value) : null;
}

function pickUnionMember(node: z.ZodType, value: unknown): z.ZodType | null {
  const def = defOf(node);
  if (def.type !== 'union') return node;
  const options = def.options as z.ZodType[];
  const discriminator = def.discriminator as string | undefined;
  if (discriminator && value !== null && typeof value === 'object') {
    const wanted = (value as Record<string, unknown>)[discriminator];
    for (const option of options) {
      const shape = defOf(unwrap(option)).shape as Record<string, z.ZodType> | undefined;
      const literal = shape?.[discriminator];
      if (literal && (defOf(literal).values as unknown[] | undefined)?.includes(wanted)) return unwrap(option);
    }
  }
  for (const option of options) if (option.safeParse(value).success) return unwrap(option);
  return options.length > 0 ? unwrap(options[0]) : null;
}

function objectKeysAt(schema: z.ZodType, path: readonly (string | number)[], input: unknown): string[] {
  const node = schemaAt(schema, path, input);
  if (!node) return [];
  const def = defOf(node);
  return def.type === 'object' ? Object.keys(def.shape as object) : [];
}

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
  if (v === null) return 'null';
  if (Array.isArray(v)) return 'a list';
  if (typeof v === 'string') return `the text ${JSON.stringify(v)}`;
  if (typeof v === 'function') return 'a function';
  return typeof v === 'object' ? 'an object' : `${typeof v} ${formatValue(v)}`;
}

function article(expected: string): string {
  if (expected === 'array') return 'a list';
  if (expected === 'object') return 'an object';
  if (expected === 'int') return 'an integer';
  return /^[aeiou]/.test(expected) ? `an ${expected}` : `a ${expected}`;
}
