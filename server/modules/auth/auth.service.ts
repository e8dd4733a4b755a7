import type { MeResponse, SignInBody } from '../../../shared/contracts/auth.ts';
import type { Db, Tx } from '../../db/client.ts';
import { newId } from '../../db/columns.ts';
import { recordAudit } from '../audit/audit.service.ts';
import { insertDepartment, insertMembership } from '../departments/departments.repository.ts';
import type { RequestAuth } from '../../lib/request-auth.ts';
import { notAMember, wrongCredentials } from './auth.errors.ts';
import { findUserByEmail, insertUser, setActiveDepartment } from './auth.repository.ts';
import { loadCaller } from './caller.ts';
import { dummyPasswordHash, verifyPassword } from './password.ts';
import type { SessionStore } from './session.ts';

export function toMe(auth: Pick<RequestAuth, 'user' | 'department' | 'role' | 'memberships'>): MeResponse {
  return { user: auth.user, department: auth.department, role: auth.role, memberships: auth.memberships };
}

export function createAuthService(db: Db, sessions: SessionStore) {
  /**
   * Creates a user; with `department` set, also a department with the user as its admin.
   * `first` runs in the same transaction before the user is inserted (a sign-up link is consumed
   * there, so that a link creates at most one account).
   */
  async function createAccount(
    input: { email: string; passwordHash: string; name: string; department?: string },
    first?: (tx: Tx) => Promise<void>,
  ) {
    const userId = newId();
    const departmentId = input.department ? newId() : null;
    const now = new Date();
    await db.transaction(async (tx) => {
      await first?.(tx);
      await insertUser(tx, { id: userId, email: input.email, name: input.name, passwordHash: input.passwordHash, createdAt: now });
      if (departmentId && input.department) {
        await insertDepartment(tx, { id: departmentId, name: input.department, createdAt: now });
        await insertMembership(tx, { userId, departmentId, role: 'admin', createdAt: now });
      }
      await recordAudit(tx, { departmentId, actorUserId: userId, action: 'account.created', target: userId });
    });
    return { userId, departmentId };
  }

  /** The MeResponse of a user working in `departmentId` (or their first department). */
  async function describe(user: RequestAuth['user'], departmentId: string | null): Promise<MeResponse> {
    return toMe(await loadCaller(db, { user }, departmentId));
  }

  return {
    createAccount,

    /** Creates the account of a confirmed sign-up and opens its first session. */
    async createAccountAndSignIn(input: { email: string; passwordHash: string; name: string; department: string }, first?: (tx: Tx) => Promise<void>) {
      const { userId, departmentId } = await createAccount(input, first);
      const session = await sessions.create(userId, departmentId);
      return { session, me: await describe({ id: userId, email: input.email, name: input.name }, departmentId) };
    },

    /** Checks the password (with the same work whether or not the address exists) and opens a session. */
    async signIn(body: SignInBody) {
      const user = await findUserByEmail(db, body.email);
      const ok = await verifyPassword(user?.passwordHash ?? (await dummyPasswordHash()), body.password);
      if (!user || !ok) throw wrongCredentials();
      const me = await describe({ id: user.id, email: user.email, name: user.name }, null);
      const session = await sessions.create(user.id, me.department?.id ?? null);
      await recordAudit(db, { departmentId: me.department?.id, actorUserId: user.id, action: 'account.signed_in', target: user.id });
      return { session, me };
    },

    signOut(sessionId: string) {
      return sessions.invalidate(sessionId);
    },

    async switchDepartment(auth: RequestAuth, departmentId: string): Promise<MeResponse> {
      if (!auth.sessionId || !auth.memberships.some((m) => m.departmentId === departmentId)) throw notAMember();
      await setActiveDepartment(db, auth.sessionId, departmentId);
      return describe(auth.user, departmentId);
    },
  };
}

export type AuthService = ReturnType<typeof createAuthService>;
