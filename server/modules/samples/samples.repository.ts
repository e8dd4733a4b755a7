import { and, asc, desc, eq, inArray, isNull, or } from 'drizzle-orm';
import type { Db } from '../../db/client.ts';
import type { DbOrTx } from '../departments/departments.repository.ts';
import { sampleBins, samples } from './samples.table.ts';

export type SampleRow = typeof samples.$inferSelect;
export type SampleBinRow = typeof sampleBins.$inferSelect;

/** A department's samples and the library (department_id NULL). */
const visibleTo = (departmentId: string) => or(eq(samples.departmentId, departmentId), isNull(samples.departmentId));

export async function listVisibleSamples(db: Db, departmentId: string) {
  return db.select().from(samples).where(visibleTo(departmentId)).orderBy(asc(samples.libraryKey), desc(samples.updatedAt));
}

export async function findVisibleSample(db: DbOrTx, departmentId: string, id: string) {
  const rows = await db.select().from(samples).where(and(visibleTo(departmentId), eq(samples.id, id))).limit(1);
  return rows[0];
}

export async function binsOf(db: DbOrTx, sampleIds: string[]) {
  if (sampleIds.length === 0) return [];
  return db.select().from(sampleBins).where(inArray(sampleBins.sampleId, sampleIds)).orderBy(asc(sampleBins.id));
}

export async function insertSample(tx: DbOrTx, values: typeof samples.$inferInsert) {
  await tx.insert(samples).values(values);
}

export async function updateSample(tx: DbOrTx, id: string, values: Partial<typeof samples.$inferInsert>) {
  await tx.update(samples).set(values).where(eq(samples.id, id));
}

export async function replaceBins(tx: DbOrTx, sampleId: string, bins: Omit<typeof sampleBins.$inferInsert, 'sampleId'>[]) {
  await tx.delete(sampleBins).where(eq(sampleBins.sampleId, sampleId));
  if (bins.length > 0) await tx.insert(sampleBins).values(bins.map((b) => ({ ...b, sampleId })));
}

export async function deleteSample(tx: DbOrTx, id: string) {
  await tx.delete(samples).where(eq(samples.id, id));
}

export async function findLibraryEntry(db: DbOrTx, libraryKey: string) {
  const rows = await db.select().from(samples).where(eq(samples.libraryKey, libraryKey)).limit(1);
  return rows[0];
}
