import type { CreateSampleBody, Sample, SampleBin } from '../../../shared/contracts/samples.ts';
import { clopperPearson } from '../../../shared/engine/stats/clopper-pearson.ts';
import type { Db } from '../../db/client.ts';
import { newId } from '../../db/columns.ts';
import { roleAtLeast } from '../../../shared/contracts/roles.ts';
import { AppError, forbidden, notFound } from '../../lib/errors.ts';
import { recordAudit } from '../audit/audit.service.ts';
import { departmentOf, type RequestAuth } from '../../lib/request-auth.ts';
import { PUBLISHED_CONSTRAINTS } from './library.ts';
import {
  binsOf,
  deleteSample,
  findLibraryEntry,
  findVisibleSample,
  insertSample,
  listVisibleSamples,
  replaceBins,
  updateSample,
  type SampleBinRow,
  type SampleRow,
} from './samples.repository.ts';

export const sampleNotFound = () => notFound('That sample');
const libraryReadOnly = () =>
  new AppError({ code: 'read_only', status: 403, message: 'Published constraints in the library are read-only; create your own sample to change the numbers.' });

function toBin(row: SampleBinRow): SampleBin {
  return row.kind === 'setting'
    ? { kind: 'setting', setting: row.setting ?? 'single', magnetic: row.magnetic, total: row.total }
    : { kind: 'massBin', massMinMsun: row.massMinMsun ?? 0, massMaxMsun: row.massMaxMsun ?? 0, magnetic: row.magnetic, total: row.total };
}

function toSample(row: SampleRow, bins: SampleBinRow[]): Sample {
  const counts = row.kind === 'counts' && row.magnetic !== null && row.total !== null;
  const interval = (confidence: number): [number, number] | null => {
    if (!counts) return null;
    const ci = clopperPearson(row.magnetic!, row.total!, confidence);
    return [ci.lower, ci.upper];
  };
  return {
    id: row.id,
    name: row.name,
    library: row.departmentId === null,
    kind: row.kind,
    magnetic: row.magnetic,
    total: row.total,
    fraction: row.kind === 'counts' && row.total ? row.magnetic! / row.total : row.fraction,
    fractionSigma: row.fractionSigma,
    lowerBound: row.lowerBound,
    meanMass:
      row.kind === 'meanMass'
        ? { magneticMsun: row.meanMassMagneticMsun ?? 0, magneticSigma: row.meanMassMagneticSigma ?? 0, nonMagneticMsun: row.meanMassNonMagneticMsun ?? 0, nonMagneticSigma: row.meanMassNonMagneticSigma ?? 0 }
        : null,
    fieldThresholdMG: row.fieldThresholdMG,
    setting: row.setting,
    provenance: row.provenance,
    citation: row.citation,
    bins: bins.filter((b) => b.sampleId === row.id).map(toBin),
    interval68: interval(0.6827),
    interval95: interval(0.95),
    updatedAt: row.updatedAt.toISOString(),
  };
}

const binRows = (bins: SampleBin[] = []) =>
  bins.map((b) =>
    b.kind === 'setting'
      ? { kind: 'setting' as const, setting: b.setting, magnetic: b.magnetic, total: b.total, massMinMsun: null, massMaxMsun: null }
      : { kind: 'massBin' as const, setting: null, massMinMsun: b.massMinMsun, massMaxMsun: b.massMaxMsun, magnetic: b.magnetic, total: b.total },
  );

export function createSamplesService(db: Db) {
  async function get(departmentId: string, id: string): Promise<Sample> {
    const row = await findVisibleSample(db, departmentId, id);
    if (!row) throw sampleNotFound();
    return toSample(row, await binsOf(db, [row.id]));
  }

  /** The same rule as runs and scenarios: the owner, or a modeller or admin, changes or deletes a sample. */
  async function editable(auth: RequestAuth, id: string) {
    const row = await findVisibleSample(db, departmentOf(auth).id, id);
    if (!row) throw sampleNotFound();
    if (row.departmentId === null) throw libraryReadOnly();
    if (row.ownerUserId !== auth.user.id && !roleAtLeast(auth.role!, 'modeller')) {
      throw forbidden("Only the sample's owner or a modeller or admin can change or delete it.");
    }
    return row;
  }

  return {
    get: (auth: RequestAuth, id: string) => get(departmentOf(auth).id, id),
    /** For comparisons: a sample the department may see (its own or the library's). */
    visible: (departmentId: string, id: string) => get(departmentId, id),

    async list(auth: RequestAuth): Promise<Sample[]> {
      const rows = await listVisibleSamples(db, departmentOf(auth).id);
      const bins = await binsOf(db, rows.map((r) => r.id));
      return rows.map((r) => toSample(r, bins));
    },

    async create(auth: RequestAuth, body: CreateSampleBody): Promise<{ id: string }> {
      const department = departmentOf(auth);
      const id = newId();
      const now = new Date();
      await db.transaction(async (tx) => {
        await insertSample(tx, {
          id, departmentId: department.id, ownerUserId: auth.user.id, name: body.name, kind: 'counts',
          magnetic: body.magnetic, total: body.total, setting: body.setting, fieldThresholdMG: body.fieldThresholdMG ?? null,
          provenance: body.provenance ?? null, createdAt: now, updatedAt: now,
        });
        await replaceBins(tx, id, binRows(body.bins));
        await recordAudit(tx, { departmentId: department.id, actorUserId: auth.user.id, action: 'sample.created', target: id });
      });
      return { id };
    },

    async update(auth: RequestAuth, id: string, body: CreateSampleBody): Promise<Sample> {
      const department = departmentOf(auth);
      await editable(auth, id);
      await db.transaction(async (tx) => {
        await updateSample(tx, id, {
          name: body.name, magnetic: body.magnetic, total: body.total, setting: body.setting,
          fieldThresholdMG: body.fieldThresholdMG ?? null, provenance: body.provenance ?? null, updatedAt: new Date(),
        });
        await replaceBins(tx, id, binRows(body.bins));
        await recordAudit(tx, { departmentId: department.id, actorUserId: auth.user.id, action: 'sample.updated', target: id });
      });
      return get(department.id, id);
    },

    async remove(auth: RequestAuth, id: string): Promise<void> {
      const department = departmentOf(auth);
      await editable(auth, id);
      await db.transaction(async (tx) => {
        await deleteSample(tx, id);
        await recordAudit(tx, { departmentId: department.id, actorUserId: auth.user.id, action: 'sample.deleted', target: id });
      });
    },
  };
}

/** Writes the library of published constraints (idempotent: entries are matched by key and kept up to date). */
export async function ensurePublishedLibrary(db: Db): Promise<void> {
  const now = new Date();
  for (const entry of PUBLISHED_CONSTRAINTS) {
    const existing = await findLibraryEntry(db, entry.libraryKey);
    if (existing) await updateSample(db, existing.id, { ...entry, updatedAt: existing.updatedAt });
    else await insertSample(db, { ...entry, id: newId(), departmentId: null, ownerUserId: null, createdAt: now, updatedAt: now });
  }
}

export type SamplesService = ReturnType<typeof createSamplesService>;
