import { createHash, randomBytes } from 'node:crypto';
import { and, desc, eq, isNull } from 'drizzle-orm';
import type { ShareKind, ShareLinkSummary, SharedObject } from '../../../shared/contracts/shares.ts';
import { publicBaseUrl, type Config } from '../../config.ts';
import type { Db } from '../../db/client.ts';
import { newId } from '../../db/columns.ts';
import { AppError, notFound } from '../../lib/errors.ts';
import { recordAudit } from '../audit/audit.service.ts';
import { departmentOf, type RequestAuth } from '../../lib/request-auth.ts';
import { users } from '../users/users.table.ts';
import type { ExportsService } from '../exports/exports.service.ts';
import { methodsParagraph } from '../runs/run-exports.ts';
import { findRun } from '../runs/runs.repository.ts';
import { runs as runsTable } from '../runs/runs.table.ts';
import type { RunsService } from '../runs/runs.service.ts';
import type { SweepsService } from '../sweeps/sweeps.service.ts';
import { sweeps as sweepsTable } from '../sweeps/sweeps.table.ts';
import { shareLinks } from './share-links.table.ts';

const SECRET_PREFIX = 'tfs_';
/** 24 random bytes: 192 bits, well above the 128 a guess must beat. */
const SECRET_BYTES = 24;
const SECRET_PATTERN = /^tfs_[A-Za-z0-9_-]{32}$/;
const hashSecret = (secret: string) => createHash('sha256').update(secret).digest('hex');
/** A link that is unknown, malformed or revoked: the same 404 for all three, so nothing leaks. */
export const sharedNotFound = () => notFound('That shared link');

type ShareRow = typeof shareLinks.$inferSelect;

