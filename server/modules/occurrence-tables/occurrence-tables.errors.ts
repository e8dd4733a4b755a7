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

/** Why a multipart upload could not be read, as a 400/413 naming the field where there is one (multer's and busboy's errors). */
export function uploadRefused(error: unknown, limits: { fileSize: number; fields: number }): AppError {
  const code = (error as { code?: string }).code;
  const field = (error as { field?: string }).field;
  switch (code) {
    case 'LIMIT_FILE_SIZE':
      return fileTooLarge(limits.fileSize);
    case 'LIMIT_UNEXPECTED_FILE':
      return field === 'file'
        ? new AppError({ code: 'too_many_files', status: 400, field: 'file', message: 'Attach exactly one CSV file in the form field "file"; this request had more.' })
        : new AppError({ code: 'unexpected_file', status: 400, field, message: `A file came in the form field "${field ?? ''}"; attach the CSV in the field named "file".` });
    case 'LIMIT_FILE_COUNT':
      return new AppError({ code: 'too_many_files', status: 400, field: 'file', message: 'Attach exactly one CSV file in the form field "file"; this request had more.' });
    case 'LIMIT_FIELD_COUNT':
    case 'LIMIT_PART_COUNT':
      return new AppError({ code: 'too_many_fields', status: 413, message: `The form has more than the ${limits.fields} fields this upload accepts (file, name, description).` });
    case 'LIMIT_FIELD_KEY':
    case 'LIMIT_FIELD_VALUE':
      return new AppError({ code: 'field_too_large', status: 413, field, message: `The form field "${field ?? ''}" is longer than this upload accepts.` });
    default:
      return new AppError({
        code: 'malformed_multipart',
        status: 400,
        message: `The upload is not a complete multipart/form-data body (${error instanceof Error ? error.message : 'unreadable'}); send the CSV as the form field "file".`,
      });
  }
}
