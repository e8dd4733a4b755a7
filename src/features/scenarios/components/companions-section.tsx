import { useRef, useState } from 'react';
import { Link } from 'react-router-dom';
import { Button } from '../../../components/ui/button.tsx';
import { ErrorState } from '../../../components/ui/error-state.tsx';
import { LoadingState } from '../../../components/ui/loading-state.tsx';
import { Select } from '../../../components/ui/select.tsx';
import { paths } from '../../../config/paths.ts';
import { cx } from '../../../lib/class-names.ts';
import { useScenarioTables } from '../api/get-scenario-tables.ts';
import { useBuilder } from './builder-context.tsx';
import { DraftNumber } from './builder-fields.tsx';
import { BuilderSection, FieldGrid } from './builder-section.tsx';
import { getAt, inputId, type DraftPath } from './scenario-draft.ts';
import { newCompanionRow } from './scenario-options.ts';
import { CompanionRowsEditor, type EditorRow } from '../../../components/companion-rows-editor.tsx';
import {
  CELL_ROW_KEYS,
  cellsFromRow,
  pathOfColumn,
  rowCandidate,
  type CellColumn,
  type RowCells,
} from '../../../../shared/contracts/occurrence-row-cells.ts';
import { parseNumberText } from '../../../lib/number-input.ts';
import { checkCells } from '../../../components/companion-row-cells.ts';
import { moveItem } from '../../../lib/move-item.ts';

/** A scenario holds at most this many inline rows (the schema's limit); longer tables are stored and named by id. */
const MAX_ROWS = 32;
const ROWS: DraftPath = ['companions', 'rows'];

const percent = (x: number) => `${(x * 100).toLocaleString('en-US', { maximumSignificantDigits: 3 })}%`;

export function CompanionsSection() {
  const { doc, update, readOnly, messageAt, departmentId } = useBuilder();
  const tableId = getAt(doc, ['companions', 'tableId']);
  const rowsValue = getAt(doc, ROWS);
  const usesTable = tableId !== undefined;
  // Rows set aside while a stored table is chosen, so that switching back restores them.
  const stash = useRef<Record<string, unknown>[] | null>(null);
  const tables = useScenarioTables(departmentId);

  function chooseSource(next: 'rows' | 'table') {
    const companions = (getAt(doc, ['companions']) ?? {}) as Record<string, unknown>;
    const { rows: currentRows, tableId: _tableId, ...rest } = companions;
    if (next === 'table') {
      stash.current = Array.isArray(currentRows) ? (currentRows as Record<string, unknown>[]) : null;
      update(['companions'], { ...rest, tableId: tables.data?.tables[0]?.id ?? '' });
    } else {
      update(['companions'], { ...rest, rows: stash.current ?? [] });
    }
  }

  return (
    <BuilderSection
      id="companions"
      description="Planets, brown dwarfs and low-mass stars around the primaries. Each row is the probability that a star hosts one companion of that kind; rows are independent."
    >
      <fieldset className="flex flex-col gap-3">
        <legend className="mb-1 font-bold text-foam-50">Where the companions come from</legend>
        {(
          [
            ['rows', 'Rows written in this scenario', `Up to ${MAX_ROWS} rows, each with its own source.`],
            ['table', 'A stored occurrence table', 'Named by id; its rows are read when a run starts.'],
          ] as const
        ).map(([value, label, hint]) => (
          <div key={value} className="flex items-start gap-3">
            <input
              id={`companions-source-${value}`}
              type="radio"
              name="companions-source"
              checked={usesTable === (value === 'table')}
              disabled={readOnly}
              aria-describedby={`companions-source-${value}-hint`}
              onChange={() => chooseSource(value)}
              className="mt-1 size-5 shrink-0 cursor-pointer accent-lantern-400 disabled:cursor-not-allowed"
            />
            <div>
              <label htmlFor={`companions-source-${value}`} className="cursor-pointer font-bold text-foam-50">
                {label}
              </label>
              <p id={`companions-source-${value}-hint`} className="text-sm text-foam-400">
                {hint}
              </p>
            </div>
          </div>
        ))}
        {messageAt(['companions']) && <p className="text-sm font-bold text-coral-300">{messageAt(['companions'])}</p>}
      </fieldset>

      <FieldGrid>
        <DraftNumber
          path={['companions', 'multiplier']}
          label="Occurrence multiplier"
          unit="×"
          hint="Scales every row’s occurrence, for what-if studies; each product must stay at most 1."
        />
      </FieldGrid>

      {usesTable ? (
        <StoredTableChoice tables={tables} tableId={typeof tableId === 'string' ? tableId : ''} />
      ) : (
        <InlineRows value={rowsValue} />
      )}
    </BuilderSection>
  );
}

function StoredTableChoice({ tables, tableId }: { tables: ReturnType<typeof useScenarioTables>; tableId: string }) {
  const { update, messageAt, readOnly } = useBuilder();
  if (tables.isPending) return <LoadingState label="Loading the stored tables…" />;
  if (tables.isError)
    return (
      <ErrorState
        error={tables.error}
        title="The stored tables could not be loaded"
        onRetry={() => void tables.refetch()}
        retrying={tables.isFetching}
      />
    );
  const list = tables.data.tables;
  const known = list.some((t) => t.id === tableId);
  return (
    <div className="flex flex-col gap-3">
      <Select
        id={inputId(['companions', 'tableId'])}
        label="Which stored table"
        error={messageAt(['companions', 'tableId'])}
        value={tableId}
        disabled={readOnly}
        hint={list.length === 0 ? 'The department has no stored table yet.' : undefined}
        options={[
          ...(known
            ? []
            : [{ value: tableId, label: tableId ? `Unknown table (${tableId})` : 'Choose a table…', disabled: true }]),
          ...list.map((t) => ({ value: t.id, label: `${t.name} (${t.rowCount} row${t.rowCount === 1 ? '' : 's'})` })),
        ]}
        onChange={(event) => update(['companions', 'tableId'], event.target.value)}
      />
      <p className="text-sm text-foam-300">
        {known ? (
          <Link to={paths.occurrenceTables.detail.getHref(tableId)}>Open the table: its rows and their sources</Link>
        ) : (
          <Link to={paths.occurrenceTables.getHref()}>Store or upload a table</Link>
        )}
      </p>
    </div>
  );
}

