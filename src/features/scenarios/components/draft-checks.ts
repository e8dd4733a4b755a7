import { emptyRangeMessage } from '../../../../shared/contracts/occurrence-table.ts';
import type { FieldIssue } from '../../../../shared/contracts/field-issues.ts';
import { isApiError } from '../../../lib/api-client.ts';
import { getAt, serverErrorTarget, type DraftPath } from './scenario-draft.ts';

/** The row keys of a companion row that hold a [low, high] range. */
const ROW_RANGE_KEYS = ['massMJup', 'massMsun', 'massRatio', 'periodDays'] as const;

const isPair = (v: unknown): v is [number, number] =>
  Array.isArray(v) && v.length === 2 && typeof v[0] === 'number' && typeof v[1] === 'number' && Number.isFinite(v[0]) && Number.isFinite(v[1]);

/** Every [low, high] range of the draft, wherever it may sit. */
function rangePaths(doc: unknown): DraftPath[] {
  const paths: DraftPath[] = [
    ['primaries', 'massRangeMsun'],
    ['channels', 'fossil', 'massRangeMsun'],
  ];
  const rows = getAt(doc, ['companions', 'rows']);
  if (Array.isArray(rows)) rows.forEach((_, i) => ROW_RANGE_KEYS.forEach((key) => paths.push(['companions', 'rows', i, key])));
  return paths;
}

/**
 * The range-order problems of a draft (a range whose low end is not below its high end),
 * found whatever else is wrong: the schema's own order checks run only once every value has
 * its type and range, so without these the user would meet them one round later.
 */
export function rangeOrderIssues(doc: unknown, formatField: (path: DraftPath) => string): FieldIssue[] {
  const out: FieldIssue[] = [];
  for (const path of rangePaths(doc)) {
    const value = getAt(doc, path);
    if (isPair(value) && !(value[0] < value[1])) {
      const field = formatField(path);
      out.push({ field, message: `${field} ${emptyRangeMessage(value)}` });
    }
  }
  return out;
}

/** The schema's problems and the order checks, one per field and message (the order checks add what the schema has not yet said). */
export function mergeIssues(schemaIssues: readonly FieldIssue[], extra: readonly FieldIssue[]): FieldIssue[] {
  const seen = new Set(schemaIssues.map((i) => i.field));
  return [...schemaIssues, ...extra.filter((i) => !seen.has(i.field))];
}

/** Where each problem the server listed belongs, as builder fields ("name", or a document path). */
export function serverIssuesOf(error: unknown): FieldIssue[] {
  if (!isApiError(error)) return [];
  const listed = error.issues && error.issues.length > 0 ? error.issues : error.field ? [{ field: error.field, message: error.message }] : [];
  const out: FieldIssue[] = [];
  for (const issue of listed) {
    const target = serverErrorTarget(issue.field);
    if (!target) continue;
    const message = issue.message.startsWith(`${issue.field} `) ? `${target.field} ${issue.message.slice(issue.field.length + 1)}` : issue.message;
    out.push({ field: target.field, message });
  }
  return out;
}
