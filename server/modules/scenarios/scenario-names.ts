import { and, eq, isNull, ne } from 'drizzle-orm';
import type { DbOrTx } from '../departments/departments.repository.ts';
import { conflict } from '../../lib/errors.ts';
import { scenarios } from './scenarios.table.ts';

/** Names compare without case and surrounding spaces: "Baseline" and " baseline " cannot be told apart in a drop-down. */
const key = (name: string) => name.trim().toLowerCase();

async function namesInUse(db: DbOrTx, departmentId: string, exceptId?: string): Promise<Set<string>> {
  const rows = await db
    .select({ name: scenarios.name })
    .from(scenarios)
    .where(and(eq(scenarios.departmentId, departmentId), isNull(scenarios.deletedAt), ...(exceptId ? [ne(scenarios.id, exceptId)] : [])));
  return new Set(rows.map((r) => key(r.name)));
}

/** The first of "name", "name (2)", "name (3)", … that no other scenario of the department uses. */
export function freeName(name: string, used: Set<string>): string {
  const base = name.trim();
  if (!used.has(key(base))) return base;
  for (let n = 2; ; n++) {
    const suffix = ` (${n})`;
    const candidate = `${base.slice(0, 160 - suffix.length)}${suffix}`;
    if (!used.has(key(candidate))) return candidate;
  }
}

/** Refuses a name another scenario of the department already has (409 at the name field, with a free name to use instead). */
export async function requireUniqueName(db: DbOrTx, departmentId: string, name: string, exceptId?: string): Promise<void> {
  const used = await namesInUse(db, departmentId, exceptId);
  if (!used.has(key(name))) return;
  throw conflict(`Another scenario of this department is already called "${name.trim()}"; choose a name that tells them apart, e.g. "${freeName(name, used)}".`, 'name');
}

/** A name for a copy that no other scenario uses ("Copy of X", then "Copy of X (2)", …). */
export async function uniqueName(db: DbOrTx, departmentId: string, name: string): Promise<string> {
  return freeName(name, await namesInUse(db, departmentId));
}
