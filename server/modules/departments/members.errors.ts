import { AppError, notFound } from '../../lib/errors.ts';

export const memberNotFound = () => notFound('That member');
export const lastAdmin = () =>
  new AppError({
    code: 'last_admin',
    status: 409,
    message: 'A department needs at least one admin: make another member admin first.',
    field: 'role',
  });
