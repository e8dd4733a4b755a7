import { useEffect, useMemo, useRef, useState, type ReactNode } from 'react';
import type { TableDetail } from '../../../../shared/contracts/occurrence-tables-api.ts';
import { Alert } from '../../../components/ui/alert.tsx';
import { Badge } from '../../../components/ui/badge.tsx';
import { Button } from '../../../components/ui/button.tsx';
import { errorMessage } from '../../../components/ui/error-state.tsx';
import { useUnsavedChanges } from '../../../hooks/use-unsaved-changes.tsx';
import { isApiError } from '../../../lib/api-client.ts';
import { cx } from '../../../lib/class-names.ts';
import { useUpdateTable } from '../api/update-table.ts';
import { blankCells, cellKey, cellOfServerField, checkCells, serverCellMessage, type CellProblem } from './row-cells.ts';
import { cellsFromRow, type CellColumn, type RowCells } from '../../../../shared/contracts/occurrence-row-cells.ts';
import { COMPANION_CLASS_OPTIONS, MASS_UNITS, RowActions, SHAPE_SHORT_OPTIONS, shapeParameters, type ShapeParameter } from '../../../components/companion-rows.tsx';

const PAGE_SIZE = 25;

interface DraftRow {
  key: number;
  cells: RowCells;
}

const CLASS_OPTIONS = COMPANION_CLASS_OPTIONS.map(({ value, label }) => ({ value, label }));
const UNIT_OPTIONS = MASS_UNITS.map(({ value, label }) => ({ value, label }));
const CLASS_TEXT: Record<string, string> = Object.fromEntries(CLASS_OPTIONS.map((o) => [o.value, o.label]));
/** A shape parameter's label in the grid, with its formula when it has one: "Mass slope a (dN ∝ M^a dlnM)". */
const parameterLabel = (p: ShapeParameter) => (p.hint ? `${p.label} (${p.hint.replace(/\.$/, '')})` : p.label);

const cellId = (index: number, column: CellColumn) => `table-row-${index}-${column}`;
const toDrafts = (table: TableDetail): DraftRow[] => table.rows.map((row, key) => ({ key, cells: cellsFromRow(row) }));
const snapshot = (rows: readonly DraftRow[]) => JSON.stringify(rows.map((r) => r.cells));

export interface RowsEditorProps {
  departmentId: string;
  table: TableDetail;
  readOnly: boolean;
}

/**
 * The rows of a stored table in a grid, each with its provenance (source and what was
 * assumed) on the line below. Modellers edit the cells in place: each row is checked with the
 * shared row schema as it is typed, and the server's answer to a save ("rows.3.occurrence")
 * is shown in the cell it names.
 */
