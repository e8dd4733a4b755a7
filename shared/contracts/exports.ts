import { z } from 'zod';

/** The standard table formats a result exports to. */
export const TABLE_FORMATS = ['ecsv', 'votable'] as const;

export const exportQuerySchema = z.strictObject({
  /** Without format: the list of tables. */
  format: z.enum(TABLE_FORMATS, { error: `format must be one of ${TABLE_FORMATS.join(', ')}` }).optional(),
  table: z.string().min(1).max(60).optional(),
});
export type ExportQuery = z.infer<typeof exportQuerySchema>;

export const tableListingSchema = z.object({
  name: z.string(),
  title: z.string(),
  description: z.string(),
  rows: z.number(),
  columns: z.array(z.object({ name: z.string(), unit: z.string().nullable(), description: z.string() })),
});
export type TableListingEntry = z.infer<typeof tableListingSchema>;

export const exportListingSchema = z.object({
  formats: z.array(z.object({ format: z.enum(TABLE_FORMATS), name: z.string(), description: z.string() })),
  tables: z.array(tableListingSchema),
});
export type ExportListing = z.infer<typeof exportListingSchema>;

export const EXPORT_FORMATS: ExportListing['formats'] = [
  { format: 'ecsv', name: 'ECSV 1.0', description: 'Enhanced Character Separated Values: a YAML header with column units, types and provenance, then CSV; read by astropy.table.' },
  { format: 'votable', name: 'VOTable 1.4', description: 'The IVOA XML table standard with units and provenance; read by astropy, TOPCAT and Virtual Observatory tools.' },
];
