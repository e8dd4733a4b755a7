import { z } from 'zod';
import { createTokenBodySchema, type CreateTokenBody } from '../../../../shared/contracts/tokens.ts';
import { parseNumberText } from '../../../lib/number-input.ts';

const EXPIRY_RULE = 'the expiry must be a whole number of days from 1 to 3650, or empty for never';

/**
 * The token form's schema: the inputs' text read into the request body and checked with the
 * request's own schema, its messages told in the form's words.
 */
export const tokenFormSchema = z.unknown().transform((entries, ctx): CreateTokenBody => {
  const values = (entries ?? {}) as Record<string, unknown>;
  const days = typeof values.expiresInDays === 'string' ? parseNumberText(values.expiresInDays) : null;
  const body = { name: values.name, ...(values.scope ? { scope: values.scope } : {}), ...(days === null ? {} : { expiresInDays: days }) };
  const parsed = createTokenBodySchema.safeParse(body);
  if (parsed.success) return parsed.data;
  for (const issue of parsed.error.issues) {
    const expiry = issue.path[0] === 'expiresInDays';
    const got = expiry ? ` (got ${String(values.expiresInDays).trim()})` : '';
    ctx.addIssue({ code: 'custom', path: issue.path, message: expiry ? `${EXPIRY_RULE}${got}` : issue.message.replace(/^name\b/, 'the name') });
  }
  return z.NEVER;
});
