import { AppError } from '../../lib/errors.ts';

export const wrongCredentials = () =>
  new AppError({ code: 'wrong_credentials', status: 401, message: 'That e-mail and password do not match an account.' });
export const emailTaken = () =>
  new AppError({ code: 'email_taken', status: 409, message: 'An account with this e-mail already exists; sign in instead.', field: 'email' });
export const notAMember = () =>
  new AppError({ code: 'not_a_member', status: 403, message: 'You are not a member of that department.', field: 'departmentId' });
