import type {
  CreateScenarioRequest,
  ScenarioDetail,
  ScenarioDocument,
  ScenarioSummary,
  UpdateScenarioRequest,
} from '../../../shared/contracts/scenarios-api.ts';
import { parseScenario, ScenarioValidationError, type Scenario } from '../../../shared/contracts/scenario.ts';
import { listPriceCredits } from '../../../shared/contracts/pricing.ts';
import type { Db } from '../../db/client.ts';
import { newId } from '../../db/columns.ts';
import { scenarioHash } from '../../../shared/engine/kernel/scenario-hash.ts';
import { recordAudit } from '../audit/audit.service.ts';
import { departmentOf, type RequestAuth } from '../../lib/request-auth.ts';
import { invalidDocument, scenarioNotFound, versionNotFound } from './scenarios.errors.ts';
import {
  findScenario,
  insertScenario,
  insertVersion,
  listScenarios,
  listVersions,
  lockScenario,
  updateScenarioRow,
  type ScenarioRow,
  type ScenarioVersionRow,
} from './scenarios.repository.ts';
import { requireUniqueName, uniqueName } from './scenario-names.ts';

/** Checks that a stored occurrence table a document names belongs to the department. */
export type TableExists = (departmentId: string, tableId: string) => Promise<boolean>;

/** Parses a stored document (perhaps written by an older version) once, when it is loaded. */
function storedScenario(document: unknown): Scenario {
  try {
    return parseScenario(document);
  } catch (error) {
    if (error instanceof ScenarioValidationError) throw invalidDocument(error.issues);
    throw error;
  }
}

function summary(row: { scenario: ScenarioRow; version: ScenarioVersionRow; ownerName: string }): ScenarioSummary {
  const title = (row.version.document as { title?: unknown }).title;
  return {
    id: row.scenario.id,
    name: row.scenario.name,
    currentVersion: row.scenario.currentVersion,
    ownerUserId: row.scenario.ownerUserId,
    ownerName: row.ownerName,
    documentHash: row.version.documentHash,
    ...(typeof title === 'string' ? { title } : {}),
    createdAt: row.scenario.createdAt.toISOString(),
    updatedAt: row.scenario.updatedAt.toISOString(),
  };
}

