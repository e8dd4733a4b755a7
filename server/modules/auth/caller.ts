import type { Db } from '../../db/client.ts';
import { membershipsOfUser } from '../departments/departments.repository.ts';
import type { RequestAuth } from '../../lib/request-auth.ts';

/**
 * Builds the caller's RequestAuth from their memberships, read fresh (a removed member loses
 * access at once). A session works in `preferredDepartmentId` or falls back to the first
 * membership; a token is bound to exactly one department and never falls back.
 */
export async function loadCaller(
  db: Db,
  caller: Pick<RequestAuth, 'user' | 'sessionId' | 'tokenId' | 'tokenScope'>,
  preferredDepartmentId: string | null,
): Promise<RequestAuth> {
  const memberships = (await membershipsOfUser(db, caller.user.id)).map(({ departmentId, departmentName, role }) => ({
    departmentId,
    departmentName,
    role,
  }));
  const active = memberships.find((m) => m.departmentId === preferredDepartmentId) ?? (caller.tokenId ? undefined : memberships[0]);
  return {
    ...caller,
    memberships,
    department: active ? { id: active.departmentId, name: active.departmentName } : null,
    role: active?.role ?? null,
  };
}
