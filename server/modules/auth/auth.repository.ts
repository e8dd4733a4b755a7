import { eq } from 'drizzle-orm';
import type { Db } from '../../db/client.ts';
import { isDuplicateKey } from '../../lib/errors.ts';
import type { DbOrTx } from '../departments/departments.repository.ts';
import { sessions } from './sessions.table.ts';
import { users } from '../users/users.table.ts';
import { emailTaken } from './auth.errors.ts';

export async function findUserByEmail(db: DbOrTx, email: string) {
  const rows = await db.select().from(users).where(eq(users.email, email)).limit(1);
  return rows[0];
}

export async function findUserById(db: DbOrTx, id: string) {
  const rows = await db.select().from(users).where(eq(users.id, id)).limit(1);
  return rows[0];
}

export async function insertUser(db: DbOrTx, values: typeof users.$inferInsert) {
  try {
    await db.insert(users).values(values);
  } catch (error) {
    if (isDuplicateKey(error)) throw emailTaken();
    throw error;
  }
}

export async function setActiveDepartment(db: Db, sessionId: string, departmentId: string | null) {
  await db.update(sessions).set({ activeDepartmentId: departmentId }).where(eq(sessions.id, sessionId));
}
