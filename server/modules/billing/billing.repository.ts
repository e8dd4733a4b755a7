import { and, count, desc, eq, inArray, sql } from 'drizzle-orm';
import type { LedgerKind } from '../../../shared/contracts/billing.ts';
import type { Tx } from '../../db/client.ts';
import { isDuplicateKey } from '../../lib/errors.ts';
import { users } from '../users/users.table.ts';
import type { DbOrTx } from '../departments/departments.repository.ts';
import { departments } from '../departments/departments.table.ts';
import { runs } from '../runs/runs.table.ts';
import { billingAccounts, creditCheckouts, creditLedger, paymentEvents, type BillingAccountRow, type CheckoutRow } from './billing.table.ts';

/**
 * Takes the department's account row lock, creating the row on first use. The first statement
 * is an upsert, which takes the row's exclusive lock at once (a plain SELECT … FOR UPDATE on a
 * missing row would take gap locks that two first-time callers could deadlock on).
 */
export async function lockAccount(tx: Tx, departmentId: string, now: Date): Promise<BillingAccountRow> {
  await tx
    .insert(billingAccounts)
    .values({ departmentId, balanceCredits: 0, freeSystemsLeft: 0, allowancePeriod: null, createdAt: now, updatedAt: now })
    .onDuplicateKeyUpdate({ set: { departmentId: sql`department_id` } });
  const rows = await tx.select().from(billingAccounts).where(eq(billingAccounts.departmentId, departmentId)).for('update');
  if (!rows[0]) throw new Error(`billing account of ${departmentId} vanished`);
  return rows[0];
}

export async function readAccount(db: DbOrTx, departmentId: string): Promise<BillingAccountRow | undefined> {
  const rows = await db.select().from(billingAccounts).where(eq(billingAccounts.departmentId, departmentId)).limit(1);
  return rows[0];
}

export async function updateAccount(tx: Tx, departmentId: string, values: Partial<Pick<BillingAccountRow, 'balanceCredits' | 'freeSystemsLeft' | 'allowancePeriod' | 'paymentCustomerId'>>, now: Date) {
  await tx.update(billingAccounts).set({ ...values, updatedAt: now }).where(eq(billingAccounts.departmentId, departmentId));
}

export interface NewLedgerEntry {
  kind: LedgerKind;
  credits: number;
  freeSystems: number;
  period: string;
  runId?: string | null;
  checkoutId?: string | null;
  actorUserId?: string | null;
  reason?: string | null;
  idempotencyKey: string;
}

export async function insertLedgerEntry(tx: Tx, departmentId: string, entry: NewLedgerEntry & { balanceAfter: number; createdAt: Date }) {
  await tx.insert(creditLedger).values({
    departmentId,
    kind: entry.kind,
    credits: entry.credits,
    freeSystems: entry.freeSystems,
    period: entry.period,
    balanceAfter: entry.balanceAfter,
    runId: entry.runId ?? null,
    checkoutId: entry.checkoutId ?? null,
    actorUserId: entry.actorUserId ?? null,
    reason: entry.reason?.slice(0, 500) ?? null,
    idempotencyKey: entry.idempotencyKey,
    createdAt: entry.createdAt,
  });
}

export async function findLedgerEntry(db: DbOrTx, idempotencyKey: string) {
  const rows = await db.select().from(creditLedger).where(eq(creditLedger.idempotencyKey, idempotencyKey)).limit(1);
  return rows[0];
}

/** The ledger's own sums for a department (the account row must always agree with them). */
export async function ledgerTotals(db: DbOrTx, departmentId: string, period: string) {
  const rows = await db
    .select({
      credits: sql<string>`coalesce(sum(${creditLedger.credits}), 0)`,
      freeSystems: sql<string>`coalesce(sum(case when ${creditLedger.period} = ${period} then ${creditLedger.freeSystems} else 0 end), 0)`,
    })
    .from(creditLedger)
    .where(eq(creditLedger.departmentId, departmentId));
  return { credits: Number(rows[0]?.credits ?? 0), freeSystems: Number(rows[0]?.freeSystems ?? 0) };
}

