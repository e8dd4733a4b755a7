import { and, eq, isNull } from 'drizzle-orm';
import { EMAIL_CHANGE_VALID_HOURS, type SessionList } from '../../../shared/contracts/settings.ts';
import { publicBaseUrl, type Config } from '../../config.ts';
import type { Db } from '../../db/client.ts';
import { newId } from '../../db/columns.ts';
import { AppError, conflict, isDuplicateKey } from '../../lib/errors.ts';
import { recordAudit } from '../audit/audit.service.ts';
import type { RequestAuth } from '../../lib/request-auth.ts';
import { findUserByEmail, findUserById } from '../auth/auth.repository.ts';
import { hashPassword, verifyPassword } from '../auth/password.ts';
import type { SessionStore } from '../auth/session.ts';
import { sessions as sessionsTable } from '../auth/sessions.table.ts';
import { users } from '../users/users.table.ts';
import { departments } from '../departments/departments.table.ts';
import { emailChangeEmail } from '../mail/mail-templates.ts';
import type { Mailer } from '../mail/mailer.ts';
import { updatePasswordHash } from './account.repository.ts';
import { emailChanges } from './email-changes.table.ts';
import { revokeTokensOfUser } from '../tokens/tokens.service.ts';
import { hashLinkToken, newLinkToken } from './link-token.ts';

const wrongPassword = () => new AppError({ code: 'wrong_password', status: 400, field: 'currentPassword', message: 'currentPassword is not the password you sign in with; nothing was changed.' });
const changeLink = (code: string, status: number, message: string) => new AppError({ code, status, field: 'token', message });

/**
 * The user's own settings: name, e-mail (confirmed by a link to the new address), password
 * (with the current one) and sessions. Sessions go through the session store's own calls
 * (invalidateUser: the same "sign out everywhere" a password reset does).
 */
export function createSettingsService(deps: { db: Db; config: Config; mailer: Mailer; sessions: SessionStore }) {
  const { db, mailer, sessions } = deps;
  const base = publicBaseUrl(deps.config);

  async function checkPassword(auth: RequestAuth, currentPassword: string) {
    const user = await findUserById(db, auth.user.id);
    if (!user || !(await verifyPassword(user.passwordHash, currentPassword))) throw wrongPassword();
    return user;
  }

  return {
    async rename(auth: RequestAuth, name: string) {
      await db.update(users).set({ name }).where(eq(users.id, auth.user.id));
      await recordAudit(db, { actorUserId: auth.user.id, action: 'account.renamed', target: auth.user.id });
      return { message: `Your name is now ${name}.` };
    },

    /** Mails a confirmation link to the new address; the address changes only when it is opened. */
    async requestEmailChange(auth: RequestAuth, body: { email: string; currentPassword: string }) {
      const user = await checkPassword(auth, body.currentPassword);
      if (body.email === user.email) throw new AppError({ code: 'invalid_input', status: 400, field: 'email', message: `email is already your address (${user.email}).` });
      if (await findUserByEmail(db, body.email)) throw conflict('email belongs to another account; choose another address.', 'email');
      const { token, hash } = newLinkToken();
      const now = new Date();
      const expiresAt = new Date(now.getTime() + EMAIL_CHANGE_VALID_HOURS * 3_600_000);
      await db.insert(emailChanges).values({ id: newId(), userId: user.id, newEmail: body.email, tokenHash: hash, createdAt: now, expiresAt, usedAt: null });
      await recordAudit(db, { actorUserId: user.id, action: 'account.email_change_requested', target: user.id });
      await mailer.send({ to: body.email, kind: 'email-change', ...emailChangeEmail({ name: user.name, oldEmail: user.email, link: `${base}/confirm-email?token=${token}`, expiresAt }) });
      return { message: `A link to confirm ${body.email} is on its way to that address; your address changes when it is opened (within ${EMAIL_CHANGE_VALID_HOURS} hours).` };
    },

    async confirmEmailChange(token: string) {
      const [change] = await db.select().from(emailChanges).where(eq(emailChanges.tokenHash, hashLinkToken(token))).limit(1);
      if (!change) throw changeLink('invalid_link', 404, 'This e-mail confirmation link is not valid. Check that the whole link was opened, or ask for a new one in Settings.');
      if (change.usedAt) throw changeLink('link_used', 410, 'This e-mail confirmation link has already been used.');
      if (change.expiresAt.getTime() <= Date.now()) throw changeLink('link_expired', 410, `This e-mail confirmation link has expired (links are valid for ${EMAIL_CHANGE_VALID_HOURS} hours). Ask for a new one in Settings.`);
      try {
        await db.transaction(async (tx) => {
          const used = await tx.update(emailChanges).set({ usedAt: new Date() }).where(and(eq(emailChanges.id, change.id), isNull(emailChanges.usedAt)));
          if (used[0].affectedRows !== 1) throw changeLink('link_used', 410, 'This e-mail confirmation link has already been used.');
          await tx.update(users).set({ email: change.newEmail }).where(eq(users.id, change.userId));
          await recordAudit(tx, { actorUserId: change.userId, action: 'account.email_changed', target: change.userId });
        });
      } catch (error) {
        if (isDuplicateKey(error)) throw conflict(`${change.newEmail} now belongs to another account; ask for a link to another address.`, 'token');
        throw error;
      }
      return { message: `Your e-mail address is now ${change.newEmail}.` };
    },

    /** Sets a new password after checking the current one; every other session ends, this one stays. */
    async changePassword(auth: RequestAuth, body: { currentPassword: string; password: string }) {
      await checkPassword(auth, body.currentPassword);
      await updatePasswordHash(db, auth.user.id, await hashPassword(body.password));
      await recordAudit(db, { actorUserId: auth.user.id, action: 'account.password_changed', target: auth.user.id });
      await sessions.invalidateUser(auth.user.id);
      // Like a password reset: API tokens made under the old password stop working too.
      await revokeTokensOfUser(db, auth.user.id, new Date());
      const session = await sessions.create(auth.user.id, auth.department?.id ?? null);
      return { session, message: 'Your password is changed; every other session was signed out and your API tokens were revoked.' };
    },

    /** The user's live sessions (the ids are secrets and are not shown). */
    async list(auth: RequestAuth): Promise<SessionList> {
      const rows = await db
        .select({ id: sessionsTable.id, expiresAt: sessionsTable.expiresAt, departmentName: departments.name })
        .from(sessionsTable)
        .leftJoin(departments, eq(departments.id, sessionsTable.activeDepartmentId))
        .where(eq(sessionsTable.userId, auth.user.id));
      const now = Date.now();
      return {
        sessions: rows
          .filter((r) => r.expiresAt.getTime() > now)
          .map((r) => ({ current: r.id === auth.sessionId, expiresAt: r.expiresAt.toISOString(), departmentName: r.departmentName }))
          .sort((a, b) => Number(b.current) - Number(a.current) || b.expiresAt.localeCompare(a.expiresAt)),
      };
    },

    /** Ends every session of the user, this one included, and revokes the user's API tokens. */
    async signOutEverywhere(auth: RequestAuth) {
      await sessions.invalidateUser(auth.user.id);
      await revokeTokensOfUser(db, auth.user.id, new Date());
      await recordAudit(db, { actorUserId: auth.user.id, action: 'account.signed_out_everywhere', target: auth.user.id });
    },
  };
}

export type SettingsService = ReturnType<typeof createSettingsService>;
