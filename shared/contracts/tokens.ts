import { z } from 'zod';

export const createTokenBodySchema = z.strictObject({
  name: z.string({ error: 'name is required' }).trim().min(1, { error: 'name must not be empty' }).max(120, { error: 'name must be at most 120 characters' }),
  /** Days until the token stops working; omit for no expiry. */
  expiresInDays: z.number().int().min(1, { error: 'expiresInDays must be from 1 to 3650' }).max(3650, { error: 'expiresInDays must be from 1 to 3650' }).optional(),
});
export type CreateTokenBody = z.infer<typeof createTokenBodySchema>;

export const tokenSummarySchema = z.object({
  id: z.string(),
  name: z.string(),
  prefix: z.string(),
  departmentId: z.string(),
  createdAt: z.string(),
  lastUsedAt: z.string().nullable(),
  expiresAt: z.string().nullable(),
  revokedAt: z.string().nullable(),
});
export type TokenSummary = z.infer<typeof tokenSummarySchema>;

/** The secret is in `token`, shown this once and never again. */
export const createTokenResponseSchema = tokenSummarySchema.extend({ token: z.string() });
export const tokenListResponseSchema = z.object({ tokens: z.array(tokenSummarySchema) });
