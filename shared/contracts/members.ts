import { z } from 'zod';
import { roleSchema } from './roles.ts';

export const memberSchema = z.object({
  userId: z.string(),
  email: z.string(),
  name: z.string(),
  role: roleSchema,
  joinedAt: z.string(),
});
export type Member = z.infer<typeof memberSchema>;

export const memberListResponseSchema = z.object({ members: z.array(memberSchema) });
export type MemberListResponse = z.infer<typeof memberListResponseSchema>;

export const memberParamsSchema = z.strictObject({ userId: z.string().min(1).max(32) });

export const changeRoleBodySchema = z.strictObject({ role: roleSchema });
export type ChangeRoleBody = z.infer<typeof changeRoleBodySchema>;
