import { z } from 'zod';
import { emailSchema, passwordSchema } from './auth.ts';
import { linkTokenSchema } from './invitations.ts';

/** Hours an e-mail change link stays valid. */
export const EMAIL_CHANGE_VALID_HOURS = 24;

export const profileBodySchema = z.strictObject({
  name: z.string({ error: 'name is required' }).trim().min(1, { error: 'name must not be empty' }).max(120, { error: 'name must be at most 120 characters' }),
});

const currentPasswordSchema = z.string({ error: 'currentPassword is required' }).min(1, { error: 'currentPassword is required: type the password you sign in with now' }).max(200);

export const emailChangeBodySchema = z.strictObject({ email: emailSchema, currentPassword: currentPasswordSchema });
export const emailChangeConfirmSchema = z.strictObject({ token: linkTokenSchema });
export const passwordChangeBodySchema = z.strictObject({ currentPassword: currentPasswordSchema, password: passwordSchema });

export const sessionListSchema = z.object({
  sessions: z.array(z.object({ current: z.boolean(), expiresAt: z.string(), departmentName: z.string().nullable() })),
});
export type SessionList = z.infer<typeof sessionListSchema>;
export const messageResponseSchema = z.object({ message: z.string() });
