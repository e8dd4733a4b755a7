import type { ReactNode } from 'react';
import { SHAPE_CHOICE } from '../../shared/contracts/method-choices.ts';
import type { CellColumn, RowCells } from '../../shared/contracts/occurrence-row-cells.ts';
import { cx } from '../lib/class-names.ts';
import {
  COMPANION_CLASS_OPTIONS,
  MASS_UNITS,
  RowActions,
  SHAPE_SHORT_OPTIONS,
  shapeParameters,
  type ShapeParameter,
} from './companion-rows.tsx';
import { formatNumber } from '../../shared/contracts/field-issues.ts';
import { CitationLinks } from './ui/citation-links.tsx';

const CLASS_OPTIONS = COMPANION_CLASS_OPTIONS.map(({ value, label }) => ({ value, label }));
const UNIT_OPTIONS = MASS_UNITS.map(({ value, label }) => ({ value, label }));
const CLASS_TEXT: Record<string, string> = Object.fromEntries(CLASS_OPTIONS.map((o) => [o.value, o.label]));
/** A shape parameter's label in the grid, with its formula when it has one: "Mass slope a (dN ∝ M^a dlnM)". */
const parameterLabel = (p: ShapeParameter) => (p.hint ? `${p.label} (${p.hint.replace(/\.$/, '')})` : p.label);
const HEADERS = ['Row', 'Class, occurrence (probability 0–1)', 'Mass', 'Initial period (days)', 'Shape inside the row'];

/** The cells a new shape starts with: its declared template's values (shared/contracts/method-choices.ts). */
function shapeCells(kind: string): Partial<RowCells> {
  const template = SHAPE_CHOICE.options.find((o) => o.value === kind)?.template ?? {};
  const patch: Partial<RowCells> = { shape: kind };
  for (const p of shapeParameters(kind))
    patch[p.key] = typeof template[p.key] === 'number' ? formatNumber(template[p.key] as number) : '';
  return patch;
}

export interface EditorRow {
  key: string | number;
  cells: RowCells;
}

export interface CompanionRowsEditorProps {
  /** Names the grid's caption (`<id>-caption`). */
  id: string;
  /** The rows shown (one page of them on a long table). */
  rows: readonly EditorRow[];
  /** The index of the first shown row among all rows (rows are numbered and addressed by it). */
  first?: number;
  /** How many rows there are in all. */
  total?: number;
  caption: ReactNode;
  /** Shown when there are no rows. */
  empty: ReactNode;
  /** Values shown as text, with each row's provenance; no inputs. */
  readOnly: boolean;
  /** The DOM id of a cell's input, so that a problem elsewhere on the page can move focus to it. */
  cellId: (index: number, column: CellColumn) => string;
  /** The problem to show in a cell, in plain words ("Must be between 0 and 1 (got 1.5)"). */
  errorAt: (index: number, column: CellColumn) => string | undefined;
  /** A problem of a row as a whole (shown beside its number). */
  rowProblemAt?: (index: number) => string | undefined;
  /** A note under a row's occurrence (what the scenario's multiplier makes of it). */
  occurrenceNote?: (index: number, cells: RowCells) => ReactNode;
  /** No room for another row. */
  full?: boolean;
  onCellsChange: (index: number, patch: Partial<RowCells>) => void;
  onRemove: (index: number) => void;
  onDuplicate: (index: number) => void;
  /** Moves the row at `index` to `to`. */
  onMove: (index: number, to: number) => void;
}

/**
 * The one editor of companion-occurrence rows, for a stored table's page and for a scenario's
 * inline rows: a grid with a row's numbers on one line and its label, provenance and actions on
 * the next (stacked on narrow screens). Cells are the text of the shared row cells
 * (shared/contracts/occurrence-row-cells.ts); the page that holds the rows checks them with the
 * shared row reader or schema and hands each cell its problem.
 */
