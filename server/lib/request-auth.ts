import type { Role } from '../../shared/contracts/roles.ts';
import type { TokenScope } from '../../shared/contracts/tokens.ts';

/** Who is calling, resolved once per request by the authentication middleware. */
export interface RequestAuth {
  user: { id: string; email: string; name: string };
  /** Present when the caller came with a session cookie. */
  sessionId?: string;
  /** Present when the caller came with a personal API token. */
  tokenId?: string;
  /** What that token may do (only with tokenId). */
  tokenScope?: TokenScope;
  /** The active department and the caller's role in it; null when the user belongs to none. */
  department: { id: string; name: string } | null;
  role: Role | null;
  memberships: { departmentId: string; departmentName: string; role: Role }[];
}

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    interface Locals {
      auth?: RequestAuth;
    }
  }
}

/** The active department of a caller who passed an access check for a department role. */
export function departmentOf(auth: RequestAuth): { id: string; name: string } {
  if (!auth.department) throw new Error('departmentOf called on a route without a department access rule');
  return auth.department;
}
