import { z } from 'zod';

/** The one error body every API route answers with. `field` names the input path at fault. */
export const apiErrorBodySchema = z.object({
  error: z.object({
    code: z.string(),
    message: z.string(),
    field: z.string().optional(),
    /** Row-level problems of an upload: the file line (1 = header), the column and what is wrong. */
    details: z.array(z.object({ line: z.number(), column: z.string().optional(), message: z.string() })).optional(),
    /** Every problem of the request or document at once, each naming its field; the first is also `field` and `message`. */
    issues: z.array(z.object({ field: z.string(), message: z.string() })).optional(),
  }),
});
export type ApiErrorBody = z.infer<typeof apiErrorBodySchema>;
