import { publicBaseUrl, type Config } from '../../config.ts';
import type { Db } from '../../db/client.ts';
import { findNotificationSettings } from '../account/account.repository.ts';
import { findUserById } from '../auth/auth.repository.ts';
import type { RunRow } from './runs.table.ts';
import { runFailedEmail, runFinishedEmail } from '../mail/mail-templates.ts';
import type { Mailer } from '../mail/mailer.ts';

/** E-mails a run's owner when it succeeds or fails (not when cancelled), if their settings allow. */
export function createRunNotices(deps: { db: Db; config: Config; mailer: Mailer }) {
  const { db, mailer } = deps;
  const base = publicBaseUrl(deps.config);
  return async (run: RunRow, outcome: 'succeeded' | 'failed' | 'cancelled', refundedCredits: number): Promise<void> => {
    if (outcome === 'cancelled') return;
    const owner = await findUserById(db, run.ownerUserId);
    if (!owner) return;
    const settings = await findNotificationSettings(db, owner.id);
    if (outcome === 'succeeded' ? !settings.runFinished : !settings.runFailed) return;
    const common = { name: owner.name, scenarioName: run.scenarioName, link: `${base}/runs/${run.id}`, settingsLink: `${base}/notifications` };
    mailer.sendInBackground({
      to: owner.email,
      kind: outcome === 'succeeded' ? 'run-finished' : 'run-failed',
      departmentId: run.departmentId,
      ...(outcome === 'succeeded'
        ? runFinishedEmail({ ...common, systems: run.systems, fraction: run.fraction, fractionSe: run.fractionSe })
        : runFailedEmail({ ...common, error: run.error ?? 'unknown error', refundedCredits })),
    });
  };
}
