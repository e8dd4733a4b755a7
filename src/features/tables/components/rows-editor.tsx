import { useEffect, useMemo, useRef, useState } from 'react';
import type { TableDetail } from '../../../../shared/contracts/occurrence-tables-api.ts';
import { Alert } from '../../../components/ui/alert.tsx';
import { Badge } from '../../../components/ui/badge.tsx';
import { Button } from '../../../components/ui/button.tsx';
import { errorMessage } from '../../../components/ui/error-state.tsx';
import { useUnsavedChanges } from '../../../hooks/use-unsaved-changes.tsx';
import { isApiError } from '../../../lib/api-client.ts';
import { useUpdateTable } from '../api/update-table.ts';
import {
  blankCells,
  cellKey,
  cellOfServerField,
  checkCells,
  serverCellMessage,
  type CellProblem,
} from '../../../components/companion-row-cells.ts';
import { cellsFromRow, type CellColumn, type RowCells } from '../../../../shared/contracts/occurrence-row-cells.ts';
import { CompanionRowsEditor } from '../../../components/companion-rows-editor.tsx';
import { moveItem } from '../../../lib/move-item.ts';

const PAGE_SIZE = 25;

interface DraftRow {
  key: number;
  cells: RowCells;
}

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
  const [serverProblem, setServerProblem] = useState<{
    index: number;
    column: CellColumn | null;
    message: string;
  } | null>(null);
  const [formError, setFormError] = useState<string | null>(null);
  const [saved, setSaved] = useState(false);
  const [pendingFocus, setPendingFocus] = useState<string | null>(null);

  const dirty = snapshot(rows) !== baseline;
  const guard = useUnsavedChanges(dirty && !readOnly, 'The table');
  const checks = useMemo(() => rows.map((r) => checkCells(r.cells)), [rows]);
  const problems = useMemo(() => {
    const list: { index: number; problem: CellProblem }[] = [];
    checks.forEach((check, index) => {
      if (!check.ok && (attempted || touched.has(rows[index].key)))
        for (const problem of check.problems) list.push({ index, problem });
    });
    return list;
  }, [checks, attempted, touched, rows]);
  const cellErrors = useMemo(() => {
    const map = new Map<string, string>();
    for (const { index, problem } of problems)
      if (!map.has(cellKey(index, problem.column))) map.set(cellKey(index, problem.column), problem.message);
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

  function change(index: number, patch: Partial<RowCells>) {
    setRows((list) => list.map((r, i) => (i === index ? { ...r, cells: { ...r.cells, ...patch } } : r)));
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
    setRows((list) => [
      ...list.slice(0, index + 1),
      { key: nextKey.current++, cells: { ...list[index].cells } },
      ...list.slice(index + 1),
    ]);
  }

  function moveRow(index: number, to: number) {
    setRows((list) => moveItem(list, index, to));
    setServerProblem(null);
    goTo(to, 'class');
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
        <section
          aria-labelledby="rows-problems-title"
          className="rounded-md border border-coral-300/50 bg-coral-300/8 p-4"
        >
          <h3 id="rows-problems-title" className="font-bold text-foam-50">
            {problems.length} problem{problems.length === 1 ? '' : 's'} in the rows
          </h3>
          <ul className="mt-2 flex flex-col gap-1">
            {problems.slice(0, 10).map(({ index, problem }) => (
              <li key={`${index}:${problem.column}`}>
                <button
                  type="button"
                  onClick={() => goTo(index, problem.column)}
                  className="text-left text-sm text-coral-300 underline underline-offset-3"
                >
                  Row {index + 1}, {problem.column}: {problem.message}
                </button>
              </li>
            ))}
            {problems.length > 10 && <li className="text-sm text-foam-300">and {problems.length - 10} more.</li>}
          </ul>
        </section>
      )}

      <CompanionRowsEditor
        id="table-rows"
        rows={visible}
        first={first}
        total={rows.length}
        caption={
          <>
            Rows {rows.length === 0 ? '' : `${first + 1}–${first + visible.length} `}of {rows.length}
            {readOnly ? '' : ' (edit in place, then save)'}
          </>
        }
        empty={<>The table has no rows yet.{readOnly ? '' : ' Add one below.'}</>}
        readOnly={readOnly}
        cellId={cellId}
        errorAt={(index, column) => cellErrors.get(cellKey(index, column))}
        rowProblemAt={(index) =>
          serverProblem && serverProblem.index === index && !serverProblem.column ? serverProblem.message : undefined
        }
        onCellsChange={change}
        onRemove={removeRow}
        onDuplicate={duplicateRow}
        onMove={moveRow}
      />

      {pages > 1 && (
        <nav aria-label="Pages of rows" className="flex flex-wrap items-center gap-3">
          <Button variant="secondary" size="sm" disabled={shownPage === 0} onClick={() => setPage(shownPage - 1)}>
            Previous rows
          </Button>
          <span className="text-foam-300">
            Page {shownPage + 1} of {pages}
          </span>
          <Button
            variant="secondary"
            size="sm"
            disabled={shownPage >= pages - 1}
            onClick={() => setPage(shownPage + 1)}
          >
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
              {saved ? (
                <span className="font-bold text-kelp-300">Saved.</span>
              ) : dirty ? (
                <Badge tone="warning">Unsaved changes</Badge>
              ) : (
                <span className="text-foam-300">No unsaved changes.</span>
              )}
            </span>
          </div>
          <p className="text-sm text-foam-400">
            Saving replaces every row of the table. Runs already made keep the rows they used.
          </p>
        </div>
      )}
      {guard.dialog}
    </div>
  );
}
