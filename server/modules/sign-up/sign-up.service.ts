import { and, eq, isNull } from 'drizzle-orm';
import type { Logger } from 'pino';
import type { SignUpBody } from '../../../shared/contracts/auth.ts';
import { SIGN_UP_VALID_HOURS, type SignUpRequested } from '../../../shared/contracts/sign-up.ts';
import { devOutboxUrl, publicBaseUrl, type Config } from '../../config.ts';
import type { Db } from '../../db/client.ts';
import { newId } from '../../db/columns.ts';
import { hashLinkToken, linkExpired, linkUnknown, linkUsed, newLinkToken } from '../account/link-token.ts';
import { recordAudit } from '../audit/audit.service.ts';
import { findUserByEmail } from '../auth/auth.repository.ts';
import type { AuthService } from '../auth/auth.service.ts';
import { hashPassword } from '../auth/password.ts';
import { signUpConfirmEmail, signUpExistingEmail } from '../mail/mail-templates.ts';
import type { Mailer } from '../mail/mailer.ts';
import { signUps } from './sign-ups.table.ts';

/** The one answer to a sign-up, whether or not the address has an account. */
export const SIGN_UP_REQUESTED_MESSAGE =
  `Check your mail: we sent a message to that address. If it is new to Tidefield, the message holds a link that creates your account (it works once, for ${SIGN_UP_VALID_HOURS} hours).`;

const KIND = 'sign-up link';

/**
 * Sign-up confirmed by e-mail. The request answers the same for a new and a known address and
 * does its work after answering (as a password-reset request does), so neither the answer nor
 * its time tells whether an account exists: a new address gets a link that creates the account
 * and its department; a known one a note that points to sign-in and password reset.
 */
export function createSignUpService(deps: { db: Db; config: Config; mailer: Mailer; auth: AuthService; logger: Logger }) {
  const { db, mailer, auth, logger } = deps;
  const base = publicBaseUrl(deps.config);
  const outbox = devOutboxUrl(deps.config);

  async function mailFor(body: SignUpBody) {
    const user = await findUserByEmail(db, body.email);
    if (user) {
      await recordAudit(db, { action: 'account.sign_up_for_existing', target: user.id });
      await mailer.send({
        to: user.email,
        kind: 'sign-up-existing',
        ...signUpExistingEmail({ name: user.name, signInLink: `${base}/sign-in`, resetLink: `${base}/forgot-password` }),
      });
      return;
    }
    const { token, hash } = newLinkToken();
    const now = new Date();
    const expiresAt = new Date(now.getTime() + SIGN_UP_VALID_HOURS * 3_600_000);
    const passwordHash = await hashPassword(body.password);
    await db.insert(signUps).values({
      id: newId(), email: body.email, name: body.name, departmentName: body.department, passwordHash, tokenHash: hash, createdAt: now, expiresAt, usedAt: null,
    });
    await mailer.send({
      to: body.email,
      kind: 'sign-up',
      ...signUpConfirmEmail({ name: body.name, departmentName: body.department, link: `${base}/confirm-sign-up?token=${token}`, expiresAt }),
    });
  }

  return {
    request(body: SignUpBody): SignUpRequested {
      void mailFor(body).catch((error: unknown) => logger.error({ err: error }, 'sign-up mail could not be sent'));
      return outbox ? { message: SIGN_UP_REQUESTED_MESSAGE, localMailbox: `${outbox}/messages` } : { message: SIGN_UP_REQUESTED_MESSAGE };
    },

    /** Creates the account and its department from a single-use link and signs in. */
    async confirm(token: string) {
      const pending = (await db.select().from(signUps).where(eq(signUps.tokenHash, hashLinkToken(token))).limit(1))[0];
      if (!pending) throw linkUnknown(KIND);
      if (pending.usedAt) throw linkUsed(KIND);
      if (pending.expiresAt.getTime() <= Date.now()) throw linkExpired(KIND, `${SIGN_UP_VALID_HOURS} hours`);
      return auth.createAccountAndSignIn(
        { email: pending.email, passwordHash: pending.passwordHash, name: pending.name, department: pending.departmentName },
        async (tx) => {
          const used = await tx.update(signUps).set({ usedAt: new Date() }).where(and(eq(signUps.id, pending.id), isNull(signUps.usedAt)));
          if (used[0].affectedRows !== 1) throw linkUsed(KIND);
        },
      );
    },
  };
}

export type SignUpService = ReturnType<typeof createSignUpService>;