export function createScenariosService(db: Db, tableExists: TableExists) {
  /** The one check the edge cannot make: a stored occurrence table the document names belongs to the department. */
  async function checkedDocument(departmentId: string, { scenario: parsed }: ScenarioDocument) {
    const tableId = parsed.companions.tableId;
    if (tableId && !(await tableExists(departmentId, tableId))) {
      throw invalidDocument([{ field: 'companions.tableId', message: `companions.tableId names no occurrence table of this department (got "${tableId}")` }]);
    }
    return parsed;
  }

  async function load(departmentId: string, id: string, version?: number) {
    const row = await findScenario(db, departmentId, id, version);
    if (!row) throw version ? versionNotFound() : scenarioNotFound();
    return { row, resolved: storedScenario(row.version.document) };
  }

  async function detail(departmentId: string, id: string, version?: number): Promise<ScenarioDetail> {
    return toDetail(await load(departmentId, id, version));
  }

  function toDetail({ row, resolved }: Awaited<ReturnType<typeof load>>): ScenarioDetail {
    return {
      ...summary(row),
      document: row.version.document,
      resolved: resolved as unknown as Record<string, unknown>,
      // List price: the credits when no free allowance is left (GET /api/billing/quote gives the department's own figure).
      costCredits: listPriceCredits(resolved.systems),
    };
  }

  async function create(auth: RequestAuth, body: CreateScenarioRequest): Promise<{ id: string }> {
    const department = departmentOf(auth);
    const parsed = await checkedDocument(department.id, body.document);
    await requireUniqueName(db, department.id, body.name);
    const id = newId();
    const now = new Date();
    await db.transaction(async (tx) => {
      await insertScenario(
        tx,
        { id, departmentId: department.id, ownerUserId: auth.user.id, name: body.name, currentVersion: 1, createdAt: now, updatedAt: now },
        { scenarioId: id, version: 1, document: body.document.written, documentHash: scenarioHash(parsed), note: body.note ?? null, createdByUserId: auth.user.id, createdAt: now },
      );
      await recordAudit(tx, { departmentId: department.id, actorUserId: auth.user.id, action: 'scenario.created', target: id });
    });
    return { id };
  }

  return {
    create,
    detail: (auth: RequestAuth, id: string, version?: number) => detail(departmentOf(auth).id, id, version),
    /** For the run service: the department's scenario at a version, parsed. */
    async resolve(departmentId: string, id: string, version?: number) {
      const { row, resolved } = await load(departmentId, id, version);
      return { scenario: resolved, name: row.scenario.name, version: row.version.version };
    },

    async list(auth: RequestAuth): Promise<ScenarioSummary[]> {
      return (await listScenarios(db, departmentOf(auth).id)).map(summary);
    },

    async versions(auth: RequestAuth, id: string) {
      const department = departmentOf(auth);
      if (!(await findScenario(db, department.id, id))) throw scenarioNotFound();
      return (await listVersions(db, id)).map((v) => ({
        version: v.version,
        documentHash: v.documentHash,
        note: v.note,
        createdByUserId: v.createdByUserId,
        createdAt: v.createdAt.toISOString(),
        document: v.document,
      }));
    },

    /** Renames and/or saves a new version; an unchanged document makes no new version. */
    async update(auth: RequestAuth, id: string, body: UpdateScenarioRequest): Promise<ScenarioDetail> {
      const department = departmentOf(auth);
      const parsed = body.document ? await checkedDocument(department.id, body.document) : undefined;
      if (body.name) await requireUniqueName(db, department.id, body.name, id);
      await db.transaction(async (tx) => {
        const locked = await lockScenario(tx, department.id, id);
        if (!locked) throw scenarioNotFound();
        const now = new Date();
        const current = await findScenario(tx, department.id, id);
        let version = locked.currentVersion;
        if (body.document && parsed) {
          const hash = scenarioHash(parsed);
          const unchanged = current && hash === current.version.documentHash && JSON.stringify(current.version.document) === JSON.stringify(body.document.written);
          if (!unchanged) {
            version += 1;
            await insertVersion(tx, { scenarioId: id, version, document: body.document.written, documentHash: hash, note: body.note ?? null, createdByUserId: auth.user.id, createdAt: now });
          }
        }
        await updateScenarioRow(tx, id, { currentVersion: version, updatedAt: now, ...(body.name ? { name: body.name } : {}) });
        await recordAudit(tx, { departmentId: department.id, actorUserId: auth.user.id, action: 'scenario.updated', target: id, detail: { version } });
      });
      return detail(department.id, id);
    },

    async clone(auth: RequestAuth, id: string, name?: string): Promise<{ id: string }> {
      const departmentId = departmentOf(auth).id;
      const { row, resolved } = await load(departmentId, id);
      const sourceName = row.scenario.name;
      return create(auth, {
        name: name ?? (await uniqueName(db, departmentId, `Copy of ${sourceName}`.slice(0, 160))),
        document: { written: row.version.document, scenario: resolved },
        note: `Cloned from "${sourceName}" version ${row.scenario.currentVersion}`,
      });
    },

    async remove(auth: RequestAuth, id: string): Promise<void> {
      const department = departmentOf(auth);
      await db.transaction(async (tx) => {
        const locked = await lockScenario(tx, department.id, id);
        if (!locked) throw scenarioNotFound();
        await updateScenarioRow(tx, id, { deletedAt: new Date() });
        await recordAudit(tx, { departmentId: department.id, actorUserId: auth.user.id, action: 'scenario.deleted', target: id });
      });
    },
  };
}

export type ScenariosService = ReturnType<typeof createScenariosService>;
