import { useRef } from 'react';
import { Link } from 'react-router-dom';
import { Button } from '../../../components/ui/button.tsx';
import { ErrorState } from '../../../components/ui/error-state.tsx';
import { LoadingState } from '../../../components/ui/loading-state.tsx';
import { Select } from '../../../components/ui/select.tsx';
import { paths } from '../../../config/paths.ts';
import { cx } from '../../../lib/class-names.ts';
import { useScenarioTables } from '../api/get-scenario-tables.ts';
import { useBuilder } from './builder-context.tsx';
import { DraftKind, DraftNumber, DraftRange, DraftSelect, DraftText } from './builder-fields.tsx';
import { BuilderSection, FieldGrid } from './builder-section.tsx';
import { getAt, inputId, type DraftPath } from './scenario-draft.ts';
import { chosenValue, massKeyOf, newCompanionRow, type KindChoice } from './scenario-options.ts';
import { SHAPE_CHOICE } from '../../../../shared/contracts/method-choices.ts';
import { COMPANION_CLASS_OPTIONS, MASS_UNITS, RowActions, shapeParameters } from '../../../components/companion-rows.tsx';

/** A scenario holds at most this many inline rows (the schema's limit); longer tables are stored and named by id. */
const MAX_ROWS = 32;
const ROWS: DraftPath = ['companions', 'rows'];

const percent = (x: number) => `${(x * 100).toLocaleString('en-US', { maximumSignificantDigits: 3 })}%`;

export function CompanionsSection() {
  const { doc, update, readOnly, messageAt, departmentId } = useBuilder();
  const tableId = getAt(doc, ['companions', 'tableId']);
  const rowsValue = getAt(doc, ROWS);
  const rows = (Array.isArray(rowsValue) ? rowsValue : []) as Record<string, unknown>[];
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
        <DraftNumber path={['companions', 'multiplier']} label="Occurrence multiplier" unit="×" hint="Scales every row’s occurrence, for what-if studies; each product must stay at most 1." />
      </FieldGrid>

      {usesTable ? (
        <StoredTableChoice tables={tables} tableId={typeof tableId === 'string' ? tableId : ''} />
      ) : (
        <div className="flex flex-col gap-4">
          {rows.length === 0 && (
            <p className="rounded-md border border-dashed border-ink-600 p-4 text-foam-300">
              No companion rows: only the fossil channel, if it is on, can make magnetic white dwarfs.
            </p>
          )}
          <ol className="flex flex-col gap-4">
            {rows.map((row, index) => (
              <CompanionRowEditor key={index} index={index} row={row} count={rows.length} />
            ))}
          </ol>
          {!readOnly && (
            <div>
              <Button variant="secondary" disabled={rows.length >= MAX_ROWS} onClick={() => update(ROWS, [...rows, newCompanionRow()])}>
                Add a companion row
              </Button>
            </div>
          )}
        </div>
      )}
    </BuilderSection>
  );
}

