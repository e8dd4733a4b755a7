import { and, asc, count, desc, eq, gte, inArray, isNull, like, lt, notInArray, sql, type SQL } from 'drizzle-orm';
import type { RunListQuery, RunStatus } from '../../../shared/contracts/runs.ts';
import type { Db } from '../../db/client.ts';
import type { DbOrTx } from '../departments/departments.repository.ts';
import { users } from '../users/users.table.ts';
import type { ChunkTally } from '../../../shared/engine/kernel/tally.ts';
import { engulfmentGrids, runBins, runCheckpointPoints, runCheckpoints, runResults, runs, type RunRow } from './runs.table.ts';

export type { RunRow };

export async function insertRun(tx: DbOrTx, values: typeof runs.$inferInsert) {
  await tx.insert(runs).values(values);
}

export async function findRun(db: DbOrTx, departmentId: string, id: string) {
  const rows = await db
    .select({ run: runs, ownerName: users.name })
    .from(runs)
    .innerJoin(users, eq(users.id, runs.ownerUserId))
    .where(and(eq(runs.departmentId, departmentId), eq(runs.id, id)))
    .limit(1);
  return rows[0];
}

export async function findRunsByIds(db: Db, departmentId: string, ids: string[]) {
  if (ids.length === 0) return [];
  return db
    .select({ run: runs, ownerName: users.name })
    .from(runs)
    .innerJoin(users, eq(users.id, runs.ownerUserId))
    .where(and(eq(runs.departmentId, departmentId), inArray(runs.id, ids)));
}

const SORT_COLUMNS = {
  createdAt: runs.createdAt,
  systems: runs.systems,
  fraction: runs.fraction,
  status: runs.status,
  scenarioName: runs.scenarioName,
  finishedAt: runs.finishedAt,
} as const;

export async function listRuns(db: Db, departmentId: string, userId: string, q: RunListQuery) {
  const filters: SQL[] = [eq(runs.departmentId, departmentId)];
  if (q.status) filters.push(eq(runs.status, q.status));
  if (q.scenarioId) filters.push(eq(runs.scenarioId, q.scenarioId));
  if (q.owner === 'me') filters.push(eq(runs.ownerUserId, userId));
  if (q.includeSweepPoints === 'false') filters.push(isNull(runs.sweepId));
  // A fit's computing run is read through its fit.
  filters.push(isNull(runs.fitId));
  if (q.q) filters.push(like(runs.scenarioName, `%${q.q.replace(/[%_\\]/g, (c) => `\\${c}`)}%`));
  const where = and(...filters);
  const column = SORT_COLUMNS[q.sort];
  const [rows, totals] = await Promise.all([
    db
      .select({ run: runs, ownerName: users.name })
      .from(runs)
      .innerJoin(users, eq(users.id, runs.ownerUserId))
      .where(where)
      .orderBy(q.order === 'asc' ? asc(column) : desc(column), desc(runs.id))
      .limit(q.pageSize)
      .offset((q.page - 1) * q.pageSize),
    db.select({ n: count() }).from(runs).where(where),
  ]);
  return { rows, total: Number(totals[0]?.n ?? 0) };
}

/** The sweep's points in order: for a point computed more than once (a resumed sweep), its newest run. */
export async function runsOfSweep(db: Db, sweepId: string) {
  const rows = await db.select().from(runs).where(eq(runs.sweepId, sweepId)).orderBy(asc(runs.sweepPointIndex), asc(runs.createdAt), asc(runs.id));
  const newest = new Map<number | null, RunRow>();
  for (const row of rows) newest.set(row.sweepPointIndex, row);
  return [...newest.values()];
}

/** Claims a queued run for execution with a lease; false if someone else got it first or it was cancelled. */
export async function claimQueuedRun(db: Db, id: string, now: Date, leaseUntil: Date): Promise<boolean> {
  const result = await db
    .update(runs)
    .set({ status: 'running', startedAt: sql`COALESCE(${runs.startedAt}, ${now})`, leaseUntil })
    .where(and(eq(runs.id, id), eq(runs.status, 'queued')));
  return result[0].affectedRows === 1;
}

/** Extends the leases of the runs this scheduler is executing. */
export async function renewLeases(db: Db, ids: string[], leaseUntil: Date): Promise<void> {
  if (ids.length === 0) return;
  await db.update(runs).set({ leaseUntil }).where(and(inArray(runs.id, ids), eq(runs.status, 'running')));
}

