import { z } from 'zod';
import { nameSchema } from './common.ts';
import { companionRowSchema } from './occurrence-table.ts';

/** A stored table may hold up to this many rows; a scenario can use at most SCENARIO_MAX_ROWS of them. */
export const STORED_TABLE_MAX_ROWS = 10_000;
export const CSV_MAX_BYTES = 1024 * 1024;

/**
 * The CSV columns of an occurrence table, in order. One row per line; the mass range is
 * massMin–massMax in massUnit (MJup, Msun, or q = M2/M1); the shape's parameters apply to
 * its kind (powerlaw: massSlope, periodSlope; lognormalPeriod: meanLog10PeriodDays,
 * sigmaLog10Period) and are left empty otherwise.
 */
export const OCCURRENCE_CSV_COLUMNS = [
  'class',
  'massUnit',
  'massMin',
  'massMax',
  'periodMinDays',
  'periodMaxDays',
  'occurrence',
  'shape',
  'massSlope',
  'periodSlope',
  'meanLog10PeriodDays',
  'sigmaLog10Period',
  'label',
  'source',
  'assumed',
] as const;
export const OCCURRENCE_CSV_REQUIRED = ['class', 'massUnit', 'massMin', 'massMax', 'periodMinDays', 'periodMaxDays', 'occurrence'] as const;

export const tableRowsSchema = z.array(companionRowSchema).max(STORED_TABLE_MAX_ROWS, { error: `rows must hold at most ${STORED_TABLE_MAX_ROWS} rows` });

export const createTableBodySchema = z.strictObject({
  name: nameSchema,
  description: z.string().max(4000).optional(),
  rows: tableRowsSchema,
});
export type CreateTableBody = z.infer<typeof createTableBodySchema>;

export const updateTableBodySchema = z.strictObject({
  name: nameSchema.optional(),
  description: z.string().max(4000).nullable().optional(),
  rows: tableRowsSchema.optional(),
});
export type UpdateTableBody = z.infer<typeof updateTableBodySchema>;

/** Text fields sent with a multipart CSV upload (the file goes in the part named `file`). */
export const uploadTableFieldsSchema = z.strictObject({
  name: nameSchema,
  description: z.string().max(4000).optional(),
});

export const tableSummarySchema = z.object({
  id: z.string(),
  name: z.string(),
  description: z.string().nullable(),
  rowCount: z.number(),
  ownerUserId: z.string(),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type TableSummary = z.infer<typeof tableSummarySchema>;
export const tableDetailSchema = tableSummarySchema.extend({ rows: z.array(companionRowSchema) });
export type TableDetail = z.infer<typeof tableDetailSchema>;
export const tableListResponseSchema = z.object({ tables: z.array(tableSummarySchema) });

export const csvProblemSchema = z.object({ line: z.number(), column: z.string().optional(), message: z.string() });
export type CsvProblem = z.infer<typeof csvProblemSchema>;
/** What a preview of an upload answers: the rows as understood and every problem found. */
export const tablePreviewResponseSchema = z.object({ rows: z.array(companionRowSchema), problems: z.array(csvProblemSchema), rowCount: z.number() });
