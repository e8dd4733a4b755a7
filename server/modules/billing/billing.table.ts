import { bigint, char, index, int, mysqlEnum, mysqlTable, varchar } from 'drizzle-orm/mysql-core';
import { CHECKOUT_STATUSES, LEDGER_KINDS } from '../../../shared/contracts/billing.ts';
import { idColumn, timestamp } from '../../db/columns.ts';
import { departments } from '../departments/departments.table.ts';

/**
 * One row per department: the row every credit change locks (SELECT … FOR UPDATE), so that
 * changes of one department's credit happen one after another. It carries the running totals
 * of the ledger (balance, and the free systems of the current month), written in the same
 * transaction as each ledger entry; the ledger stays the record they are derived from.
 */
export const billingAccounts = mysqlTable('billing_accounts', {
  departmentId: idColumn('department_id')
    .primaryKey()
    .references(() => departments.id, { onDelete: 'cascade' }),
  balanceCredits: int('balance_credits').notNull().default(0),
  /** The month of the current free allowance ("2026-03"); null before the first one. */
  allowancePeriod: char('allowance_period', { length: 7 }),
  freeSystemsLeft: bigint('free_systems_left', { mode: 'number' }).notNull().default(0),
  /** The payment service's customer for this department, created at the first checkout. */
  paymentCustomerId: varchar('payment_customer_id', { length: 255 }),
  createdAt: timestamp('created_at').notNull(),
  updatedAt: timestamp('updated_at').notNull(),
});

/**
 * Append-only credit ledger: never updated or deleted. `idempotencyKey` is unique, so the same
 * purchase, reservation, settlement or allowance can never be written twice.
 */
export const creditLedger = mysqlTable(
  'credit_ledger',
  {
    id: int('id').autoincrement().primaryKey(),
    departmentId: idColumn('department_id').notNull(),
    kind: mysqlEnum('kind', LEDGER_KINDS).notNull(),
    /** Signed change of the credit balance. */
    credits: int('credits').notNull(),
    /** Signed change of the free systems of `period`. */
    freeSystems: bigint('free_systems', { mode: 'number' }).notNull().default(0),
    /** The allowance month the entry belongs to. */
    period: char('period', { length: 7 }).notNull(),
    balanceAfter: int('balance_after').notNull(),
    /** No foreign keys: entries outlive deleted runs and checkouts. */
    runId: idColumn('run_id'),
    checkoutId: idColumn('checkout_id'),
    actorUserId: idColumn('actor_user_id'),
    /** The reason of an adjustment, or a short note. */
    reason: varchar('reason', { length: 500 }),
    idempotencyKey: varchar('idempotency_key', { length: 120 }).notNull().unique(),
    createdAt: timestamp('created_at').notNull(),
  },
  (t) => [index('credit_ledger_department_idx').on(t.departmentId, t.id), index('credit_ledger_run_idx').on(t.runId)],
);

/** A credit purchase through a payment-service checkout session. */
export const creditCheckouts = mysqlTable(
  'credit_checkouts',
  {
    id: idColumn().primaryKey(),
    departmentId: idColumn('department_id').notNull(),
    packId: varchar('pack_id', { length: 40 }).notNull(),
    credits: int('credits').notNull(),
    unitAmount: int('unit_amount').notNull(),
    currency: char('currency', { length: 3 }).notNull(),
    sessionId: varchar('session_id', { length: 255 }).unique(),
    status: mysqlEnum('status', CHECKOUT_STATUSES).notNull(),
    failureMessage: varchar('failure_message', { length: 500 }),
    receiptNumber: varchar('receipt_number', { length: 32 }).unique(),
    createdByUserId: idColumn('created_by_user_id').notNull(),
    createdAt: timestamp('created_at').notNull(),
    paidAt: timestamp('paid_at'),
  },
  (t) => [index('credit_checkouts_department_idx').on(t.departmentId, t.createdAt)],
);

/** Every webhook event handled, by the payment service's event id: a replay finds its row and changes nothing. */
export const paymentEvents = mysqlTable('payment_events', {
  eventId: varchar('event_id', { length: 255 }).primaryKey(),
  type: varchar('type', { length: 100 }).notNull(),
  checkoutId: idColumn('checkout_id'),
  outcome: varchar('outcome', { length: 40 }).notNull(),
  receivedAt: timestamp('received_at').notNull(),
});

export type BillingAccountRow = typeof billingAccounts.$inferSelect;
export type LedgerRow = typeof creditLedger.$inferSelect;
export type CheckoutRow = typeof creditCheckouts.$inferSelect;
