import type { ZodError } from 'zod';
import { isApiError } from './api-client.ts';

/** One message per input name ("email", "occurrence.0.fraction"). */
export type FieldErrors = Partial<Record<string, string>>;

export interface FormErrors {
  fieldErrors: FieldErrors;
  /** Shown above the form: errors that belong to no field the form has. */
  formError?: string;
}

/** Schema messages start with the field's name in lower case; a sentence reads better. */
function sentence(message: string): string {
  return message.charAt(0).toUpperCase() + message.slice(1);
}

/** The first issue per path; an issue without a path (or on a field the form lacks) is the form's. */
export function formErrorsFromIssues(
  issues: ZodError['issues'],
  hasField: (name: string) => boolean,
): FormErrors {
  const result: FormErrors = { fieldErrors: {} };
  for (const issue of issues) {
    const name = issue.path.map(String).join('.');
    if (name && hasField(name)) {
      result.fieldErrors[name] ??= sentence(issue.message);
    } else {
      result.formError ??= sentence(issue.message);
    }
  }
  return result;
}

/** Puts a server error at the field it names when the form has that field, else above the form. */
export function formErrorsFromError(error: unknown, hasField: (name: string) => boolean): FormErrors {
  if (isApiError(error)) {
    const message = sentence(error.message);
    return error.field && hasField(error.field)
      ? { fieldErrors: { [error.field]: message } }
      : { fieldErrors: {}, formError: message };
  }
  return { fieldErrors: {}, formError: 'Something went wrong in the page. Reload it and try again.' };
}