export function RowsEditor({ departmentId, table, readOnly }: RowsEditorProps) {
  const update = useUpdateTable(departmentId);
  const [rows, setRows] = useState<DraftRow[]>(() => toDrafts(table));
  const [baseline, setBaseline] = useState(() => snapshot(toDrafts(table)));
  const nextKey = useRef(table.rows.length);
  const [page, setPage] = useState(0);
  const [touched, setTouched] = useState<ReadonlySet<number>>(new Set());
  const [attempted, setAttempted] = useState(false);
  const [serverProblem, setServerProblem] = useState<{ index: number; column: CellColumn | null; message: string } | null>(null);
  const [formError, setFormError] = useState<string | null>(null);
  const [saved, setSaved] = useState(false);
  const [pendingFocus, setPendingFocus] = useState<string | null>(null);

  const dirty = snapshot(rows) !== baseline;
  const guard = useUnsavedChanges(dirty && !readOnly, 'The table');
  const checks = useMemo(() => rows.map((r) => checkCells(r.cells)), [rows]);
  const problems = useMemo(() => {
    const list: { index: number; problem: CellProblem }[] = [];
    checks.forEach((check, index) => {
      if (!check.ok && (attempted || touched.has(rows[index].key))) for (const problem of check.problems) list.push({ index, problem });
    });
    return list;
  }, [checks, attempted, touched, rows]);
  const cellErrors = useMemo(() => {
    const map = new Map<string, string>();
    for (const { index, problem } of problems) if (!map.has(cellKey(index, problem.column))) map.set(cellKey(index, problem.column), problem.message);
    if (serverProblem?.column) map.set(cellKey(serverProblem.index, serverProblem.column), serverProblem.message);
    return map;
  }, [problems, serverProblem]);

  useEffect(() => {
    if (!pendingFocus) return;
    setPendingFocus(null);
    const element = document.getElementById(pendingFocus);
    element?.scrollIntoView({ block: 'center' });
    element?.focus({ preventScroll: true });
  }, [pendingFocus]);

  const pages = Math.max(1, Math.ceil(rows.length / PAGE_SIZE));
  const shownPage = Math.min(page, pages - 1);
  const first = shownPage * PAGE_SIZE;
  const visible = rows.slice(first, first + PAGE_SIZE);

  function goTo(index: number, column: CellColumn) {
    setPage(Math.floor(index / PAGE_SIZE));
    setPendingFocus(cellId(index, column));
  }

  function change(index: number, column: CellColumn, value: string) {
    setRows((list) => list.map((r, i) => (i === index ? { ...r, cells: { ...r.cells, [column]: value } } : r)));
    setTouched((set) => new Set(set).add(rows[index].key));
    setServerProblem(null);
    setSaved(false);
  }

  function addRow() {
    const index = rows.length;
    setRows((list) => [...list, { key: nextKey.current++, cells: blankCells() }]);
    goTo(index, 'class');
  }

  function removeRow(index: number) {
    setRows((list) => list.filter((_, i) => i !== index));
    setServerProblem(null);
  }

  function duplicateRow(index: number) {
    setRows((list) => [...list.slice(0, index + 1), { key: nextKey.current++, cells: { ...list[index].cells } }, ...list.slice(index + 1)]);
  }

  function discard() {
    setRows(toDrafts(table));
    setBaseline(snapshot(toDrafts(table)));
    setTouched(new Set());
    setAttempted(false);
    setServerProblem(null);
    setFormError(null);
  }

  async function save() {
    setAttempted(true);
    setFormError(null);
    setSaved(false);
    const firstBad = checks.findIndex((c) => !c.ok);
    if (firstBad >= 0) {
      const check = checks[firstBad];
      if (!check.ok) goTo(firstBad, check.problems[0].column);
      setFormError('Some rows have problems; they are marked in the table. Nothing was saved.');
      return;
    }
    try {
      const valid = checks.flatMap((c) => (c.ok ? [c.row] : []));
      await update.mutateAsync({ id: table.id, body: { rows: valid } });
      setBaseline(snapshot(rows));
      setTouched(new Set());
      setAttempted(false);
      setSaved(true);
    } catch (error) {
      const cell = isApiError(error) ? cellOfServerField(error.field) : null;
      setFormError(`Not saved. ${errorMessage(error)}`);
      if (cell && isApiError(error) && error.field) {
        const column = cell.column ?? 'class';
        setServerProblem({ index: cell.index, column, message: serverCellMessage(error.field, error.message) });
        goTo(cell.index, column);
      }
    }
  }

  return (
    <div className="flex flex-col gap-4">
      {problems.length > 0 && (
        <section aria-labelledby="rows-problems-title" className="rounded-md border border-coral-300/50 bg-coral-300/8 p-4">
          <h3 id="rows-problems-title" className="font-bold text-foam-50">
            {problems.length} problem{problems.length === 1 ? '' : 's'} in the rows
          </h3>
          <ul className="mt-2 flex flex-col gap-1">
            {problems.slice(0, 10).map(({ index, problem }) => (
              <li key={`${index}:${problem.column}`}>
                <button type="button" onClick={() => goTo(index, problem.column)} className="text-left text-sm text-coral-300 underline underline-offset-3">
                  Row {index + 1}, {problem.column}: {problem.message}
                </button>
              </li>
            ))}
            {problems.length > 10 && <li className="text-sm text-foam-300">and {problems.length - 10} more.</li>}
          </ul>
        </section>
      )}

      <div role="region" aria-labelledby="rows-caption" tabIndex={0} className="relative overflow-x-auto rounded-md border border-ink-700">
        <table role="table" className="w-full border-collapse text-left max-md:block">
          <caption id="rows-caption" className="px-4 py-3 text-left font-bold text-foam-50 max-md:block">
            Rows {rows.length === 0 ? '' : `${first + 1}–${first + visible.length} `}of {rows.length}
            {readOnly ? '' : ' (edit in place, then save)'}
          </caption>
          <thead role="rowgroup" className="bg-ink-800 text-sm text-foam-300 max-md:sr-only">
            <tr role="row">
              {['Row', 'Class, occurrence (probability 0–1)', 'Mass', 'Initial period (days)', 'Shape inside the row'].map((h) => (
                <th key={h} role="columnheader" scope="col" className="px-3 py-2 align-bottom font-bold">
                  {h}
                </th>
              ))}
            </tr>
          </thead>
          <tbody role="rowgroup" className="max-md:block">
            {rows.length === 0 && (
              <tr role="row" className="max-md:block">
                <td role="cell" colSpan={5} className="p-4 text-foam-300 max-md:block">
                  The table has no rows yet.{readOnly ? '' : ' Add one below.'}
                </td>
              </tr>
            )}
            {visible.map((row, offset) => (
              <RowLines
                key={row.key}
                index={first + offset}
                cells={row.cells}
                errors={cellErrors}
                rowProblem={serverProblem && serverProblem.index === first + offset && !serverProblem.column ? serverProblem.message : undefined}
                readOnly={readOnly}
                onChange={change}
                onRemove={removeRow}
                onDuplicate={duplicateRow}
              />
            ))}
          </tbody>
        </table>
      </div>

      {pages > 1 && (
        <nav aria-label="Pages of rows" className="flex flex-wrap items-center gap-3">
          <Button variant="secondary" size="sm" disabled={shownPage === 0} onClick={() => setPage(shownPage - 1)}>
            Previous rows
          </Button>
          <span className="text-foam-300">
            Page {shownPage + 1} of {pages}
          </span>
          <Button variant="secondary" size="sm" disabled={shownPage >= pages - 1} onClick={() => setPage(shownPage + 1)}>
            Next rows
          </Button>
        </nav>
      )}

      {!readOnly && (
        <div className="sticky bottom-0 z-10 flex flex-col gap-3 rounded-lg border border-ink-600 bg-ink-900/95 p-4 backdrop-blur">
          <Alert message={formError ?? undefined} />
          <div className="flex flex-wrap items-center gap-3">
            <Button variant="secondary" onClick={addRow}>
              Add a row
            </Button>
            <Button pending={update.isPending} disabled={!dirty} onClick={() => void save()}>
              Save the rows
            </Button>
            {dirty && (
              <Button variant="ghost" onClick={discard}>
                Discard changes
              </Button>
            )}
            <span aria-live="polite" className="text-sm">
              {saved ? <span className="font-bold text-kelp-300">Saved.</span> : dirty ? <Badge tone="warning">Unsaved changes</Badge> : <span className="text-foam-300">No unsaved changes.</span>}
            </span>
          </div>
          <p className="text-sm text-foam-400">Saving replaces every row of the table. Runs already made keep the rows they used.</p>
        </div>
      )}
      {guard.dialog}
    </div>
  );
}

