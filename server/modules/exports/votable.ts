import { create } from 'xmlbuilder2';
import type { XMLBuilder } from 'xmlbuilder2/lib/interfaces.js';
import type { ColumnType, ExportProvenance, ExportTable } from './export-table.ts';
import { provenanceMeta } from './provenance.ts';

/**
 * VOTable 1.4 (IVOA Recommendation, 2019): one RESOURCE with the provenance as INFO elements,
 * one TABLE with typed FIELDs (units as VOUnit strings) and the rows as TABLEDATA. VOTable 1.4
 * keeps the 1.3 namespace. The XML is written by xmlbuilder2.
 */
export const VOTABLE_NAMESPACE = 'http://www.ivoa.net/xml/VOTable/v1.3';

const VOTABLE_TYPE: Record<ColumnType, string> = { int64: 'long', float64: 'double', string: 'char' };
/** The null sentinel of a long column that has missing values (VOTable 1.4 §6.1: VALUES null). */
const LONG_NULL = '-9223372036854775808';

export function toVotable(table: ExportTable, provenance: ExportProvenance): string {
  const doc = create({ version: '1.0', encoding: 'UTF-8' });
  const root = doc.ele(VOTABLE_NAMESPACE, 'VOTABLE', { version: '1.4' });
  root.ele(VOTABLE_NAMESPACE, 'DESCRIPTION').txt(`Tidefield ${provenance.kind} ${provenance.id}: ${table.title}`);
  const resource = root.ele(VOTABLE_NAMESPACE, 'RESOURCE', { type: 'results', name: `tidefield-${provenance.kind}-${provenance.id}` });
  const el = (parent: XMLBuilder, name: string, attributes: Record<string, string> = {}) => parent.ele(VOTABLE_NAMESPACE, name, attributes);

  for (const [name, value] of Object.entries(provenanceMeta(provenance))) {
    if (name === 'references') continue;
    el(resource, 'INFO', { name, value: typeof value === 'string' ? value : JSON.stringify(value) });
  }
  for (const reference of provenance.references) el(resource, 'INFO', { name: 'reference', value: reference });

  const tableEl = el(resource, 'TABLE', { name: table.name, nrows: String(table.rows.length) });
  el(tableEl, 'DESCRIPTION').txt(`${table.title}. ${table.description}`);
  for (const p of table.params ?? []) {
    const numeric = typeof p.value === 'number';
    const param = el(tableEl, 'PARAM', {
      name: p.name,
      datatype: VOTABLE_TYPE[p.datatype ?? (numeric ? 'float64' : 'string')],
      ...(numeric ? {} : { arraysize: '*' }),
      ...(p.unit ? { unit: p.unit } : {}),
      value: String(p.value),
    });
    el(param, 'DESCRIPTION').txt(p.description);
  }
  const nullable = table.columns.map((_, i) => table.rows.some((r) => r[i] === null));
  table.columns.forEach((c, i) => {
    const field = el(tableEl, 'FIELD', {
      name: c.name,
      datatype: VOTABLE_TYPE[c.datatype],
      ...(c.datatype === 'string' ? { arraysize: '*' } : {}),
      ...(c.unit ? { unit: c.unit } : {}),
    });
    el(field, 'DESCRIPTION').txt(c.description);
    if (c.datatype === 'int64' && nullable[i]) el(field, 'VALUES', { null: LONG_NULL });
  });
  const data = el(el(tableEl, 'DATA'), 'TABLEDATA');
  for (const row of table.rows) {
    const tr = el(data, 'TR');
    row.forEach((cell, i) => {
      const td = el(tr, 'TD');
      if (cell === null || (typeof cell === 'number' && !Number.isFinite(cell))) {
        // Missing: the null sentinel for long, empty (NaN) for double and char.
        if (table.columns[i].datatype === 'int64') td.txt(LONG_NULL);
      } else {
        td.txt(String(cell));
      }
    });
  }
  return doc.end({ prettyPrint: true }) + '\n';
}
