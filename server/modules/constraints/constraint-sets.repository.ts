import { and, desc, eq, isNull } from 'drizzle-orm';
import type { Db } from '../../db/client.ts';
import type { DbOrTx } from '../departments/departments.repository.ts';
import { constraintSets, constraintSetVersions } from './constraint-sets.table.ts';

export type ConstraintSetRow = typeof constraintSets.$inferSelect;
export type ConstraintSetVersionRow = typeof constraintSetVersions.$inferSelect;

const live = (departmentId: string) => and(eq(constraintSets.departmentId, departmentId), isNull(constraintSets.deletedAt));

/** The department's live sets, each with its current version. */
export async function listConstraintSets(db: Db, departmentId: string) {
  return db
    .select({ set: constraintSets, version: constraintSetVersions })
    .from(constraintSets)
    .innerJoin(constraintSetVersions, and(eq(constraintSetVersions.setId, constraintSets.id), eq(constraintSetVersions.version, constraintSets.currentVersion)))
    .where(live(departmentId))
    .orderBy(desc(constraintSets.updatedAt));
}

/** One set with its current (or a given) version, only within the department and not deleted. */
export async function findConstraintSet(db: DbOrTx, departmentId: string, id: string, version?: number) {
  const rows = await db
    .select({ set: constraintSets, version: constraintSetVersions })
    .from(constraintSets)
    .innerJoin(constraintSetVersions, eq(constraintSetVersions.setId, constraintSets.id))
    .where(and(live(departmentId), eq(constraintSets.id, id), eq(constraintSetVersions.version, version ?? constraintSets.currentVersion)))
    .limit(1);
  return rows[0];
}

export async function listConstraintSetVersions(db: Db, setId: string) {
  return db.select().from(constraintSetVersions).where(eq(constraintSetVersions.setId, setId)).orderBy(desc(constraintSetVersions.version));
}

export async function insertConstraintSet(tx: DbOrTx, set: typeof constraintSets.$inferInsert, version: typeof constraintSetVersions.$inferInsert) {
  await tx.insert(constraintSets).values(set);
  await tx.insert(constraintSetVersions).values(version);
}

/** Locks the set's row so that concurrent saves number their versions one after the other. */
export async function lockConstraintSet(tx: DbOrTx, departmentId: string, id: string) {
  const rows = await tx.select().from(constraintSets).where(and(live(departmentId), eq(constraintSets.id, id))).for('update');
  return rows[0];
}

export async function insertConstraintSetVersion(tx: DbOrTx, version: typeof constraintSetVersions.$inferInsert) {
  await tx.insert(constraintSetVersions).values(version);
}

export async function updateConstraintSetRow(tx: DbOrTx, id: string, values: Partial<typeof constraintSets.$inferInsert>) {
  await tx.update(constraintSets).set(values).where(eq(constraintSets.id, id));
}
