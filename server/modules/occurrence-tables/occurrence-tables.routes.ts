import { Router, type RequestHandler } from 'express';
import multer from 'multer';
import { idParamsSchema } from '../../../shared/contracts/common.ts';
import {
  CSV_MAX_BYTES,
  createTableBodySchema,
  tableDetailSchema,
  tableListResponseSchema,
  tablePreviewResponseSchema,
  updateTableBodySchema,
  uploadTableFieldsSchema,
} from '../../../shared/contracts/occurrence-tables-api.ts';
import { idResponseSchema } from '../../../shared/contracts/scenarios-api.ts';
import { sendDownload } from '../../lib/csv.ts';
import { defineRoute, type RouteRegistry } from '../../lib/http.ts';
import { fileMissing, uploadRefused } from './occurrence-tables.errors.ts';
import type { OccurrenceTablesService } from './occurrence-tables.service.ts';

/** One CSV file of at most 1 MB in the multipart field "file", kept in memory. */
function csvUpload(): RequestHandler {
  const limits = { fileSize: CSV_MAX_BYTES, files: 1, fields: 10 };
  const upload = multer({ storage: multer.memoryStorage(), limits }).single('file');
  return (req, res, next) =>
    upload(req, res, (error?: unknown) => {
      if (error) return next(uploadRefused(error, limits));
      if (!req.file) return next(fileMissing());
      next();
    });
}

export function occurrenceTablesRoutes(registry: RouteRegistry, tables: OccurrenceTablesService): Router {
  const router = Router();
  const mount = '/api/occurrence-tables';
  const tag = 'Occurrence tables';
  const fileText = (req: { file?: Express.Multer.File }) => req.file!.buffer.toString('utf8');

  defineRoute(router, registry, mount, {
    method: 'get', path: '/', tag, access: 'observer', summary: "List the department's occurrence tables", response: tableListResponseSchema,
  }, async ({ auth }) => ({ tables: await tables.list(auth) }));

  defineRoute(router, registry, mount, {
    method: 'post', path: '/', tag, access: 'observer', status: 201, summary: 'Create a table from JSON rows',
    body: createTableBodySchema, response: idResponseSchema,
  }, ({ auth, body }) => tables.create(auth, body));

  defineRoute(router, registry, mount, {
    method: 'post', path: '/preview', tag, access: 'observer', summary: 'Check a CSV (multipart field "file", at most 1 MB) without storing it',
    before: [csvUpload()], response: tablePreviewResponseSchema, produces: 'multipart/form-data',
  }, ({ req }) => tables.preview(fileText(req)));

  defineRoute(router, registry, mount, {
    method: 'post', path: '/upload', tag, access: 'observer', status: 201,
    summary: 'Store a CSV (multipart: file, name, description) as a new table; nothing is stored if any row has a problem',
    before: [csvUpload()], body: uploadTableFieldsSchema, response: idResponseSchema, produces: 'multipart/form-data',
  }, ({ auth, req, body }) => tables.upload(auth, body, fileText(req)));

  defineRoute(router, registry, mount, {
    method: 'get', path: '/:id', tag, access: 'observer', summary: 'A table with its rows', params: idParamsSchema, response: tableDetailSchema,
  }, ({ auth, params }) => tables.detail(auth, params.id));

  defineRoute(router, registry, mount, {
    method: 'patch', path: '/:id', tag, access: 'observer', summary: "Rename a table, or replace its rows (edit)",
    params: idParamsSchema, body: updateTableBodySchema, response: tableDetailSchema,
  }, ({ auth, params, body }) => tables.update(auth, params.id, body));

  defineRoute(router, registry, mount, {
    method: 'delete', path: '/:id', tag, access: 'observer', status: 204, summary: 'Delete a table', params: idParamsSchema,
  }, async ({ auth, params }) => {
    await tables.remove(auth, params.id);
  });

  defineRoute(router, registry, mount, {
    method: 'get', path: '/:id/csv', tag, access: 'observer', summary: 'Download a table as CSV', params: idParamsSchema, produces: 'text/csv',
  }, async ({ auth, params, res }) => {
    const { name, csv } = await tables.csv(auth, params.id);
    sendDownload(res, `${name.replace(/[^A-Za-z0-9._-]+/g, '_')}.csv`, csv);
  });

  return router;
}
