/**
 * One table of a result, in a form both writers (ECSV, VOTable) take: typed columns with
 * astropy/VOUnit unit strings, rows of plain values, and the provenance every file carries.
 */

export type ColumnType = 'int64' | 'float64' | 'string';

export interface ExportColumn {
  name: string;
  datatype: ColumnType;
  /** A unit string astronomers' libraries parse (astropy's generic format, also valid VOUnit): solMass, MG, Gyr, d, AU. */
  unit?: string;
  description: string;
}

export type Cell = number | string | null;

export interface ExportTable {
  /** The registry name, e.g. "wd-mass" (also the VOTable TABLE name). */
  name: string;
  title: string;
  description: string;
  columns: ExportColumn[];
  rows: Cell[][];
  /** Table-specific scalars (e.g. the field threshold), written into the meta / as PARAMs. */
  params?: { name: string; value: number | string; datatype?: ColumnType; unit?: string; description: string }[];
}

/** Where a table comes from: the same block in every file, so a file alone reproduces the run. */
export interface ExportProvenance {
  /** "run" | "sweep" | "fit" and its id. */
  kind: string;
  id: string;
  engineVersion: string;
  scenarioHash: string;
  seed: string;
  systems: number;
  /** The scenario document exactly as it ran. */
  scenario: unknown;
  /** Full references of every method used. */
  references: string[];
  /** A link to the object, when one exists. */
  url?: string;
}

/** Bin edges written as log10 values become linear lower/upper bounds in the table's unit. */
export function fromLog10(edge: number): number {
  return 10 ** edge;
}