export function createSharesService(deps: { db: Db; config: Config; runs: RunsService; sweeps: SweepsService; exports: ExportsService }) {
  const { db, config, runs, sweeps, exports } = deps;
  const base = publicBaseUrl(config);

  /** The link row of a secret, when it exists and is not revoked. */
  async function resolve(secret: string): Promise<ShareRow> {
    if (!SECRET_PATTERN.test(secret)) throw sharedNotFound();
    const rows = await db.select().from(shareLinks).where(and(eq(shareLinks.secretHash, hashSecret(secret)), isNull(shareLinks.revokedAt))).limit(1);
    const row = rows[0];
    if (!row) throw sharedNotFound();
    if (!row.lastOpenedAt || Date.now() - row.lastOpenedAt.getTime() > 60_000) {
      await db.update(shareLinks).set({ lastOpenedAt: new Date() }).where(eq(shareLinks.id, row.id));
    }
    return row;
  }

  async function create(auth: RequestAuth, kind: ShareKind, objectId: string, requestBase: string) {
    const department = departmentOf(auth);
    if (kind === 'run') {
      const found = await findRun(db, department.id, objectId);
      if (!found) throw notFound('That run');
      if (found.run.status !== 'succeeded') {
        throw new AppError({ code: 'run_not_finished', status: 409, message: `Only a finished run can be shared (this one is ${found.run.status}).` });
      }
    } else {
      await sweeps.detailIn(department.id, objectId);
    }
    const secret = SECRET_PREFIX + randomBytes(SECRET_BYTES).toString('base64url');
    const id = newId();
    await db.transaction(async (tx) => {
      await tx.insert(shareLinks).values({
        id, departmentId: department.id, createdByUserId: auth.user.id, kind, objectId,
        secretHash: hashSecret(secret), prefix: secret.slice(0, 10), createdAt: new Date(), lastOpenedAt: null, revokedAt: null,
      });
      await recordAudit(tx, { departmentId: department.id, actorUserId: auth.user.id, action: 'share.created', target: id, detail: { kind, objectId } });
    });
    // PUBLIC_URL when configured, else the address the creator reached this server at.
    return { id, url: `${config.PUBLIC_URL ? base : requestBase}/shared/${secret}` };
  }

  return {
    createForRun: (auth: RequestAuth, runId: string, requestBase: string) => create(auth, 'run', runId, requestBase),
    createForSweep: (auth: RequestAuth, sweepId: string, requestBase: string) => create(auth, 'sweep', sweepId, requestBase),

    /** Every link of the department, newest first (revoked ones included, marked). Never the secret. */
    async list(auth: RequestAuth): Promise<ShareLinkSummary[]> {
      const department = departmentOf(auth);
      const rows = await db
        .select({ link: shareLinks, createdByName: users.name, runName: runsTable.scenarioName, sweepName: sweepsTable.name })
        .from(shareLinks)
        .innerJoin(users, eq(users.id, shareLinks.createdByUserId))
        .leftJoin(runsTable, and(eq(shareLinks.kind, 'run'), eq(runsTable.id, shareLinks.objectId)))
        .leftJoin(sweepsTable, and(eq(shareLinks.kind, 'sweep'), eq(sweepsTable.id, shareLinks.objectId)))
        .where(eq(shareLinks.departmentId, department.id))
        .orderBy(desc(shareLinks.createdAt))
        .limit(500);
      return rows.map(({ link, createdByName, runName, sweepName }) => ({
        id: link.id,
        kind: link.kind as ShareKind,
        objectId: link.objectId,
        label: (link.kind === 'run' ? runName : sweepName) ?? '(deleted)',
        prefix: link.prefix,
        createdByName,
        createdAt: link.createdAt.toISOString(),
        lastOpenedAt: link.lastOpenedAt?.toISOString() ?? null,
        revokedAt: link.revokedAt?.toISOString() ?? null,
      }));
    },

    async revoke(auth: RequestAuth, id: string): Promise<void> {
      const department = departmentOf(auth);
      const rows = await db.select().from(shareLinks).where(and(eq(shareLinks.id, id), eq(shareLinks.departmentId, department.id))).limit(1);
      if (!rows[0]) throw notFound('That share link');
      if (rows[0].revokedAt) return; // revoking again changes nothing
      await db.transaction(async (tx) => {
        await tx.update(shareLinks).set({ revokedAt: new Date() }).where(eq(shareLinks.id, id));
        await recordAudit(tx, { departmentId: department.id, actorUserId: auth.user.id, action: 'share.revoked', target: id });
      });
    },

    /** The shared object, read-only, scoped to exactly the run or sweep the link names. */
    async open(secret: string): Promise<SharedObject> {
      const link = await resolve(secret);
      if (link.kind === 'run') {
        const { run, result } = await runs.finishedResult(link.departmentId, link.objectId).catch(() => {
          throw sharedNotFound();
        });
        return {
          kind: 'run',
          run: {
            id: run.id, scenarioName: run.scenarioName, scenarioHash: run.scenarioHash, systems: run.systems, seed: run.seed, engineVersion: run.engineVersion,
            createdAt: run.createdAt.toISOString(), finishedAt: run.finishedAt?.toISOString() ?? null,
          },
          result,
          methods: methodsParagraph(run.snapshot, result, run.id),
          exports: await this.exportOf(secret, {}, link).then((a) => ('listing' in a ? a.listing : { formats: [], tables: [] })),
        };
      }
      const detail = await sweeps.detailIn(link.departmentId, link.objectId).catch(() => {
        throw sharedNotFound();
      });
      const { scenarioId: _scenario, points, ...rest } = detail;
      return {
        kind: 'sweep',
        sweep: { ...rest, points: points.map(({ runId: _run, ...p }) => p) },
        exports: await this.exportOf(secret, {}, link).then((a) => ('listing' in a ? a.listing : { formats: [], tables: [] })),
      };
    },

    /** A shared object's tables (listing or one file), as its department's members get them. */
    async exportOf(secret: string, query: { format?: 'ecsv' | 'votable'; table?: string }, known?: ShareRow) {
      const link = known ?? (await resolve(secret));
      return link.kind === 'run' ? exports.runExport(link.departmentId, link.objectId, query) : exports.sweepExport(link.departmentId, link.objectId, query);
    },

    async referencesOf(secret: string) {
      const link = await resolve(secret);
      if (link.kind !== 'run') throw sharedNotFound();
      return exports.runReferences(link.departmentId, link.objectId);
    },
  };
}

export type SharesService = ReturnType<typeof createSharesService>;
