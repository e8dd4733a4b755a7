import { z } from 'zod';
import { roleSchema } from './roles.ts';

export const PASSWORD_MIN_LENGTH = 10;
export const PASSWORD_MAX_LENGTH = 200;

export const emailSchema = z
  .string({ error: 'email is required' })
  .trim()
  .toLowerCase()
  .max(254, { error: 'email must be at most 254 characters' })
  .pipe(z.email({ error: 'email must be a valid address such as ada@example.org' }));

export const passwordSchema = z
  .string({ error: 'password is required' })
  .min(PASSWORD_MIN_LENGTH, { error: `password must be at least ${PASSWORD_MIN_LENGTH} characters` })
  .max(PASSWORD_MAX_LENGTH, { error: `password must be at most ${PASSWORD_MAX_LENGTH} characters` });

const nameSchema = (field: string, max: number) =>
  z
    .string({ error: `${field} is required` })
    .trim()
    .min(1, { error: `${field} must not be empty` })
    .max(max, { error: `${field} must be at most ${max} characters` });

export const signUpBodySchema = z.strictObject({
  email: emailSchema,
  password: passwordSchema,
  name: nameSchema('name', 120),
  department: nameSchema('department', 160),
});
export type SignUpBody = z.infer<typeof signUpBodySchema>;

export const signInBodySchema = z.strictObject({
  email: emailSchema,
  // No length rule here: a wrong password of any length is just a wrong password.
  password: z.string({ error: 'password is required' }).min(1, { error: 'password is required' }).max(PASSWORD_MAX_LENGTH),
});
export type SignInBody = z.infer<typeof signInBodySchema>;

export const switchDepartmentBodySchema = z.strictObject({
  departmentId: z.string({ error: 'departmentId is required' }).min(1).max(32),
});

export const membershipSummarySchema = z.object({
  departmentId: z.string(),
  departmentName: z.string(),
  role: roleSchema,
});

/**
 * The caller. `department` and `role` are null only for a user who belongs to no department
 * any more (every membership was removed); such a user can sign in but sees nothing.
 */
export const meResponseSchema = z.object({
  user: z.object({ id: z.string(), email: z.string(), name: z.string() }),
  department: z.object({ id: z.string(), name: z.string() }).nullable(),
  role: roleSchema.nullable(),
  memberships: z.array(membershipSummarySchema),
});
export type MeResponse = z.infer<typeof meResponseSchema>;

export const healthResponseSchema = z.object({
  status: z.enum(['ok', 'degraded']),
  /** Whether the database answered; never its error text (the answer is public). */
  database: z.object({ reachable: z.boolean(), latencyMs: z.number().optional() }),
  version: z.string(),
  time: z.string(),
});
export type HealthResponse = z.infer<typeof healthResponseSchema>;