/** Credits held by reservations that are neither settled nor refunded yet. */
export async function reservedCredits(db: DbOrTx, departmentId: string): Promise<number> {
  const finished = db
    .select({ runId: creditLedger.runId })
    .from(creditLedger)
    .where(and(eq(creditLedger.departmentId, departmentId), inArray(creditLedger.kind, ['settlement', 'refund'])));
  const rows = await db
    .select({ held: sql<string>`coalesce(sum(-${creditLedger.credits}), 0)` })
    .from(creditLedger)
    .where(and(eq(creditLedger.departmentId, departmentId), eq(creditLedger.kind, 'reservation'), sql`${creditLedger.runId} not in (${finished})`));
  return Number(rows[0]?.held ?? 0);
}

export async function listLedger(db: DbOrTx, departmentId: string, page: number, pageSize: number) {
  const [rows, total] = await Promise.all([
    db
      .select({ entry: creditLedger, actorName: users.name, scenarioName: runs.scenarioName, systems: runs.systems, packId: creditCheckouts.packId })
      .from(creditLedger)
      .leftJoin(users, eq(users.id, creditLedger.actorUserId))
      .leftJoin(runs, eq(runs.id, creditLedger.runId))
      .leftJoin(creditCheckouts, eq(creditCheckouts.id, creditLedger.checkoutId))
      .where(eq(creditLedger.departmentId, departmentId))
      .orderBy(desc(creditLedger.id))
      .limit(pageSize)
      .offset((page - 1) * pageSize),
    db.select({ n: count() }).from(creditLedger).where(eq(creditLedger.departmentId, departmentId)),
  ]);
  return { rows, total: Number(total[0]?.n ?? 0) };
}

export async function insertCheckout(db: DbOrTx, values: typeof creditCheckouts.$inferInsert) {
  await db.insert(creditCheckouts).values(values);
}

export async function updateCheckout(db: DbOrTx, id: string, values: Partial<typeof creditCheckouts.$inferInsert>) {
  await db.update(creditCheckouts).set(values).where(eq(creditCheckouts.id, id));
}

export async function findCheckout(db: DbOrTx, id: string): Promise<CheckoutRow | undefined> {
  const rows = await db.select().from(creditCheckouts).where(eq(creditCheckouts.id, id)).limit(1);
  return rows[0];
}

export async function lockCheckout(tx: Tx, id: string): Promise<CheckoutRow | undefined> {
  const rows = await tx.select().from(creditCheckouts).where(eq(creditCheckouts.id, id)).for('update');
  return rows[0];
}

/** A department's checkouts with the name of who started each (newest first). */
export async function listCheckouts(db: DbOrTx, departmentId: string, where: { id?: string; status?: CheckoutRow['status'] } = {}) {
  return db
    .select({ checkout: creditCheckouts, createdByName: users.name, createdByEmail: users.email, departmentName: departments.name })
    .from(creditCheckouts)
    .innerJoin(users, eq(users.id, creditCheckouts.createdByUserId))
    .innerJoin(departments, eq(departments.id, creditCheckouts.departmentId))
    .where(
      and(
        eq(creditCheckouts.departmentId, departmentId),
        where.id ? eq(creditCheckouts.id, where.id) : undefined,
        where.status ? eq(creditCheckouts.status, where.status) : undefined,
      ),
    )
    .orderBy(desc(creditCheckouts.createdAt))
    .limit(200);
}

/** Records a webhook event once. False when its id was seen before (a replay). */
export async function insertPaymentEventOnce(db: DbOrTx, values: typeof paymentEvents.$inferInsert): Promise<boolean> {
  try {
    await db.insert(paymentEvents).values(values);
    return true;
  } catch (error) {
    if (isDuplicateKey(error)) return false;
    throw error;
  }
}

export async function setPaymentEventOutcome(db: DbOrTx, eventId: string, outcome: string) {
  await db.update(paymentEvents).set({ outcome }).where(eq(paymentEvents.eventId, eventId));
}
