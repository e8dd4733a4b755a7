import type { Logger } from 'pino';
import { PASSWORD_RESET_VALID_HOURS, type NotificationSettings, type PasswordResetConfirm } from '../../../shared/contracts/account.ts';
import { publicBaseUrl, type Config } from '../../config.ts';
import type { Db } from '../../db/client.ts';
import { newId } from '../../db/columns.ts';
import { recordAudit } from '../audit/audit.service.ts';
import type { RequestAuth } from '../../lib/request-auth.ts';
import { findUserByEmail } from '../auth/auth.repository.ts';
import { hashPassword } from '../auth/password.ts';
import type { SessionStore } from '../auth/session.ts';
import { passwordResetEmail } from '../mail/mail-templates.ts';
import { revokeTokensOfUser } from '../tokens/tokens.service.ts';
import type { Mailer } from '../mail/mailer.ts';
import {
  consumePasswordReset,
  findNotificationSettings,
  findPasswordReset,
  insertPasswordReset,
  retirePasswordResets,
  saveNotificationSettings,
  updatePasswordHash,
} from './account.repository.ts';
import { hashLinkToken, linkExpired, linkUnknown, linkUsed, newLinkToken } from './link-token.ts';

/** The one answer to a reset request, whether or not the address has an account. */
export const RESET_REQUESTED_MESSAGE =
  `If an account uses that address, a link to choose a new password is on its way. It works once, for ${PASSWORD_RESET_VALID_HOURS} hour.`;

const KIND = 'password-reset link';

export function createAccountService(deps: { db: Db; config: Config; mailer: Mailer; sessions: SessionStore; logger: Logger }) {
  const { db, config, mailer, sessions, logger } = deps;
  const base = publicBaseUrl(config);

  async function issueReset(user: { id: string; email: string; name: string }) {
    const { token, hash } = newLinkToken();
    const now = new Date();
    const expiresAt = new Date(now.getTime() + PASSWORD_RESET_VALID_HOURS * 3_600_000);
    await insertPasswordReset(db, { id: newId(), userId: user.id, tokenHash: hash, createdAt: now, expiresAt, usedAt: null });
    await recordAudit(db, { action: 'account.password_reset_requested', target: user.id });
    await mailer.send({ to: user.email, kind: 'password-reset', ...passwordResetEmail({ name: user.name, link: `${base}/reset-password?token=${token}`, expiresAt }) });
  }

  return {
    /** Answers the same whether or not the address has an account. */
    async requestPasswordReset(email: string): Promise<{ message: string }> {
      const user = await findUserByEmail(db, email);
      // The link is stored and mailed after the answer, so that the answer takes as long either way.
      if (user) {
        void issueReset(user).catch((error: unknown) => logger.error({ err: error }, 'password reset could not be issued'));
      }
      return { message: RESET_REQUESTED_MESSAGE };
    },

    /** Sets the new password from a single-use link and ends every session and API token of the account. */
    async confirmPasswordReset(body: PasswordResetConfirm): Promise<void> {
      const reset = await findPasswordReset(db, hashLinkToken(body.token));
      if (!reset) throw linkUnknown(KIND);
      if (reset.usedAt) throw linkUsed(KIND);
      if (reset.expiresAt.getTime() <= Date.now()) throw linkExpired(KIND, `${PASSWORD_RESET_VALID_HOURS} hour`);
      const passwordHash = await hashPassword(body.password);
      await db.transaction(async (tx) => {
        const now = new Date();
        if (!(await consumePasswordReset(tx, reset.id, now))) throw linkUsed(KIND);
        await updatePasswordHash(tx, reset.userId, passwordHash);
        await retirePasswordResets(tx, reset.userId, now);
        await revokeTokensOfUser(tx, reset.userId, now);
        await recordAudit(tx, { actorUserId: reset.userId, action: 'account.password_reset', target: reset.userId });
      });
      await sessions.invalidateUser(reset.userId);
    },

    notificationSettings: (auth: RequestAuth) => findNotificationSettings(db, auth.user.id),

    async saveNotificationSettings(auth: RequestAuth, settings: NotificationSettings): Promise<NotificationSettings> {
      await saveNotificationSettings(db, auth.user.id, settings);
      return settings;
    },
  };
}

export type AccountService = ReturnType<typeof createAccountService>;
