import { execFileSync, spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { SYSTEM_PYTHON } from '../../scripts/astropy.ts';

export interface AstropyTable {
  rows: number;
  columns: Record<string, { unit: string | null; physical_type: string | null; dtype: string; values: (number | string | null)[] }>;
  meta: Record<string, unknown>;
}

const READER = path.resolve(import.meta.dirname, 'read-table.py');
export const VOTABLE_XSD = path.resolve(import.meta.dirname, '../../server/modules/exports/schemas/VOTable-v1.4.xsd');

function withFile<T>(name: string, body: string, read: (file: string) => T): T {
  const dir = mkdtempSync(path.join(os.tmpdir(), 'tidefield-export-'));
  try {
    const file = path.join(dir, name);
    writeFileSync(file, body);
    return read(file);
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

/** The table as astropy.table reads it (an independent parser: Debian's python3-astropy). */
export function readWithAstropy(body: string, kind: 'ecsv' | 'votable'): AstropyTable {
  return withFile(kind === 'ecsv' ? 'table.ecsv' : 'table.vot', body, (file) => JSON.parse(execFileSync(SYSTEM_PYTHON, [READER, file, kind], { encoding: 'utf8' })) as AstropyTable);
}

/** xmllint's verdict on the document against the IVOA VOTable 1.4 schema shipped in the repository. */
export function validateVotable(body: string): { ok: boolean; output: string } {
  return withFile('table.vot', body, (file) => {
    // xmllint reports "<file> validates" or the schema errors on stderr; the exit status decides.
    const res = spawnSync('/usr/bin/xmllint', ['--noout', '--schema', VOTABLE_XSD, file], { encoding: 'utf8' });
    return { ok: res.status === 0, output: res.stderr };
  });
}

/** astropy's VOTable column names are "<table>.<column>" when the FIELD has an ID; ours have none. */
export function column(table: AstropyTable, name: string) {
  const found = table.columns[name];
  if (!found) throw new Error(`astropy found no column ${name} (has ${Object.keys(table.columns).join(', ')})`);
  return found;
}
