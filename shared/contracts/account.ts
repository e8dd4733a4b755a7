import { z } from 'zod';
import { emailSchema, passwordSchema } from './auth.ts';
import { linkTokenSchema } from './invitations.ts';

/** Hours a password-reset link stays valid. */
export const PASSWORD_RESET_VALID_HOURS = 1;

export const passwordResetRequestSchema = z.strictObject({ email: emailSchema });
export const passwordResetConfirmSchema = z.strictObject({ token: linkTokenSchema, password: passwordSchema });
export type PasswordResetConfirm = z.infer<typeof passwordResetConfirmSchema>;
/** The same answer whether or not the address has an account. */
export const passwordResetRequestedSchema = z.object({ message: z.string() });

export const notificationSettingsSchema = z.strictObject({
  runFinished: z.boolean({ error: 'runFinished must be true or false' }),
  runFailed: z.boolean({ error: 'runFailed must be true or false' }),
});
export type NotificationSettings = z.infer<typeof notificationSettingsSchema>;

/** A message the local SMTP stand-in received (development outbox). */
export const outboxMessageSchema = z.object({
  id: z.string(),
  receivedAt: z.string(),
  from: z.string(),
  to: z.array(z.string()),
  subject: z.string(),
  text: z.string(),
  html: z.string(),
});
export type OutboxMessage = z.infer<typeof outboxMessageSchema>;
export const outboxResponseSchema = z.object({ enabled: z.boolean(), messages: z.array(outboxMessageSchema) });
