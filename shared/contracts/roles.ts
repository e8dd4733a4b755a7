import { z } from 'zod';

/**
 * Department roles, weakest first. Each role can do everything the roles before it can:
 * an observer reads the department's work, keeps observed samples and starts small runs;
 * a modeller also writes scenarios, starts heavy runs and sweeps; an admin also manages
 * members and billing.
 */
export const ROLES = ['observer', 'modeller', 'admin'] as const;
export const roleSchema = z.enum(ROLES, {
  error: (issue) => `role must be one of ${ROLES.join(', ')} (got ${JSON.stringify(issue.input)})`,
});
export type Role = z.infer<typeof roleSchema>;

export function roleAtLeast(role: Role, minimum: Role): boolean {
  return ROLES.indexOf(role) >= ROLES.indexOf(minimum);
}

export const ROLE_LABELS: Record<Role, string> = {
  observer: 'Observer',
  modeller: 'Modeller',
  admin: 'Admin',
};
