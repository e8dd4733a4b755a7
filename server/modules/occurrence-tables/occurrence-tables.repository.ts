import { and, asc, desc, eq } from 'drizzle-orm';
import type { CompanionRow } from '../../../shared/contracts/occurrence-table.ts';
import type { Db } from '../../db/client.ts';
import type { DbOrTx } from '../departments/departments.repository.ts';
import { occurrenceRows, occurrenceTables } from './occurrence-tables.table.ts';

export type TableRow = typeof occurrenceTables.$inferSelect;

export async function listTables(db: Db, departmentId: string) {
  return db.select().from(occurrenceTables).where(eq(occurrenceTables.departmentId, departmentId)).orderBy(desc(occurrenceTables.updatedAt));
}

export async function findTable(db: DbOrTx, departmentId: string, id: string) {
  const rows = await db.select().from(occurrenceTables).where(and(eq(occurrenceTables.departmentId, departmentId), eq(occurrenceTables.id, id))).limit(1);
  return rows[0];
}

export async function tableRows(db: DbOrTx, tableId: string): Promise<CompanionRow[]> {
  const rows = await db.select({ row: occurrenceRows.row }).from(occurrenceRows).where(eq(occurrenceRows.tableId, tableId)).orderBy(asc(occurrenceRows.position));
  return rows.map((r) => r.row);
}

const INSERT_BATCH = 500;

/** Replaces every row of a table (inside the caller's transaction). */
export async function replaceRows(tx: DbOrTx, tableId: string, rows: readonly CompanionRow[]) {
  await tx.delete(occurrenceRows).where(eq(occurrenceRows.tableId, tableId));
  for (let start = 0; start < rows.length; start += INSERT_BATCH) {
    await tx.insert(occurrenceRows).values(
      rows.slice(start, start + INSERT_BATCH).map((row, i) => ({
        tableId,
        position: start + i,
        companionClass: row.class,
        occurrence: row.occurrence,
        periodMinDays: row.periodDays[0],
        periodMaxDays: row.periodDays[1],
        row,
      })),
    );
  }
}

export async function insertTable(tx: DbOrTx, values: typeof occurrenceTables.$inferInsert) {
  await tx.insert(occurrenceTables).values(values);
}

export async function updateTable(tx: DbOrTx, id: string, values: Partial<typeof occurrenceTables.$inferInsert>) {
  await tx.update(occurrenceTables).set(values).where(eq(occurrenceTables.id, id));
}

export async function deleteTable(tx: DbOrTx, id: string) {
  await tx.delete(occurrenceTables).where(eq(occurrenceTables.id, id));
}
