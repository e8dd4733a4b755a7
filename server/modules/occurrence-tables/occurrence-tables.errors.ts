import { AppError, notFound } from '../../lib/errors.ts';
import type { CsvProblem } from '../../../shared/contracts/occurrence-tables-api.ts';

export const tableNotFound = () => notFound('That occurrence table');

/** A CSV upload with problems: nothing is stored, and every problem is listed with its line and column. */
export class CsvInvalidError extends AppError {
  constructor(problems: CsvProblem[]) {
    const first = problems[0];
    super({
      details: problems,
      code: 'csv_invalid',
      status: 400,
      field: 'file',
      message: `The CSV has ${problems.length} problem${problems.length === 1 ? '' : 's'}; nothing was stored. First: line ${first?.line}${first?.column ? `, column ${first.column}` : ''}: ${first?.message}`,
    });
  }
}

export const fileMissing = () => new AppError({ code: 'file_missing', status: 400, field: 'file', message: 'Attach the CSV file in the form field named "file".' });
export const fileTooLarge = (limitBytes: number) =>
  new AppError({ code: 'file_too_large', status: 413, field: 'file', message: `The file is larger than ${Math.round(limitBytes / 1024)} kB, the most an occurrence table upload may be.` });
