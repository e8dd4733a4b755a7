import { and, asc, eq, sql } from 'drizzle-orm';
import type { Role } from '../../../shared/contracts/roles.ts';
import type { Db, Tx } from '../../db/client.ts';
import { users } from '../users/users.table.ts';
import { departments, memberships } from './departments.table.ts';

export type DbOrTx = Db | Tx;

export async function membershipsOfUser(db: DbOrTx, userId: string) {
  return db
    .select({ departmentId: memberships.departmentId, departmentName: departments.name, role: memberships.role, joinedAt: memberships.createdAt })
    .from(memberships)
    .innerJoin(departments, eq(departments.id, memberships.departmentId))
    .where(eq(memberships.userId, userId))
    .orderBy(asc(memberships.createdAt));
}

export async function membersOfDepartment(db: DbOrTx, departmentId: string) {
  return db
    .select({ userId: users.id, email: users.email, name: users.name, role: memberships.role, joinedAt: memberships.createdAt })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(eq(memberships.departmentId, departmentId))
    .orderBy(asc(users.name), asc(users.email));
}

/** Locks the department's membership rows (SELECT … FOR UPDATE) so that admin counts stay true inside a transaction. */
export async function lockMemberships(tx: Tx, departmentId: string) {
  return tx
    .select({ userId: memberships.userId, role: memberships.role })
    .from(memberships)
    .where(eq(memberships.departmentId, departmentId))
    .for('update');
}

export async function updateRole(tx: DbOrTx, departmentId: string, userId: string, role: Role) {
  await tx.update(memberships).set({ role }).where(and(eq(memberships.departmentId, departmentId), eq(memberships.userId, userId)));
}

export async function deleteMembership(tx: DbOrTx, departmentId: string, userId: string) {
  await tx.delete(memberships).where(and(eq(memberships.departmentId, departmentId), eq(memberships.userId, userId)));
}

export async function insertDepartment(tx: DbOrTx, values: { id: string; name: string; createdAt: Date }) {
  await tx.insert(departments).values(values);
}

export async function insertMembership(tx: DbOrTx, values: { userId: string; departmentId: string; role: Role; createdAt: Date }) {
  await tx.insert(memberships).values(values);
}

export async function findDepartmentByName(db: DbOrTx, name: string) {
  const rows = await db.select().from(departments).where(eq(departments.name, name)).limit(1);
  return rows[0];
}

export async function countDepartments(db: DbOrTx): Promise<number> {
  const rows = await db.select({ n: sql<number>`count(*)` }).from(departments);
  return Number(rows[0]?.n ?? 0);
}
