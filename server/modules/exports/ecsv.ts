import { stringify } from 'yaml';
import type { Cell, ExportProvenance, ExportTable } from './export-table.ts';
import { provenanceMeta } from './provenance.ts';

/**
 * ECSV 1.0 (Enhanced Character Separated Values, the astropy APE 6 standard): a YAML header,
 * every line prefixed "# ", holding the delimiter, each column's name, datatype, unit and
 * description, and the table's meta; then the column-name line and the rows as CSV.
 * Empty fields are missing values. The YAML is written by the `yaml` library.
 */
export function toEcsv(table: ExportTable, provenance: ExportProvenance): string {
  const header = {
    delimiter: ',',
    datatype: table.columns.map((c) => ({ name: c.name, ...(c.unit ? { unit: c.unit } : {}), datatype: c.datatype, description: c.description })),
    meta: {
      table: table.name,
      title: table.title,
      description: table.description,
      ...(table.params?.length ? { params: Object.fromEntries(table.params.map((p) => [p.name, { value: p.value, ...(p.unit ? { unit: p.unit } : {}), description: p.description }])) } : {}),
      ...provenanceMeta(provenance),
    },
  };
  const yaml = stringify(header, { lineWidth: 0 }).trimEnd();
  const lines = ['# %ECSV 1.0', '# ---', ...yaml.split('\n').map((l) => `# ${l}`), table.columns.map((c) => csvCell(c.name)).join(',')];
  for (const row of table.rows) lines.push(row.map(csvCell).join(','));
  return lines.join('\n') + '\n';
}

/** One CSV field: numbers in shortest round-trip form, missing (null or not finite) as empty, strings quoted when needed. */
function csvCell(value: Cell): string {
  if (value === null) return '';
  if (typeof value === 'number') return Number.isFinite(value) ? String(value) : '';
  return value === '' || /[",\n\r]|^\s|\s$/.test(value) ? `"${value.replace(/"/g, '""')}"` : value;
}
