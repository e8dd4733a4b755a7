import { AppError, notFound } from '../../lib/errors.ts';
import type { FieldIssue } from '../../../shared/contracts/schema-issues.ts';

export const scenarioNotFound = () => notFound('That scenario');
export const versionNotFound = () => notFound('That scenario version');

/** A scenario document failed validation: answer with the first issue, its field prefixed by `document.`. */
export function invalidDocument(issues: FieldIssue[], prefix = 'document') {
  const first = issues[0];
  const field = first?.field ? `${prefix}.${first.field}` : prefix;
  return new AppError({
    code: 'invalid_scenario',
    status: 400,
    field,
    message: first ? (first.message.startsWith(first.field) ? `${prefix}.${first.message}` : first.message) : 'The scenario document is not valid.',
  });
}