export function CompanionRowsEditor({
  id,
  rows,
  first = 0,
  total = rows.length,
  caption,
  empty,
  readOnly,
  ...rowProps
}: CompanionRowsEditorProps) {
  return (
    <div
      role="region"
      aria-labelledby={`${id}-caption`}
      tabIndex={0}
      className="relative overflow-x-auto rounded-md border border-ink-700"
    >
      <table role="table" className="w-full border-collapse text-left max-md:block">
        <caption id={`${id}-caption`} className="px-4 py-3 text-left font-bold text-foam-50 max-md:block">
          {caption}
        </caption>
        <thead role="rowgroup" className="bg-ink-800 text-sm text-foam-300 max-md:sr-only">
          <tr role="row">
            {HEADERS.map((h) => (
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
                {empty}
              </td>
            </tr>
          )}
          {rows.map((row, offset) => (
            <RowLines
              key={row.key}
              index={first + offset}
              total={total}
              cells={row.cells}
              readOnly={readOnly}
              {...rowProps}
            />
          ))}
        </tbody>
      </table>
    </div>
  );
}

type RowLinesProps = Omit<CompanionRowsEditorProps, 'id' | 'rows' | 'first' | 'caption' | 'empty'> & {
  index: number;
  total: number;
  cells: RowCells;
};

const tdClasses = 'px-3 py-2 align-top max-md:block max-md:px-4 max-md:py-1.5';

/** One row: the numbers on the first line, its label, provenance and actions on the second. */
function RowLines({
  index,
  total,
  cells,
  readOnly,
  cellId,
  errorAt,
  rowProblemAt,
  occurrenceNote,
  full,
  onCellsChange,
  onRemove,
  onDuplicate,
  onMove,
}: RowLinesProps) {
  const n = index + 1;
  const control = (
    column: CellColumn,
    label: string,
    extra: Partial<
      Pick<CellControlProps, 'unit' | 'options' | 'width' | 'multiline' | 'prefix' | 'labelVisible' | 'note'>
    > = {},
  ) => (
    <CellControl
      id={cellId(index, column)}
      label={label}
      row={n}
      value={cells[column]}
      error={errorAt(index, column)}
      onChange={(value) => onCellsChange(index, { [column]: value })}
      {...extra}
    />
  );
  const rowProblem = rowProblemAt?.(index);
  const massUnit = UNIT_OPTIONS.some((u) => u.value === cells.massUnit) ? cells.massUnit : 'MJup';
  const parameters = shapeParameters(cells.shape);
  const hasProblem =
    Boolean(rowProblem) || (Object.keys(cells) as CellColumn[]).some((column) => errorAt(index, column));
  const shapeOption = SHAPE_CHOICE.options.find((o) => o.value === (cells.shape || 'powerlaw'));
  const shapeText = `${SHAPE_SHORT_OPTIONS.find((o) => o.value === cells.shape)?.label ?? cells.shape}: ${parameters
    .map((p) => `${p.symbol} = ${cells[p.key] || 'default'}${p.unit ? ` ${p.unit}` : ''}`)
    .join(', ')}`;
  const note = occurrenceNote?.(index, cells);
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
              {cells.hostMassSlope && (
                <ReadValue label="Host-mass slope" value={`× (M1/Msun)^${cells.hostMassSlope}`} />
              )}
              {note && <p className="mt-1 max-w-48 text-sm text-foam-300">{note}</p>}
            </>
          ) : (
            <div className="flex flex-col gap-2">
              {control('class', 'Class', { options: CLASS_OPTIONS, width: 'w-40' })}
              {control('occurrence', 'Occurrence', { width: 'w-24', prefix: 'p =', note })}
              {control('hostMassSlope', 'Host-mass slope s', {
                width: 'w-20',
                labelVisible: true,
                unit: '× (M1/Msun)^s',
              })}
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
                <span aria-hidden="true" className="pt-2 text-foam-400 max-md:pt-8">
                  –
                </span>
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
              <span aria-hidden="true" className="pt-2 text-foam-400 max-md:pt-8">
                –
              </span>
              {control('periodMaxDays', 'Period to', { unit: 'd', width: 'w-20' })}
            </div>
          )}
        </td>
        <td role="cell" className={tdClasses}>
          {readOnly ? (
            <ReadValue label="Shape" value={shapeText} />
          ) : (
            <div className="flex flex-col gap-2">
              <CellControl
                id={cellId(index, 'shape')}
                label="Shape"
                row={n}
                value={cells.shape}
                error={errorAt(index, 'shape')}
                options={SHAPE_SHORT_OPTIONS}
                width="w-36"
                onChange={(kind) => onCellsChange(index, shapeCells(kind))}
              />
              <div className="flex flex-wrap items-start gap-2">
                {parameters.map((p) => (
                  <div key={p.key}>
                    {control(p.key, parameterLabel(p), {
                      unit: p.unit || undefined,
                      width: 'w-20',
                      prefix: `${p.symbol} =`,
                    })}
                  </div>
                ))}
              </div>
            </div>
          )}
          {shapeOption && shapeOption.cites.length > 0 && (
            <p className="mt-1 max-w-48 text-xs text-tide-300">
              <CitationLinks cites={shapeOption.cites} />
            </p>
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
              {control('source', 'Source (paper, table, equation)', {
                width: 'w-full',
                multiline: true,
                labelVisible: true,
              })}
              {control('assumed', 'Assumed (where the source is silent)', {
                width: 'w-full',
                multiline: true,
                labelVisible: true,
              })}
              <RowActions
                row={n}
                duplicateDisabled={full}
                onMoveUp={index > 0 ? () => onMove(index, index - 1) : undefined}
                onMoveDown={index < total - 1 ? () => onMove(index, index + 1) : undefined}
                onDuplicate={() => onDuplicate(index)}
                onRemove={() => onRemove(index)}
                className="flex flex-wrap gap-1 md:flex-col md:pt-6"
              />
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
        <span className="font-bold text-tide-300">Source:</span>{' '}
        <span className="text-foam-300">{source || 'not given'}</span>
      </p>
      <p>
        <span className="font-bold text-tide-300">Assumed:</span>{' '}
        <span className="text-foam-300">{assumed || 'nothing stated'}</span>
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
  unit?: string;
  options?: readonly { value: string; label: string }[];
  width?: string;
  multiline?: boolean;
  /** A symbol before the input ("a =", "p ="), when the column header names the quantity. */
  prefix?: string;
  /** Show the label at every width (cells without a column header). */
  labelVisible?: boolean;
  /** A line under the input, read out with it. */
  note?: ReactNode;
  onChange: (value: string) => void;
}

const cellControl =
  'min-h-10 rounded border border-ink-500 bg-ink-900 px-2 py-1 text-base text-foam-50 hover:border-foam-400 aria-[invalid=true]:border-2 aria-[invalid=true]:border-coral-300';

/** One input of the grid: its label is visible when the rows are stacked, read out always ("Occurrence, row 3"). */
function CellControl({
  id,
  label,
  row,
  value,
  error,
  unit,
  options,
  width = 'w-24',
  multiline,
  prefix,
  labelVisible,
  note,
  onChange,
}: CellControlProps) {
  const described =
    [unit ? `${id}-unit` : null, note ? `${id}-note` : null, error ? `${id}-error` : null].filter(Boolean).join(' ') ||
    undefined;
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
          <select
            {...common}
            value={value}
            onChange={(event) => onChange(event.target.value)}
            className={cx(cellControl, width, 'cursor-pointer')}
          >
            {!options.some((o) => o.value === value) && <option value={value}>{value || '—'}</option>}
            {options.map((o) => (
              <option key={o.value} value={o.value}>
                {o.label}
              </option>
            ))}
          </select>
        ) : multiline ? (
          <textarea
            {...common}
            value={value}
            rows={2}
            maxLength={2000}
            onChange={(event) => onChange(event.target.value)}
            className={cx(cellControl, width, 'resize-y text-sm')}
          />
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
      {note && (
        <p id={`${id}-note`} className="max-w-48 text-sm text-foam-300">
          {note}
        </p>
      )}
      {error && (
        <p id={`${id}-error`} className="max-w-48 text-sm font-bold text-coral-300">
          {error}
        </p>
      )}
    </div>
  );
}
