import { and, desc, eq, isNull } from 'drizzle-orm';
import type { Db } from '../../db/client.ts';
import type { DbOrTx } from '../departments/departments.repository.ts';
import { users } from '../users/users.table.ts';
import { scenarios, scenarioVersions } from './scenarios.table.ts';

export type ScenarioRow = typeof scenarios.$inferSelect;
export type ScenarioVersionRow = typeof scenarioVersions.$inferSelect;

const live = (departmentId: string) => and(eq(scenarios.departmentId, departmentId), isNull(scenarios.deletedAt));

export async function listScenarios(db: Db, departmentId: string) {
  return db
    .select({ scenario: scenarios, version: scenarioVersions, ownerName: users.name })
    .from(scenarios)
    .innerJoin(scenarioVersions, and(eq(scenarioVersions.scenarioId, scenarios.id), eq(scenarioVersions.version, scenarios.currentVersion)))
    .innerJoin(users, eq(users.id, scenarios.ownerUserId))
    .where(live(departmentId))
    .orderBy(desc(scenarios.updatedAt));
}

/** The scenario with its current (or a given) version, only within the department and not deleted. */
export async function findScenario(db: DbOrTx, departmentId: string, id: string, version?: number) {
  const rows = await db
    .select({ scenario: scenarios, version: scenarioVersions, ownerName: users.name })
    .from(scenarios)
    .innerJoin(scenarioVersions, eq(scenarioVersions.scenarioId, scenarios.id))
    .innerJoin(users, eq(users.id, scenarios.ownerUserId))
    .where(and(live(departmentId), eq(scenarios.id, id), eq(scenarioVersions.version, version ?? scenarios.currentVersion)))
    .limit(1);
  return rows[0];
}

export async function listVersions(db: Db, scenarioId: string) {
  return db.select().from(scenarioVersions).where(eq(scenarioVersions.scenarioId, scenarioId)).orderBy(desc(scenarioVersions.version));
}

export async function insertScenario(tx: DbOrTx, scenario: typeof scenarios.$inferInsert, version: typeof scenarioVersions.$inferInsert) {
  await tx.insert(scenarios).values(scenario);
  await tx.insert(scenarioVersions).values(version);
}

/** Locks the scenario row so concurrent saves number their versions one after the other. */
export async function lockScenario(tx: DbOrTx, departmentId: string, id: string) {
  const rows = await tx.select().from(scenarios).where(and(live(departmentId), eq(scenarios.id, id))).for('update');
  return rows[0];
}

export async function insertVersion(tx: DbOrTx, version: typeof scenarioVersions.$inferInsert) {
  await tx.insert(scenarioVersions).values(version);
}

export async function updateScenarioRow(tx: DbOrTx, id: string, values: Partial<typeof scenarios.$inferInsert>) {
  await tx.update(scenarios).set(values).where(eq(scenarios.id, id));
}