interface RowLinesProps {
  index: number;
  cells: RowCells;
  errors: ReadonlyMap<string, string>;
  rowProblem?: string;
  readOnly: boolean;
  onChange: (index: number, column: CellColumn, value: string) => void;
  onRemove: (index: number) => void;
  onDuplicate: (index: number) => void;
}

const tdClasses = 'px-3 py-2 align-top max-md:block max-md:px-4 max-md:py-1.5';

/** One table row: the numbers on the first line, its label, provenance and actions on the second. */
function RowLines({ index, cells, errors, rowProblem, readOnly, onChange, onRemove, onDuplicate }: RowLinesProps) {
  const n = index + 1;
  const control = (column: CellColumn, label: string, extra: Partial<Pick<CellControlProps, 'unit' | 'options' | 'width' | 'multiline' | 'prefix' | 'labelVisible'>> = {}) => (
    <CellControl
      id={cellId(index, column)}
      label={label}
      row={n}
      value={cells[column]}
      error={errors.get(cellKey(index, column))}
      readOnly={readOnly}
      onChange={(value) => onChange(index, column, value)}
      {...extra}
    />
  );
  const massUnit = UNIT_OPTIONS.some((u) => u.value === cells.massUnit) ? cells.massUnit : 'MJup';
  const hasProblem = Boolean(rowProblem) || [...errors.keys()].some((k) => k.startsWith(`${index}:`));
  const shapeText = `${SHAPE_SHORT_OPTIONS.find((o) => o.value === cells.shape)?.label ?? cells.shape}: ${shapeParameters(cells.shape)
    .map((p) => `${p.symbol} = ${cells[p.key] || 'default'}${p.unit ? ` ${p.unit}` : ''}`)
    .join(', ')}`;
  return (
    <>
      <tr role="row" className={cx('border-t border-ink-700 max-md:block max-md:pt-3', hasProblem && 'bg-coral-300/5')}>
        <th role="rowheader" scope="row" className={cx(tdClasses, 'font-bold tabular-nums')}>
          <span className="md:hidden">Row </span>
          {n}
          {rowProblem && <p className="mt-1 max-w-40 text-sm font-normal text-coral-300">{rowProblem}</p>}
        </th>
        <td role="cell" className={tdClasses}>
          {readOnly ? (
            <>
              <ReadValue label="Class" value={CLASS_TEXT[cells.class] ?? cells.class} />
              <ReadValue label="Occurrence" value={`p = ${cells.occurrence}`} />
            </>
          ) : (
            <div className="flex flex-col gap-2">
              {control('class', 'Class', { options: CLASS_OPTIONS, width: 'w-40' })}
              {control('occurrence', 'Occurrence', { width: 'w-24', prefix: 'p =' })}
            </div>
          )}
        </td>
        <td role="cell" className={tdClasses}>
          {readOnly ? (
            <ReadValue label="Mass" value={`${cells.massMin}–${cells.massMax} ${cells.massUnit}`} />
          ) : (
            <div className="flex flex-col gap-2">
              {control('massUnit', 'Mass unit', { options: UNIT_OPTIONS, width: 'w-44' })}
              <div className="flex items-start gap-1">
                {control('massMin', 'Mass from', { width: 'w-16' })}
                <span aria-hidden="true" className="pt-2 text-foam-400 max-md:pt-8">–</span>
                {control('massMax', 'Mass to', { unit: massUnit, width: 'w-16' })}
              </div>
            </div>
          )}
        </td>
        <td role="cell" className={tdClasses}>
          {readOnly ? (
            <ReadValue label="Initial period" value={`${cells.periodMinDays}–${cells.periodMaxDays} d`} />
          ) : (
            <div className="flex items-start gap-1">
              {control('periodMinDays', 'Period from', { width: 'w-16' })}
              <span aria-hidden="true" className="pt-2 text-foam-400 max-md:pt-8">–</span>
              {control('periodMaxDays', 'Period to', { unit: 'd', width: 'w-20' })}
            </div>
          )}
        </td>
        <td role="cell" className={tdClasses}>
          {readOnly ? (
            <ReadValue label="Shape" value={shapeText} />
          ) : (
            <div className="flex flex-col gap-2">
              {control('shape', 'Shape', { options: SHAPE_SHORT_OPTIONS, width: 'w-36' })}
              <div className="flex flex-wrap items-start gap-2">
                {shapeParameters(cells.shape).map((p) => (
                  <div key={p.key}>{control(p.key, parameterLabel(p), { unit: p.unit || undefined, width: 'w-20', prefix: `${p.symbol} =` })}</div>
                ))}
              </div>
            </div>
          )}
        </td>
      </tr>
      <tr role="row" className={cx('max-md:block max-md:pb-3', hasProblem && 'bg-coral-300/5')}>
        <td role="cell" className={cx(tdClasses, 'max-md:hidden')} aria-hidden="true" />
        <td role="cell" colSpan={4} className={cx(tdClasses, 'pt-0')}>
          {readOnly ? (
            <Provenance label={cells.label} source={cells.source} assumed={cells.assumed} />
          ) : (
            <div className="grid items-start gap-3 md:grid-cols-[12rem_minmax(0,1fr)_minmax(0,1fr)_auto]">
              {control('label', 'Label', { width: 'w-full', labelVisible: true })}
              {control('source', 'Source', { width: 'w-full', multiline: true, labelVisible: true })}
              {control('assumed', 'Assumed', { width: 'w-full', multiline: true, labelVisible: true })}
              <RowActions row={n} onDuplicate={() => onDuplicate(index)} onRemove={() => onRemove(index)} className="flex gap-1 md:flex-col md:pt-6" />
            </div>
          )}
        </td>
      </tr>
    </>
  );
}

