import { z } from 'zod';
import { linkTokenSchema } from './invitations.ts';

/** Hours a sign-up confirmation link stays valid. */
export const SIGN_UP_VALID_HOURS = 24;

/**
 * The one answer to a sign-up, whether or not the address already has an account (the mail
 * explains: a confirmation link for a new address, a note with a password-reset link for a
 * known one), so that sign-up does not tell who has an account.
 */
export const signUpRequestedSchema = z.object({
  message: z.string(),
  /** Only while e-mail goes to the local SMTP stand-in: where its received mail can be read (the same for every address). */
  localMailbox: z.string().optional(),
});
export type SignUpRequested = z.infer<typeof signUpRequestedSchema>;

export const signUpConfirmSchema = z.strictObject({ token: linkTokenSchema });
export type SignUpConfirm = z.infer<typeof signUpConfirmSchema>;
