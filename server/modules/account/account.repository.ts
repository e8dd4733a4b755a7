import { and, eq, isNull } from 'drizzle-orm';
import type { NotificationSettings } from '../../../shared/contracts/account.ts';
import { users } from '../users/users.table.ts';
import type { DbOrTx } from '../departments/departments.repository.ts';
import { notificationSettings, passwordResets } from './account.table.ts';

export const DEFAULT_NOTIFICATIONS: NotificationSettings = { runFinished: true, runFailed: true };

export async function findNotificationSettings(db: DbOrTx, userId: string): Promise<NotificationSettings> {
  const rows = await db.select().from(notificationSettings).where(eq(notificationSettings.userId, userId)).limit(1);
  return rows[0] ? { runFinished: rows[0].runFinished, runFailed: rows[0].runFailed } : DEFAULT_NOTIFICATIONS;
}

export async function saveNotificationSettings(db: DbOrTx, userId: string, settings: NotificationSettings) {
  const values = { ...settings, updatedAt: new Date() };
  await db.insert(notificationSettings).values({ userId, ...values }).onDuplicateKeyUpdate({ set: values });
}

export async function insertPasswordReset(db: DbOrTx, values: typeof passwordResets.$inferInsert) {
  await db.insert(passwordResets).values(values);
}

export async function findPasswordReset(db: DbOrTx, tokenHash: string) {
  const rows = await db.select().from(passwordResets).where(eq(passwordResets.tokenHash, tokenHash)).limit(1);
  return rows[0];
}

/** Marks a reset used; false when another request used it first (single use without a lock). */
export async function consumePasswordReset(db: DbOrTx, id: string, at: Date): Promise<boolean> {
  const result = await db.update(passwordResets).set({ usedAt: at }).where(and(eq(passwordResets.id, id), isNull(passwordResets.usedAt)));
  return result[0].affectedRows === 1;
}

/** Every other open reset link of the user stops working once the password changed. */
export async function retirePasswordResets(db: DbOrTx, userId: string, at: Date) {
  await db.update(passwordResets).set({ usedAt: at }).where(and(eq(passwordResets.userId, userId), isNull(passwordResets.usedAt)));
}

export async function updatePasswordHash(db: DbOrTx, userId: string, passwordHash: string) {
  await db.update(users).set({ passwordHash }).where(eq(users.id, userId));
}