/** Gives up the leases of runs this scheduler stopped (their checkpoints stay): another start resumes them at once. */
export async function releaseLeases(db: Db, ids: string[]): Promise<void> {
  if (ids.length === 0) return;
  await db.update(runs).set({ leaseUntil: null }).where(and(inArray(runs.id, ids), eq(runs.status, 'running')));
}

/**
 * The watchdog's query: runs left 'running' with no live executor (a stopped or crashed server,
 * a lapsed lease) go back to the queue and resume from their checkpoint. `ownIds` are the runs
 * the calling scheduler is executing itself, never touched here.
 */
export async function requeueOrphans(db: Db, now: Date, ownIds: string[]): Promise<number> {
  // Points of a multi-point job follow the run that computes them; only that run holds a lease.
  const filters: SQL[] = [eq(runs.status, 'running'), isNull(runs.jobRunId), sql`(${runs.leaseUntil} IS NULL OR ${runs.leaseUntil} < ${now})`];
  if (ownIds.length > 0) filters.push(notInArray(runs.id, ownIds));
  const result = await db
    .update(runs)
    .set({ status: 'queued', resumes: sql`${runs.resumes} + 1`, leaseUntil: null })
    .where(and(...filters));
  return result[0].affectedRows;
}

export async function queuedRuns(db: Db, limit: number) {
  return db
    .select({ id: runs.id, departmentId: runs.departmentId, createdAt: runs.createdAt, resumes: runs.resumes })
    .from(runs)
    .where(and(eq(runs.status, 'queued'), isNull(runs.jobRunId)))
    // Interrupted runs first (they hold work already done), then oldest first.
    .orderBy(desc(runs.resumes), asc(runs.createdAt))
    .limit(limit);
}

export async function loadRun(db: DbOrTx, id: string) {
  const rows = await db.select().from(runs).where(eq(runs.id, id)).limit(1);
  return rows[0];
}

export async function updateRun(db: DbOrTx, id: string, values: Partial<typeof runs.$inferInsert>, onlyIfStatus?: RunStatus[]) {
  const where = onlyIfStatus ? and(eq(runs.id, id), inArray(runs.status, onlyIfStatus)) : eq(runs.id, id);
  const result = await db.update(runs).set(values).where(where);
  return result[0].affectedRows === 1;
}

/** Updates several runs at once (the points of a multi-point job). */
export async function updateRuns(db: DbOrTx, ids: string[], values: Partial<typeof runs.$inferInsert>, onlyIfStatus?: RunStatus[]) {
  if (ids.length === 0) return;
  await db.update(runs).set(values).where(onlyIfStatus ? and(inArray(runs.id, ids), inArray(runs.status, onlyIfStatus)) : inArray(runs.id, ids));
}

export async function deleteRun(tx: DbOrTx, id: string) {
  await tx.delete(runs).where(eq(runs.id, id));
}

export async function loadCheckpoint(db: DbOrTx, runId: string) {
  const rows = await db.select().from(runCheckpoints).where(eq(runCheckpoints.runId, runId)).limit(1);
  return rows[0];
}

/** Writes the running totals and the chunks they cover in one statement (they never disagree). */
export async function saveCheckpoint(db: DbOrTx, runId: string, tally: string, doneChunks: [number, number][]) {
  const now = new Date();
  await db
    .insert(runCheckpoints)
    .values({ runId, tally, doneChunks, updatedAt: now })
    .onDuplicateKeyUpdate({ set: { tally, doneChunks, updatedAt: now } });
}

/**
 * Points per statement when a job's tallies are written or read: ≈ 10 kB of JSON each, so a
 * statement stays near 1 MB, far below MariaDB's default max_allowed_packet (16 MB), and only
 * one batch of serialised text is held at a time.
 */
const POINTS_PER_STATEMENT = 100;

/**
 * Writes a multi-point job's running totals (one row per point, in batches) and the chunks they
 * cover in one transaction, so they never disagree. The caller must not change `tallies` until
 * the promise settles (the scheduler waits for it before adding the next batch).
 */
