import type { CompanionRow } from '../../../shared/contracts/occurrence-table.ts';
import type { CreateTableBody, TableDetail, TableSummary, UpdateTableBody } from '../../../shared/contracts/occurrence-tables-api.ts';
import type { Db } from '../../db/client.ts';
import { newId } from '../../db/columns.ts';
import { recordAudit } from '../audit/audit.service.ts';
import { roleAtLeast } from '../../../shared/contracts/roles.ts';
import { forbidden } from '../../lib/errors.ts';
import { departmentOf, type RequestAuth } from '../../lib/request-auth.ts';
import { formatOccurrenceCsv, parseOccurrenceCsv } from './occurrence-csv.ts';
import { CsvInvalidError, tableNotFound } from './occurrence-tables.errors.ts';
import { deleteTable, findTable, insertTable, listTables, replaceRows, tableRows, updateTable, type TableRow } from './occurrence-tables.repository.ts';

function summary(t: TableRow): TableSummary {
  return {
    id: t.id,
    name: t.name,
    description: t.description,
    rowCount: t.rowCount,
    ownerUserId: t.ownerUserId,
    createdAt: t.createdAt.toISOString(),
    updatedAt: t.updatedAt.toISOString(),
  };
}

/** Observers upload their own tables and change only those; modellers and admins change any of the department's. */
function requireEditable(auth: RequestAuth, table: TableRow) {
  if (table.ownerUserId !== auth.user.id && !roleAtLeast(auth.role!, 'modeller')) {
    throw forbidden('Observers can change or delete only the occurrence tables they uploaded themselves; ask a modeller to change this one.');
  }
}

export function createOccurrenceTablesService(db: Db) {
  async function create(auth: RequestAuth, body: CreateTableBody): Promise<{ id: string }> {
    const department = departmentOf(auth);
    const id = newId();
    const now = new Date();
    await db.transaction(async (tx) => {
      await insertTable(tx, { id, departmentId: department.id, ownerUserId: auth.user.id, name: body.name, description: body.description ?? null, rowCount: body.rows.length, createdAt: now, updatedAt: now });
      await replaceRows(tx, id, body.rows);
      await recordAudit(tx, { departmentId: department.id, actorUserId: auth.user.id, action: 'table.created', target: id, detail: { rows: body.rows.length } });
    });
    return { id };
  }

  async function detail(departmentId: string, id: string): Promise<TableDetail> {
    const table = await findTable(db, departmentId, id);
    if (!table) throw tableNotFound();
    return { ...summary(table), rows: await tableRows(db, id) };
  }

  return {
    create,
    async list(auth: RequestAuth) {
      return (await listTables(db, departmentOf(auth).id)).map(summary);
    },
    detail: (auth: RequestAuth, id: string) => detail(departmentOf(auth).id, id),

    /** Checks an uploaded CSV without storing anything. */
    preview(csv: string) {
      return parseOccurrenceCsv(csv);
    },

    /** Stores an uploaded CSV as a new table, or nothing at all if any row has a problem. */
    async upload(auth: RequestAuth, fields: { name: string; description?: string }, csv: string) {
      const parsed = parseOccurrenceCsv(csv);
      if (parsed.problems.length > 0) throw new CsvInvalidError(parsed.problems);
      return create(auth, { ...fields, rows: parsed.rows });
    },

    async update(auth: RequestAuth, id: string, body: UpdateTableBody): Promise<TableDetail> {
      const department = departmentOf(auth);
      await db.transaction(async (tx) => {
        const table = await findTable(tx, department.id, id);
        if (!table) throw tableNotFound();
        requireEditable(auth, table);
        await updateTable(tx, id, {
          updatedAt: new Date(),
          ...(body.name ? { name: body.name } : {}),
          ...(body.description !== undefined ? { description: body.description } : {}),
          ...(body.rows ? { rowCount: body.rows.length } : {}),
        });
        if (body.rows) await replaceRows(tx, id, body.rows);
        await recordAudit(tx, { departmentId: department.id, actorUserId: auth.user.id, action: 'table.updated', target: id });
      });
      return detail(department.id, id);
    },

    async remove(auth: RequestAuth, id: string) {
      const department = departmentOf(auth);
      await db.transaction(async (tx) => {
        const table = await findTable(tx, department.id, id);
        if (!table) throw tableNotFound();
        requireEditable(auth, table);
        await deleteTable(tx, id);
        await recordAudit(tx, { departmentId: department.id, actorUserId: auth.user.id, action: 'table.deleted', target: id });
      });
    },

    async csv(auth: RequestAuth, id: string): Promise<{ name: string; csv: string }> {
      const table = await detail(departmentOf(auth).id, id);
      return { name: table.name, csv: formatOccurrenceCsv(table.rows) };
    },

    /** For runs: the rows of a department's table (a scenario's companions.tableId). */
    async rowsFor(departmentId: string, id: string): Promise<CompanionRow[]> {
      const table = await findTable(db, departmentId, id);
      if (!table) throw tableNotFound();
      return tableRows(db, id);
    },

    async exists(departmentId: string, id: string) {
      return Boolean(await findTable(db, departmentId, id));
    },
  };
}

export type OccurrenceTablesService = ReturnType<typeof createOccurrenceTablesService>;
