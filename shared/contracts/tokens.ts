import { z } from 'zod';

/** What a personal API token may do. Account, member, billing and token management need a signed-in session. */
export const TOKEN_SCOPES = ['read', 'run'] as const;
export type TokenScope = (typeof TOKEN_SCOPES)[number];
export const TOKEN_SCOPE_TEXT: Record<TokenScope, { label: string; allows: string }> = {
  read: { label: 'Read', allows: 'Read scenarios, tables, samples, runs, results, exports and sweeps, and compute implied occurrence.' },
  run: { label: 'Read and run', allows: 'Everything Read allows, and start and cancel runs and sweeps (within your role and the credit of the department).' },
};

export const createTokenBodySchema = z.strictObject({
  name: z.string({ error: 'name is required' }).trim().min(1, { error: 'name must not be empty' }).max(120, { error: 'name must be at most 120 characters' }),
  scope: z.enum(TOKEN_SCOPES, { error: 'scope must be one of read, run' }).default('read'),
  /** Days until the token stops working; omit for no expiry. */
  expiresInDays: z.number().int().min(1, { error: 'expiresInDays must be from 1 to 3650' }).max(3650, { error: 'expiresInDays must be from 1 to 3650' }).optional(),
});
export type CreateTokenBody = z.infer<typeof createTokenBodySchema>;

export const tokenSummarySchema = z.object({
  id: z.string(),
  name: z.string(),
  prefix: z.string(),
  scope: z.enum(TOKEN_SCOPES),
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