function StoredTableChoice({ tables, tableId }: { tables: ReturnType<typeof useScenarioTables>; tableId: string }) {
  const { update, messageAt, readOnly } = useBuilder();
  if (tables.isPending) return <LoadingState label="Loading the stored tables…" />;
  if (tables.isError) return <ErrorState error={tables.error} title="The stored tables could not be loaded" onRetry={() => void tables.refetch()} retrying={tables.isFetching} />;
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
          ...(known ? [] : [{ value: tableId, label: tableId ? `Unknown table (${tableId})` : 'Choose a table…', disabled: true }]),
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

function CompanionRowEditor({ index, row, count }: { index: number; row: Record<string, unknown>; count: number }) {
  const { doc, update, messageAt, readOnly } = useBuilder();
  const path: DraftPath = [...ROWS, index];
  const massKey = massKeyOf(row);
  const massUnit = MASS_UNITS.find((u) => u.key === massKey)!;
  const shapeChoice: KindChoice = { ...SHAPE_CHOICE, path: [...path, 'shape'] };
  const shapeKind = chosenValue(row, SHAPE_CHOICE, ['shape']);
  const multiplier = getAt(doc, ['companions', 'multiplier']);
  const occurrence = row.occurrence;
  const effective = typeof occurrence === 'number' && typeof multiplier === 'number' ? occurrence * multiplier : null;
  const rows = getAt(doc, ROWS) as Record<string, unknown>[];
  const sr = <span className="sr-only">, row {index + 1}</span>;
  const title = `Row ${index + 1}${typeof row.label === 'string' && row.label ? `: ${row.label}` : ''}`;

  function changeUnit(key: string) {
    const { massMJup, massMsun, massRatio, ...rest } = row;
    const range = massMJup ?? massMsun ?? massRatio ?? [undefined, undefined];
    update(path, { ...rest, [key]: range });
  }

  return (
    <li className="rounded-lg border border-ink-700 bg-ink-900/60 p-4 sm:p-5">
      <fieldset className="flex min-w-0 flex-col gap-5">
        <legend className="sr-only">{title}</legend>
        <div className="flex flex-wrap items-start justify-between gap-3">
          <h3 className="text-lg font-bold text-foam-50" aria-hidden="true">
            {title}
          </h3>
          {!readOnly && (
            <RowActions
              row={index + 1}
              duplicateDisabled={count >= MAX_ROWS}
              onDuplicate={() => update(ROWS, [...rows.slice(0, index + 1), structuredClone(row), ...rows.slice(index + 1)])}
              onRemove={() => update(ROWS, rows.filter((_, j) => j !== index))}
              className="flex flex-wrap gap-2"
            />
          )}
        </div>
        {messageAt(path) && <p className="text-sm font-bold text-coral-300">{messageAt(path)}</p>}
        <FieldGrid columns={3}>
          <DraftText path={[...path, 'label']} label={<>Label{sr}</>} maxLength={200} />
          <DraftSelect path={[...path, 'class']} label={<>Class{sr}</>} options={COMPANION_CLASS_OPTIONS} />
          <Select
            id={inputId([...path, 'massUnit'])}
            label={<>Mass given in{sr}</>}
            value={massKey}
            disabled={readOnly}
            options={MASS_UNITS.map((u) => ({ value: u.key, label: u.label }))}
            onChange={(event) => changeUnit(event.target.value)}
          />
        </FieldGrid>
        <FieldGrid>
          <DraftRange path={[...path, massKey]} label="Companion mass" srSuffix={`, row ${index + 1}`} unit={massUnit.unit} />
          <DraftRange path={[...path, 'periodDays']} label="Initial orbital period" srSuffix={`, row ${index + 1}`} unit="days" />
        </FieldGrid>
        <FieldGrid>
          <DraftNumber
            path={[...path, 'occurrence']}
            label={<>Occurrence{sr}</>}
            unit="fraction"
            hint={
              <span className={cx(effective !== null && effective > 1 && 'font-bold text-coral-300')}>
                Probability that a star hosts one such companion.
                {effective !== null && Number.isFinite(effective) && ` With the multiplier: ${percent(effective)} of stars.`}
              </span>
            }
          />
          <DraftKind choice={shapeChoice} label={<>Distribution inside the row{sr}</>} />
        </FieldGrid>
        <FieldGrid>
          <DraftNumber
            path={[...path, 'hostMassSlope']}
            label={<>Host-mass slope{sr}</>}
            unit="dimensionless"
            hint="Occurrence × (M1 / 1 Msun)^slope, capped at 1 per star; empty or 0 = the same for every host. Giant planets grow more common with host mass (Johnson et al. 2010, from memory)."
          />
        </FieldGrid>
        {shapeKind !== undefined && (
          <FieldGrid>
            {shapeParameters(shapeKind).map((p) => (
              <DraftNumber key={p.key} path={[...path, 'shape', p.key]} label={<>{p.label}{sr}</>} unit={p.unit || 'dimensionless'} hint={p.hint} />
            ))}
          </FieldGrid>
        )}
        <FieldGrid>
          <DraftText path={[...path, 'source']} label={<>Source{sr}</>} hint="Paper, table, equation." multiline maxLength={2000} />
          <DraftText path={[...path, 'assumed']} label={<>Assumed{sr}</>} hint="What was assumed where the source is silent." multiline maxLength={2000} />
        </FieldGrid>
      </fieldset>
    </li>
  );
}
