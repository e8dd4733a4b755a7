import { and, eq } from 'drizzle-orm';
import { fractionOrLimitText } from '../../../shared/engine/stats/fraction-text.ts';
import type { Db } from '../../db/client.ts';
import { recordAudit } from '../audit/audit.service.ts';
import { auditLog } from '../audit/audit.table.ts';
import { runsOfSweep } from './runs.repository.ts';
import type { RunRow } from './runs.table.ts';
import { sweeps } from '../sweeps/sweeps.table.ts';

const FINAL = new Set(['succeeded', 'failed', 'cancelled']);

export interface FinishedSweep {
  sweep: typeof sweeps.$inferSelect;
  points: RunRow[];
}

/**
 * Called when a point of a sweep settles: the sweep once every point has ended, else null.
 * Exactly one caller gets it (two points can settle at the same moment): the sweep's row is
 * locked and the audit log's "sweep.notified" entry marks the notice as claimed.
 */
export async function claimFinishedSweep(db: Db, sweepId: string): Promise<FinishedSweep | null> {
  const points = await runsOfSweep(db, sweepId);
  if (points.length === 0 || !points.every((p) => FINAL.has(p.status))) return null;
  return db.transaction(async (tx) => {
    const [sweep] = await tx.select().from(sweeps).where(eq(sweeps.id, sweepId)).for('update');
    if (!sweep || points.length < sweep.pointCount) return null;
    const claimed = await tx.select({ id: auditLog.id }).from(auditLog).where(and(eq(auditLog.action, 'sweep.notified'), eq(auditLog.target, sweepId))).limit(1);
    if (claimed.length > 0) return null;
    await recordAudit(tx, { departmentId: sweep.departmentId, action: 'sweep.notified', target: sweepId });
    return { sweep, points };
  });
}

/** The lowest and highest predicted fraction among the succeeded points, as text (null when none succeeded with white dwarfs). */
export function fractionSpan(points: RunRow[]): { lowest: string; highest: string } | null {
  const done = points.filter((p) => p.status === 'succeeded' && p.fraction !== null && (p.whiteDwarfs ?? 0) > 0);
  if (done.length === 0) return null;
  const sorted = [...done].sort((a, b) => a.fraction! - b.fraction!);
  const text = (p: RunRow) => fractionOrLimitText(p.magnetic ?? 0, p.whiteDwarfs ?? 0, p.fractionSe ?? 0) ?? '—';
  return { lowest: text(sorted[0]), highest: text(sorted[sorted.length - 1]) };
}