function ReadValue({ label, value }: { label: string; value: ReactNode }) {
  return (
    <span className="flex justify-between gap-4 tabular-nums md:block">
      <span className="text-foam-400 md:sr-only">{label}</span>
      <span className="text-foam-50">{value}</span>
    </span>
  );
}

/** Where a row's numbers come from: shown with the row, never hidden. */
function Provenance({ label, source, assumed }: { label: string; source: string; assumed: string }) {
  return (
    <div className="flex flex-col gap-1 rounded-md border-l-2 border-tide-300/60 bg-ink-900/60 px-3 py-2 text-sm">
      {label && <p className="font-bold text-foam-50">{label}</p>}
      <p>
        <span className="font-bold text-tide-300">Source:</span> <span className="text-foam-300">{source || 'not given'}</span>
      </p>
      <p>
        <span className="font-bold text-tide-300">Assumed:</span> <span className="text-foam-300">{assumed || 'nothing stated'}</span>
      </p>
    </div>
  );
}

interface CellControlProps {
  id: string;
  label: string;
  row: number;
  value: string;
  error?: string;
  readOnly: boolean;
  unit?: string;
  options?: { value: string; label: string }[];
  width?: string;
  multiline?: boolean;
  /** A symbol before the input ("a =", "p ="), when the column header names the quantity. */
  prefix?: string;
  /** Show the label at every width (cells without a column header). */
  labelVisible?: boolean;
  onChange: (value: string) => void;
}

