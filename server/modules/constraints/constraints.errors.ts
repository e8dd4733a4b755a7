import type { CsvProblem } from '../../../shared/contracts/occurrence-tables-api.ts';
import type { FieldIssue } from '../../../shared/contracts/field-issues.ts';
import { AppError, notFound } from '../../lib/errors.ts';

export const constraintSetNotFound = () => notFound('That constraint set');

/** A constraint's CSV with problems: nothing is stored; every problem is listed with its line and column. */
export class ConstraintCsvError extends AppError {
  constructor(index: number, problems: CsvProblem[]) {
    const first = problems[0];
    super({
      details: problems,
      code: 'csv_invalid',
      status: 400,
      field: `constraints.${index}.csv`,
      message: `constraints[${index}].csv has ${problems.length} problem${problems.length === 1 ? '' : 's'}; nothing was stored. First: line ${first?.line}${first?.column ? `, column ${first.column}` : ''}: ${first?.message}`,
    });
  }
}

/** A constraint that matches no kind or breaks a range: names the constraint's index and field. */
export const invalidConstraint = (issue: FieldIssue) => new AppError({ code: 'invalid_input', status: 400, field: issue.field, message: issue.message });
