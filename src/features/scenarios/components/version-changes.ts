import { formatPath } from '../../../../shared/contracts/field-issues.ts';

/** One field that differs between two versions of a scenario document. */
export interface FieldChange {
  field: string;
  before: string;
  after: string;
}

const isPlainObject = (v: unknown): v is Record<string, unknown> => v !== null && typeof v === 'object' && !Array.isArray(v);
/** Lists of numbers (ranges, breaks) read better whole: "[0.8, 8] → [1, 8]". */
const isNumberList = (v: unknown): v is number[] => Array.isArray(v) && v.every((x) => typeof x === 'number');

/** Long values (a whole companion row with its sources) are cut to this many characters. */
const MAX_SHOWN = 120;

function show(value: unknown): string {
  if (value === undefined) return '—';
  const text = isNumberList(value) ? `[${value.join(', ')}]` : JSON.stringify(value);
  return text.length > MAX_SHOWN ? `${text.slice(0, MAX_SHOWN - 1)}…` : text;
}

function walk(before: unknown, after: unknown, path: (string | number)[], out: FieldChange[]) {
  if (isPlainObject(before) && isPlainObject(after)) {
    const keys = [...new Set([...Object.keys(before), ...Object.keys(after)])].sort();
    for (const key of keys) walk(before[key], after[key], [...path, key], out);
    return;
  }
  if (Array.isArray(before) && Array.isArray(after) && !(isNumberList(before) && isNumberList(after))) {
    for (let i = 0; i < Math.max(before.length, after.length); i++) walk(before[i], after[i], [...path, i], out);
    return;
  }
  if (JSON.stringify(before) !== JSON.stringify(after)) out.push({ field: formatPath(path), before: show(before), after: show(after) });
}

/**
 * What changed from one version of a document to the next, field by field in the builder's
 * path names ("envelope.alpha: 1 → 0.5"). Objects and lists of objects are compared inside;
 * lists of numbers and values of other kinds are compared whole.
 */
export function documentChanges(before: unknown, after: unknown): FieldChange[] {
  const out: FieldChange[] = [];
  walk(before, after, [], out);
  return out;
}
