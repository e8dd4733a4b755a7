import type { Db } from '../../db/client.ts';
import { auditLog } from './audit.table.ts';

export interface AuditEntry {
  departmentId?: string | null;
  actorUserId?: string | null;
  action: string;
  target?: string | null;
  detail?: Record<string, unknown>;
}

/** Appends one entry to the audit log (inside the caller's transaction when given one). */
export async function recordAudit(db: Pick<Db, 'insert'>, entry: AuditEntry): Promise<void> {
  await db.insert(auditLog).values({
    at: new Date(),
    departmentId: entry.departmentId ?? null,
    actorUserId: entry.actorUserId ?? null,
    action: entry.action,
    target: entry.target ?? null,
    detail: entry.detail ?? null,
  });
}