export async function saveJobCheckpoint(db: Db, runId: string, tallies: readonly ChunkTally[], doneChunks: [number, number][]) {
  await db.transaction(async (tx) => {
    for (let first = 0; first < tallies.length; first += POINTS_PER_STATEMENT) {
      const rows = tallies.slice(first, first + POINTS_PER_STATEMENT).map((tally, i) => ({ runId, point: first + i, tally: JSON.stringify(tally) }));
      await tx.insert(runCheckpointPoints).values(rows).onDuplicateKeyUpdate({ set: { tally: sql`VALUES(${runCheckpointPoints.tally})` } });
    }
    await saveCheckpoint(tx, runId, '', doneChunks);
  });
}

/**
 * The running totals of a checkpoint: one tally per point for a multi-point job (`points`), read
 * in batches; a single run's one tally otherwise. Checkpoints written before the per-point rows
 * existed hold a job's tallies as one JSON array, read as such.
 */
export async function loadCheckpointTallies(db: Db, checkpoint: { runId: string; tally: string }, points: number | null): Promise<ChunkTally[]> {
  if (checkpoint.tally !== '') {
    const parsed = JSON.parse(checkpoint.tally) as ChunkTally | ChunkTally[];
    return Array.isArray(parsed) ? parsed : [parsed];
  }
  const out: ChunkTally[] = [];
  for (let first = 0; first < (points ?? 1); first += POINTS_PER_STATEMENT) {
    const rows = await db
      .select({ tally: runCheckpointPoints.tally })
      .from(runCheckpointPoints)
      .where(and(eq(runCheckpointPoints.runId, checkpoint.runId), gte(runCheckpointPoints.point, first), lt(runCheckpointPoints.point, first + POINTS_PER_STATEMENT)))
      .orderBy(asc(runCheckpointPoints.point));
    for (const row of rows) out.push(JSON.parse(row.tally) as ChunkTally);
  }
  if (out.length !== (points ?? 1)) throw new Error(`the checkpoint of run ${checkpoint.runId} holds ${out.length} of ${points ?? 1} point tallies`);
  return out;
}

/** Hands a checkpoint (and a job's per-point rows) over to another run, inside the database; false if there is none. */
export async function moveCheckpoint(tx: DbOrTx, fromRunId: string, toRunId: string): Promise<boolean> {
  const checkpoint = await loadCheckpoint(tx, fromRunId);
  if (!checkpoint) return false;
  await tx.insert(runCheckpointPoints).select(
    tx.select({ runId: sql`${toRunId}`.as('run_id'), point: runCheckpointPoints.point, tally: runCheckpointPoints.tally }).from(runCheckpointPoints).where(eq(runCheckpointPoints.runId, fromRunId)),
  );
  await saveCheckpoint(tx, toRunId, checkpoint.tally, checkpoint.doneChunks);
  await deleteCheckpoint(tx, fromRunId);
  return true;
}

export async function deleteCheckpoint(db: DbOrTx, runId: string) {
  await db.delete(runCheckpointPoints).where(eq(runCheckpointPoints.runId, runId));
  await db.delete(runCheckpoints).where(eq(runCheckpoints.runId, runId));
}

export async function saveResult(tx: DbOrTx, runId: string, result: string, bins: (typeof runBins.$inferInsert)[]) {
  await tx.insert(runResults).values({ runId, result, createdAt: new Date() });
  for (let i = 0; i < bins.length; i += 1000) await tx.insert(runBins).values(bins.slice(i, i + 1000));
}

export async function loadResult(db: Db, runId: string): Promise<string | undefined> {
  const rows = await db.select({ result: runResults.result }).from(runResults).where(eq(runResults.runId, runId)).limit(1);
  return rows[0]?.result;
}

export async function countActiveRuns(db: Db, departmentId: string): Promise<number> {
  const rows = await db.select({ n: count() }).from(runs).where(and(eq(runs.departmentId, departmentId), inArray(runs.status, ['queued', 'running'])));
  return Number(rows[0]?.n ?? 0);
}

export async function findGrid(db: Db, key: string) {
  const rows = await db.select().from(engulfmentGrids).where(eq(engulfmentGrids.key, key)).limit(1);
  return rows[0];
}

export async function saveGrid(db: Db, key: string, grid: string, buildMs: number) {
  await db.insert(engulfmentGrids).values({ key, grid, buildMs, createdAt: new Date() }).onDuplicateKeyUpdate({ set: { key } });
}
