import { AppError, notFound } from '../../lib/errors.ts';
import type { FieldIssue } from '../../../shared/contracts/field-issues.ts';

export const scenarioNotFound = () => notFound('That scenario');
export const versionNotFound = () => notFound('That scenario version');

/**
 * A scenario document failed validation: every issue with its field prefixed by `document.`;
 * the first is also the answer's `field` and `message`.
 */
export function invalidDocument(issues: FieldIssue[], prefix = 'document') {
  const named = issues.map((issue) => ({
    field: issue.field ? `${prefix}.${issue.field}` : prefix,
    message: issue.message.startsWith(issue.field) ? `${prefix}.${issue.message}` : issue.message,
  }));
  const first = named[0];
  return new AppError({
    code: 'invalid_scenario',
    status: 400,
    field: first?.field ?? prefix,
    message: first?.message ?? 'The scenario document is not valid.',
    issues: named,
  });
}