/** The path of a cell's value in the draft ("companions.rows[2].massMJup[1]"). */
const cellPath = (index: number, column: CellColumn, cells: RowCells | undefined): DraftPath => [
  ...ROWS,
  index,
  ...pathOfColumn(column, cells?.massUnit ?? 'MJup'),
];

/**
 * The scenario's inline rows in the shared row editor. The editor holds each row as text cells
 * while it is typed; each edit writes the row the cells describe (rowCandidate, the shared row
 * reader's own reading) into the draft, where the scenario schema checks it. When the rows
 * change from elsewhere (a preset, pasted JSON, Discard) the cells are read again from the draft.
 */
function InlineRows({ value }: { value: unknown }) {
  const { doc, update, messageAt, readOnly } = useBuilder();
  const rows = (Array.isArray(value) ? value : []) as Record<string, unknown>[];
  const nextKey = useRef(0);
  const read = (): { source: unknown; rows: EditorRow[] } => ({
    source: value,
    rows: rows.map((row) => ({ key: nextKey.current++, cells: cellsFromRow(row) })),
  });
  const [state, setState] = useState(read);
  let current = state;
  if (state.source !== value) {
    current = read();
    setState(current);
  }
  const multiplier = getAt(doc, ['companions', 'multiplier']);

  function write(next: EditorRow[], draftRows: Record<string, unknown>[]) {
    setState({ source: draftRows, rows: next });
    update(ROWS, draftRows);
  }

  /** The row the cells describe, keeping whatever else the draft's row holds. */
  function draftRow(cells: RowCells, before: Record<string, unknown> | undefined): Record<string, unknown> {
    const kept = Object.fromEntries(
      Object.entries(before ?? {}).filter(([key]) => !(CELL_ROW_KEYS as readonly string[]).includes(key)),
    );
    return { ...kept, ...rowCandidate(cells, (text) => parseNumberText(text)) };
  }

  const full = current.rows.length >= MAX_ROWS;
  const added = newCompanionRow();
  return (
    <div className="flex flex-col gap-4">
      <CompanionRowsEditor
        id="companion-rows"
        rows={current.rows}
        caption={`${current.rows.length} row${current.rows.length === 1 ? '' : 's'} of at most ${MAX_ROWS}`}
        empty="No companion rows: only the fossil channel, if it is on, can make magnetic white dwarfs."
        readOnly={readOnly}
        full={full}
        cellId={(index, column) => inputId(cellPath(index, column, current.rows[index]?.cells))}
        errorAt={(index, column) => {
          // Text that is not a number is said as such by the shared row reader; everything else as the scenario's check says it.
          const cells = current.rows[index]?.cells;
          const check = cells && Number.isNaN(parseNumberText(cells[column])) ? checkCells(cells) : null;
          if (check && !check.ok) return check.problems.find((p) => p.column === column)?.message;
          const path = cellPath(index, column, cells);
          // A range's own problem (low not below high) and a shape's are named by the pair and the shape.
          return (
            messageAt(path) ?? (path.at(-1) === 0 || column === 'shape' ? messageAt(path.slice(0, -1)) : undefined)
          );
        }}
        rowProblemAt={(index) => messageAt([...ROWS, index])}
        occurrenceNote={(_, cells) => {
          const occurrence = parseNumberText(cells.occurrence);
          const effective = occurrence !== null && typeof multiplier === 'number' ? occurrence * multiplier : null;
          if (effective === null || !Number.isFinite(effective)) return undefined;
          return (
            <span className={cx(effective > 1 && 'font-bold text-coral-300')}>
              With the multiplier: {percent(effective)} of stars.
            </span>
          );
        }}
        onCellsChange={(index, patch) => {
          const cells = { ...current.rows[index].cells, ...patch };
          write(
            current.rows.map((r, i) => (i === index ? { ...r, cells } : r)),
            rows.map((r, i) => (i === index ? draftRow(cells, r) : r)),
          );
        }}
        onRemove={(index) =>
          write(
            current.rows.filter((_, i) => i !== index),
            rows.filter((_, i) => i !== index),
          )
        }
        onDuplicate={(index) =>
          write(
            [
              ...current.rows.slice(0, index + 1),
              { key: nextKey.current++, cells: { ...current.rows[index].cells } },
              ...current.rows.slice(index + 1),
            ],
            [...rows.slice(0, index + 1), structuredClone(rows[index]), ...rows.slice(index + 1)],
          )
        }
        onMove={(index, to) => write(moveItem(current.rows, index, to), moveItem(rows, index, to))}
      />
      {!readOnly && (
        <div>
          <Button
            variant="secondary"
            disabled={full}
            onClick={() =>
              write([...current.rows, { key: nextKey.current++, cells: cellsFromRow(added) }], [...rows, added])
            }
          >
            Add a companion row
          </Button>
        </div>
      )}
    </div>
  );
}
