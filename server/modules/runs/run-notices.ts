import { fractionOrLimitText } from '../../../shared/engine/stats/fraction-text.ts';
import { publicBaseUrl, type Config } from '../../config.ts';
import type { Db } from '../../db/client.ts';
import { findNotificationSettings } from '../account/account.repository.ts';
import { findUserById } from '../auth/auth.repository.ts';
import type { RunRow } from './runs.table.ts';
import { runFailedEmail, runFinishedEmail, sweepFinishedEmail } from '../mail/mail-templates.ts';
import type { Mailer } from '../mail/mailer.ts';
import { claimFinishedSweep, fractionSpan } from './sweep-notices.ts';

/**
 * E-mails a run's owner when it succeeds or fails (not when cancelled), if their settings allow.
 * A sweep's points send nothing of their own: the sweep sends one e-mail when its last point ends.
 */
export function createRunNotices(deps: { db: Db; config: Config; mailer: Mailer }) {
  const { db, mailer } = deps;
  const base = publicBaseUrl(deps.config);
  const settingsLink = `${base}/settings`;

  async function sweepNotice(sweepId: string): Promise<void> {
    const finished = await claimFinishedSweep(db, sweepId);
    if (!finished) return;
    const { sweep, points } = finished;
    const tally = (status: string) => points.filter((p) => p.status === status).length;
    const succeeded = tally('succeeded');
    const failed = tally('failed');
    // A sweep cancelled as a whole was stopped on purpose: nothing to report.
    if (succeeded === 0 && failed === 0) return;
    const owner = await findUserById(db, sweep.ownerUserId);
    if (!owner) return;
    const settings = await findNotificationSettings(db, owner.id);
    if (succeeded > 0 ? !settings.runFinished : !settings.runFailed) return;
    const span = fractionSpan(points);
    mailer.sendInBackground({
      to: owner.email,
      kind: 'sweep-finished',
      departmentId: sweep.departmentId,
      ...sweepFinishedEmail({
        name: owner.name,
        sweepName: sweep.name,
        points: points.length,
        succeeded,
        failed,
        cancelled: tally('cancelled'),
        systems: sweep.systems,
        lowest: span?.lowest ?? null,
        highest: span?.highest ?? null,
        link: `${base}/sweeps/${sweep.id}`,
        settingsLink,
      }),
    });
  }

  return async (run: RunRow, outcome: 'succeeded' | 'failed' | 'cancelled', refundedCredits: number): Promise<void> => {
    if (run.sweepId) return sweepNotice(run.sweepId);
    if (outcome === 'cancelled') return;
    const owner = await findUserById(db, run.ownerUserId);
    if (!owner) return;
    const settings = await findNotificationSettings(db, owner.id);
    if (outcome === 'succeeded' ? !settings.runFinished : !settings.runFailed) return;
    // A fit's computing run links to the fit.
    const common = { name: owner.name, scenarioName: run.scenarioName, link: run.fitId ? `${base}/fits/${run.fitId}` : `${base}/runs/${run.id}`, settingsLink };
    mailer.sendInBackground({
      to: owner.email,
      kind: outcome === 'succeeded' ? 'run-finished' : 'run-failed',
      departmentId: run.departmentId,
      ...(outcome === 'succeeded'
        ? runFinishedEmail({ ...common, systems: run.systems, fraction: fractionOrLimitText(run.magnetic ?? 0, run.whiteDwarfs ?? 0, run.fractionSe ?? 0) })
        : runFailedEmail({ ...common, error: run.error ?? 'unknown error', refundedCredits })),
    });
  };
}
