import { describe, expect, it } from 'vitest';
import { signUpBodySchema } from '../../shared/contracts/auth.ts';
import { ApiError } from './api-client.ts';
import { formErrorsFromError, formErrorsFromIssues } from './form-errors.ts';

const signUpFields = (name: string) => ['email', 'password', 'name', 'department'].includes(name);

describe('form errors', () => {
  it('maps the shared sign-up schema issues to one sentence per field', () => {
    const parsed = signUpBodySchema.safeParse({ email: 'ada', password: 'short', name: '', department: 'Stellar group' });
    expect(parsed.success).toBe(false);
    const { fieldErrors, formError } = formErrorsFromIssues(parsed.error!.issues, signUpFields);
    expect(fieldErrors).toEqual({
      email: 'Email must be a valid address such as ada@example.org',
      password: 'Password must be at least 10 characters',
      name: 'Name must not be empty',
    });
    expect(formError).toBeUndefined();
  });

  it('puts issues of fields the form lacks (or of no field) above the form', () => {
    const parsed = signUpBodySchema.safeParse({ email: 'ada@example.org', password: 'long enough pw', name: 'Ada', department: 'X', extra: 1 });
    const { fieldErrors, formError } = formErrorsFromIssues(parsed.error!.issues, signUpFields);
    expect(fieldErrors).toEqual({});
    expect(formError).toMatch(/extra/);
  });

  it('shows a server error at the field it names when the form has it', () => {
    const error = new ApiError({ status: 409, code: 'conflict', message: 'an account with this e-mail exists', field: 'email' });
    expect(formErrorsFromError(error, signUpFields)).toEqual({ fieldErrors: { email: 'An account with this e-mail exists' } });
  });

  it('shows it above the form otherwise (wrong credentials, too many attempts)', () => {
    const wrong = new ApiError({ status: 401, code: 'invalid_credentials', message: 'Wrong e-mail or password.' });
    expect(formErrorsFromError(wrong, signUpFields)).toEqual({ fieldErrors: {}, formError: 'Wrong e-mail or password.' });
    const elsewhere = new ApiError({ status: 400, code: 'invalid_input', message: 'bad', field: 'memberships.0' });
    expect(formErrorsFromError(elsewhere, signUpFields).formError).toBe('Bad');
  });

  it('has a plain message for errors that are not from the API', () => {
    expect(formErrorsFromError(new TypeError('x is undefined'), signUpFields).formError).toMatch(/Something went wrong/);
  });
});
