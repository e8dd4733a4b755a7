import { z } from 'zod';

/** Ids in URLs: our ids are 16 URL-safe characters; anything else cannot exist. */
export const idSchema = z.string().min(1).max(32).regex(/^[A-Za-z0-9_-]+$/, { error: 'must be an id of letters, digits, - or _' });
export const idParamsSchema = z.strictObject({ id: idSchema });

/** Paging for list routes (query strings: every value arrives as a string). */
export const pageQueryFields = {
  page: z.coerce.number({ error: 'page must be a whole number of at least 1' }).int().min(1, { error: 'page must be at least 1' }).max(1_000_000).default(1),
  pageSize: z.coerce.number({ error: 'pageSize must be a whole number from 1 to 100' }).int().min(1, { error: 'pageSize must be from 1 to 100' }).max(100, { error: 'pageSize must be from 1 to 100' }).default(20),
};

export const pageInfoSchema = z.object({ page: z.number(), pageSize: z.number(), total: z.number() });

export const nameSchema = z
  .string({ error: 'name is required' })
  .trim()
  .min(1, { error: 'name must not be empty' })
  .max(160, { error: 'name must be at most 160 characters' });