const cellControl =
  'min-h-10 rounded border border-ink-500 bg-ink-900 px-2 py-1 text-base text-foam-50 hover:border-foam-400 aria-[invalid=true]:border-2 aria-[invalid=true]:border-coral-300';

/** One input of the grid: its label is visible when the rows are stacked, read out always ("Occurrence, row 3"). */
function CellControl({ id, label, row, value, error, unit, options, width = 'w-24', multiline, prefix, labelVisible, onChange }: CellControlProps) {
  const described = [unit ? `${id}-unit` : null, error ? `${id}-error` : null].filter(Boolean).join(' ') || undefined;
  const common = { id, 'aria-invalid': error ? (true as const) : undefined, 'aria-describedby': described };
  return (
    <div className={cx('flex flex-col gap-1', multiline || width === 'w-full' ? 'w-full' : undefined)}>
      <label htmlFor={id} className={cx('text-sm text-foam-400', !labelVisible && 'md:sr-only')}>
        {label}
        <span className="sr-only">, row {row}</span>
      </label>
      <div className="flex items-center gap-1">
        {prefix && (
          <span aria-hidden="true" className="text-sm whitespace-nowrap text-foam-400 max-md:hidden">
            {prefix}
          </span>
        )}
        {options ? (
          <select {...common} value={value} onChange={(event) => onChange(event.target.value)} className={cx(cellControl, width, 'cursor-pointer')}>
            {!options.some((o) => o.value === value) && <option value={value}>{value || '—'}</option>}
            {options.map((o) => (
              <option key={o.value} value={o.value}>
                {o.label}
              </option>
            ))}
          </select>
        ) : multiline ? (
          <textarea {...common} value={value} rows={2} maxLength={2000} onChange={(event) => onChange(event.target.value)} className={cx(cellControl, width, 'resize-y text-sm')} />
        ) : (
          <input
            {...common}
            type="text"
            inputMode={width === 'w-full' ? undefined : 'decimal'}
            autoComplete="off"
            spellCheck={false}
            value={value}
            maxLength={200}
            onChange={(event) => onChange(event.target.value)}
            className={cx(cellControl, width, 'tabular-nums')}
          />
        )}
        {unit && (
          <span id={`${id}-unit`} className="text-xs whitespace-nowrap text-foam-400">
            {unit}
          </span>
        )}
      </div>
      {error && (
        <p id={`${id}-error`} className="max-w-48 text-sm font-bold text-coral-300">
          {error}
        </p>
      )}
    </div>
  );
}
