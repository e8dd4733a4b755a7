import { z } from 'zod';
import { emailSchema, passwordSchema } from './auth.ts';
import { roleSchema } from './roles.ts';

/** Days an invitation link stays valid. */
export const INVITATION_VALID_DAYS = 7;

export const createInvitationBodySchema = z.strictObject({ email: emailSchema, role: roleSchema });
export type CreateInvitationBody = z.infer<typeof createInvitationBodySchema>;

export const invitationSchema = z.object({
  id: z.string(),
  email: z.string(),
  role: roleSchema,
  invitedByName: z.string(),
  createdAt: z.string(),
  expiresAt: z.string(),
});
export type Invitation = z.infer<typeof invitationSchema>;
export const invitationListResponseSchema = z.object({ invitations: z.array(invitationSchema) });
/** `emailed` is false when the invitation was saved but the mail server refused it (send it again later). */
export const createInvitationResponseSchema = invitationSchema.extend({ emailed: z.boolean() });

/** The secret of an e-mailed link (invitation or password reset). */
export const linkTokenSchema = z
  .string({ error: 'token is required: use the link from the e-mail' })
  .min(20, { error: 'token is not a valid link token: use the link from the e-mail' })
  .max(100, { error: 'token is not a valid link token: use the link from the e-mail' })
  .regex(/^[A-Za-z0-9_-]+$/, { error: 'token is not a valid link token: use the link from the e-mail' });
export const tokenParamsSchema = z.strictObject({ token: linkTokenSchema });

/** What the invitation link shows before it is accepted. */
export const invitationPreviewSchema = z.object({
  departmentName: z.string(),
  email: z.string(),
  role: roleSchema,
  invitedByName: z.string(),
  expiresAt: z.string(),
  /** An account with this e-mail exists: the invitee signs in instead of creating one. */
});
export type InvitationPreview = z.infer<typeof invitationPreviewSchema>;

/** New users give a name and a password; a signed-in user with the invited address sends only the token. */
export const acceptInvitationBodySchema = z.strictObject({
  token: linkTokenSchema,
  name: z.string().trim().min(1, { error: 'name must not be empty' }).max(120, { error: 'name must be at most 120 characters' }).optional(),
  password: passwordSchema.optional(),
});
export type AcceptInvitationBody = z.infer<typeof acceptInvitationBodySchema>;

