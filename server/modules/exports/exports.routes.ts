import { Router, type Response } from 'express';
import { idParamsSchema } from '../../../shared/contracts/common.ts';
import { exportListingSchema, exportQuerySchema } from '../../../shared/contracts/exports.ts';
import { defineRoute, type RouteRegistry } from '../../lib/http.ts';
import { departmentOf } from '../../lib/request-auth.ts';
import { sendDownload } from '../../lib/csv.ts';
import type { ExportAnswer, ExportsService } from './exports.service.ts';

/** The listing as JSON, or the table as a file download. */
export function sendExport(res: Response, answer: ExportAnswer) {
  if ('listing' in answer) return answer.listing;
  sendDownload(res, answer.file.filename, answer.file.body, answer.file.contentType);
  return undefined;
}

const TABLE_FORMATS_NOTE = 'Without format: the list of tables. With format=ecsv|votable and table=<name>: that table as ECSV 1.0 or VOTable 1.4, with units and provenance (engine version, scenario hash, seed, systems, the scenario document, references).';

export function exportsRoutes(registry: RouteRegistry, exports: ExportsService): Router {
  const router = Router();
  const mount = '/api';

  defineRoute(router, registry, mount, {
    method: 'get', path: '/runs/:id/export', tag: 'Runs', access: 'observer', params: idParamsSchema, query: exportQuerySchema, response: exportListingSchema,
    produces: 'text/x-ecsv', summary: `A run's tables in astronomers' formats. ${TABLE_FORMATS_NOTE}`,
  }, async ({ auth, params, query, res }) => sendExport(res, await exports.runExport(departmentOf(auth).id, params.id, query)));

  defineRoute(router, registry, mount, {
    method: 'get', path: '/runs/:id/references.bib', tag: 'Runs', access: 'observer', params: idParamsSchema, produces: 'application/x-bibtex',
    summary: 'BibTeX entries (with DOIs where known) of every published method and constraint the run used',
  }, async ({ auth, params, res }) => {
    const file = await exports.runReferences(departmentOf(auth).id, params.id);
    sendDownload(res, file.filename, file.body, file.contentType);
  });

  defineRoute(router, registry, mount, {
    method: 'get', path: '/sweeps/:id/export', tag: 'Sweeps', access: 'observer', params: idParamsSchema, query: exportQuerySchema, response: exportListingSchema,
    produces: 'text/x-ecsv', summary: `A sweep's curve in astronomers' formats. ${TABLE_FORMATS_NOTE}`,
  }, async ({ auth, params, query, res }) => sendExport(res, await exports.sweepExport(departmentOf(auth).id, params.id, query)));

  return router;
}
