import { and, asc, eq, gt, isNull } from 'drizzle-orm';
import type { Logger } from 'pino';
import type { MeResponse } from '../../../shared/contracts/auth.ts';
import {
  INVITATION_VALID_DAYS,
  type AcceptInvitationBody,
  type CreateInvitationBody,
  type Invitation,
  type InvitationPreview,
} from '../../../shared/contracts/invitations.ts';
import { publicBaseUrl, type Config } from '../../config.ts';
import type { Db, Tx } from '../../db/client.ts';
import { newId } from '../../db/columns.ts';
import { AppError, badRequest, conflict, forbidden, notFound } from '../../lib/errors.ts';
import { hashLinkToken, linkExpired, linkUnknown, linkUsed, newLinkToken } from '../account/link-token.ts';
import { recordAudit } from '../audit/audit.service.ts';
import { departmentOf, type RequestAuth } from '../../lib/request-auth.ts';
import { findUserByEmail, insertUser, setActiveDepartment } from '../auth/auth.repository.ts';
import { toMe } from '../auth/auth.service.ts';
import { loadCaller } from '../auth/caller.ts';
import { hashPassword } from '../auth/password.ts';
import type { SessionStore } from '../auth/session.ts';
import { users } from '../users/users.table.ts';
import { insertMembership, membershipsOfUser, type DbOrTx } from '../departments/departments.repository.ts';
import { departments, memberships } from '../departments/departments.table.ts';
import { invitationEmail } from '../mail/mail-templates.ts';
import type { Mailer } from '../mail/mailer.ts';
import { invitations, type InvitationRow } from './invitations.table.ts';

const KIND = 'invitation';
const VALID_FOR = `${INVITATION_VALID_DAYS} days`;
const invitationNotFound = () => notFound('That invitation');
const alreadyMember = () => conflict('That address already belongs to a member of this department.', 'email');

function toInvitation(row: InvitationRow, invitedByName: string): Invitation {
  return { id: row.id, email: row.email, role: row.role, invitedByName, createdAt: row.createdAt.toISOString(), expiresAt: row.expiresAt.toISOString() };
}

/** Why an invitation cannot be used now, or nothing. */
function refusal(row: InvitationRow | undefined, now = Date.now()): AppError | null {
  if (!row) return linkUnknown(KIND);
  if (row.acceptedAt) return linkUsed(KIND);
  if (row.revokedAt) return new AppError({ code: 'link_revoked', status: 410, field: 'token', message: 'This invitation was withdrawn by an admin of the department. Ask them for a new one.' });
  if (row.expiresAt.getTime() <= now) return linkExpired(KIND, VALID_FOR);
  return null;
}

async function withDetails(db: DbOrTx, tokenHash: string) {
  const rows = await db
    .select({ invitation: invitations, departmentName: departments.name, invitedByName: users.name })
    .from(invitations)
    .innerJoin(departments, eq(departments.id, invitations.departmentId))
    .innerJoin(users, eq(users.id, invitations.invitedByUserId))
    .where(eq(invitations.tokenHash, tokenHash))
    .limit(1);
  return rows[0];
}

async function isMember(db: DbOrTx, departmentId: string, email: string): Promise<boolean> {
  const rows = await db
    .select({ userId: memberships.userId })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(and(eq(memberships.departmentId, departmentId), eq(users.email, email)))
    .limit(1);
  return rows.length > 0;
}

/**
 * Invitations by e-mail: an admin invites an address with a role; the link (stored only as a
 * hash) works once and for seven days, and makes the holder a member with that role — a new
 * account for a new address, or the signed-in account that owns the address.
 */
export function createInvitationsService(deps: { db: Db; config: Config; mailer: Mailer; sessions: SessionStore; logger: Logger }) {
  const { db, config, mailer, sessions, logger } = deps;
  const base = publicBaseUrl(config);

  /** Inside a transaction: locks the invitation row, checks it again, adds the membership, marks it used. */
  async function consume(tx: Tx, invitationId: string, userId: string) {
    const [row] = await tx.select().from(invitations).where(eq(invitations.id, invitationId)).for('update');
    const refused = refusal(row);
    if (refused) throw refused;
    const now = new Date();
    if ((await membershipsOfUser(tx, userId)).some((m) => m.departmentId === row.departmentId)) throw alreadyMember();
    await insertMembership(tx, { userId, departmentId: row.departmentId, role: row.role, createdAt: now });
    await tx.update(invitations).set({ acceptedAt: now, acceptedByUserId: userId }).where(eq(invitations.id, row.id));
    await recordAudit(tx, { departmentId: row.departmentId, actorUserId: userId, action: 'invitation.accepted', target: row.id, detail: { role: row.role } });
    return row;
  }

  async function meOf(user: RequestAuth['user'], departmentId: string): Promise<MeResponse> {
    return toMe(await loadCaller(db, { user }, departmentId));
  }

  return {
    async create(auth: RequestAuth, body: CreateInvitationBody): Promise<Invitation & { emailed: boolean }> {
      const department = departmentOf(auth);
      if (await isMember(db, department.id, body.email)) throw alreadyMember();
      const { token, hash } = newLinkToken();
      const now = new Date();
      const row: InvitationRow = {
        id: newId(), departmentId: department.id, email: body.email, role: body.role, tokenHash: hash, invitedByUserId: auth.user.id,
        createdAt: now, expiresAt: new Date(now.getTime() + INVITATION_VALID_DAYS * 86_400_000), acceptedAt: null, acceptedByUserId: null, revokedAt: null,
      };
      await db.transaction(async (tx) => {
        // A new invitation to the same address replaces the open ones: only the newest link works.
        await tx
          .update(invitations)
          .set({ revokedAt: now })
          .where(and(eq(invitations.departmentId, department.id), eq(invitations.email, body.email), isNull(invitations.acceptedAt), isNull(invitations.revokedAt)));
        await tx.insert(invitations).values(row);
        await recordAudit(tx, { departmentId: department.id, actorUserId: auth.user.id, action: 'invitation.created', target: row.id, detail: { email: body.email, role: body.role } });
      });
      let emailed = true;
      try {
        await mailer.send({
          to: body.email,
          kind: 'invitation',
          departmentId: department.id,
          ...invitationEmail({ departmentName: department.name, inviterName: auth.user.name, role: body.role, link: `${base}/accept-invitation?token=${token}`, expiresAt: row.expiresAt }),
        });
      } catch (error) {
        emailed = false;
        logger.error({ err: error, invitationId: row.id }, 'invitation e-mail could not be sent');
      }
      return { ...toInvitation(row, auth.user.name), emailed };
    },

    /** Open invitations of the department (not used, withdrawn or expired). */
    async list(auth: RequestAuth): Promise<Invitation[]> {
      const rows = await db
        .select({ invitation: invitations, invitedByName: users.name })
        .from(invitations)
        .innerJoin(users, eq(users.id, invitations.invitedByUserId))
        .where(and(eq(invitations.departmentId, departmentOf(auth).id), isNull(invitations.acceptedAt), isNull(invitations.revokedAt), gt(invitations.expiresAt, new Date())))
        .orderBy(asc(invitations.email));
      return rows.map((r) => toInvitation(r.invitation, r.invitedByName));
    },

    async revoke(auth: RequestAuth, id: string): Promise<void> {
      const department = departmentOf(auth);
      const result = await db
        .update(invitations)
        .set({ revokedAt: new Date() })
        .where(and(eq(invitations.id, id), eq(invitations.departmentId, department.id), isNull(invitations.acceptedAt), isNull(invitations.revokedAt)));
      if (result[0].affectedRows === 0) throw invitationNotFound();
      await recordAudit(db, { departmentId: department.id, actorUserId: auth.user.id, action: 'invitation.revoked', target: id });
    },

    async preview(token: string): Promise<InvitationPreview> {
      const found = await withDetails(db, hashLinkToken(token));
      const refused = refusal(found?.invitation);
      if (refused || !found) throw refused ?? linkUnknown(KIND);
      const { invitation } = found;
      return {
        departmentName: found.departmentName, email: invitation.email, role: invitation.role, invitedByName: found.invitedByName,
        expiresAt: invitation.expiresAt.toISOString(),
      };
    },

    /**
     * Accepts an invitation. A signed-in caller must own the invited address; anyone else gives a
     * name and password for a new account (an existing account signs in first). Returns the new
     * session when one was opened.
     */
    async accept(body: AcceptInvitationBody, caller: RequestAuth | undefined): Promise<{ me: MeResponse; session: { id: string } | null }> {
      const found = await withDetails(db, hashLinkToken(body.token));
      const refused = refusal(found?.invitation);
      if (refused || !found) throw refused ?? linkUnknown(KIND);
      const { invitation } = found;

      if (caller?.tokenId) throw forbidden('Accept an invitation signed in to Tidefield, not with an API token.');
      if (caller) {
        if (caller.user.email !== invitation.email) {
          throw forbidden(`This invitation is for ${invitation.email}, but you are signed in as ${caller.user.email}. Sign out and open the link again, or ask for an invitation to your address.`);
        }
        await db.transaction((tx) => consume(tx, invitation.id, caller.user.id));
        if (caller.sessionId) await setActiveDepartment(db, caller.sessionId, invitation.departmentId);
        return { me: await meOf(caller.user, invitation.departmentId), session: null };
      }

      if (await findUserByEmail(db, invitation.email)) {
        throw conflict(`An account with ${invitation.email} already exists: sign in with it, then open the link again.`, 'email');
      }
      if (!body.name) throw badRequest('name is required to create your account', 'name');
      if (!body.password) throw badRequest('password is required to create your account', 'password');
      const passwordHash = await hashPassword(body.password);
      const user = { id: newId(), email: invitation.email, name: body.name };
      await db.transaction(async (tx) => {
        await insertUser(tx, { ...user, passwordHash, createdAt: new Date() });
        await recordAudit(tx, { departmentId: invitation.departmentId, actorUserId: user.id, action: 'account.created', target: user.id, detail: { via: 'invitation' } });
        await consume(tx, invitation.id, user.id);
      });
      const session = await sessions.create(user.id, invitation.departmentId);
      return { me: await meOf(user, invitation.departmentId), session };
    },
  };
}

export type InvitationsService = ReturnType<typeof createInvitationsService>;
