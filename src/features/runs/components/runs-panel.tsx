import { useState } from 'react';
import { Link } from 'react-router-dom';
import { RUN_SORT_FIELDS, type RunSummary } from '../../../../shared/contracts/runs.ts';
import { Button, buttonClasses } from '../../../components/ui/button.tsx';
import { Card } from '../../../components/ui/card.tsx';
import { EmptyState } from '../../../components/ui/empty-state.tsx';
import { ErrorState } from '../../../components/ui/error-state.tsx';
import { LoadingState } from '../../../components/ui/loading-state.tsx';
import { Select } from '../../../components/ui/select.tsx';
import { paths } from '../../../config/paths.ts';
import { useRuns } from '../api/get-runs.ts';
import { RunFilters } from './run-filters.tsx';
import { hasFilters, PAGE_SIZES, runListParams, toggleSort, type RunListState } from './run-list-params.ts';
import { RunsTable } from './runs-table.tsx';

/** A comparison takes two to four runs (GET /api/compare). */
export const COMPARE_MIN = 2;
export const COMPARE_MAX = 4;

const SORT_LABELS: Record<RunListState['sort'], string> = {
  createdAt: 'Start time',
  finishedAt: 'Finish time',
  systems: 'Systems',
  fraction: 'Magnetic fraction',
  status: 'Status',
  scenarioName: 'Scenario name',
};
const sortOptions = RUN_SORT_FIELDS.map((f) => ({ value: f, label: SORT_LABELS[f] }));
const orderOptions = [
  { value: 'desc', label: 'Descending' },
  { value: 'asc', label: 'Ascending' },
];
const pageSizeOptions = PAGE_SIZES.map((n) => ({ value: String(n), label: `${n} per page` }));

export interface RunsPanelProps {
  departmentId: string;
  state: RunListState;
  onStateChange: (next: RunListState) => void;
}

export function RunsPanel({ departmentId, state, onStateChange }: RunsPanelProps) {
  const runs = useRuns(departmentId, runListParams(state));
  // Picked runs stay picked across pages and filters, in the order they were picked.
  const [picked, setPicked] = useState<RunSummary[]>([]);
  const selected = new Set(picked.map((r) => r.id));

  const toggle = (run: RunSummary) =>
    setPicked((current) => (current.some((r) => r.id === run.id) ? current.filter((r) => r.id !== run.id) : current.length < COMPARE_MAX ? [...current, run] : current));

  const data = runs.data;
  const total = data?.page.total ?? 0;
  const firstShown = total === 0 ? 0 : (state.page - 1) * state.pageSize + 1;
  const lastShown = Math.min(total, state.page * state.pageSize);
  const pageCount = Math.max(1, Math.ceil(total / state.pageSize));

  return (
    <div className="flex flex-col gap-6">
      <Card title="Filter" headingLevel={2}>
        <RunFilters state={state} onChange={onStateChange} />
      </Card>

      <CompareBar picked={picked} onClear={() => setPicked([])} onRemove={toggle} />

      <Card
        title="Runs"
        description={data ? (total === 0 ? 'No runs to show.' : `Runs ${firstShown}–${lastShown} of ${total}.`) : undefined}
        actions={
          <div className="grid grid-cols-2 gap-3 md:hidden">
            <Select label="Sort by" value={state.sort} options={sortOptions} onChange={(e) => onStateChange({ ...state, sort: e.target.value as RunListState['sort'], page: 1 })} />
            <Select label="Order" value={state.order} options={orderOptions} onChange={(e) => onStateChange({ ...state, order: e.target.value as RunListState['order'], page: 1 })} />
          </div>
        }
      >
        {runs.isPending ? (
          <LoadingState label="Loading runs…" />
        ) : runs.isError ? (
          <ErrorState error={runs.error} title="The runs could not be loaded" onRetry={() => void runs.refetch()} retrying={runs.isFetching} />
        ) : data!.runs.length === 0 ? (
          hasFilters(state) ? (
            <EmptyState title="No runs match these filters" action={<Button variant="secondary" onClick={() => onStateChange({ ...state, status: null, q: '', mine: false, page: 1 })}>Clear filters</Button>}>
              Try another status or scenario name, or show everyone’s runs.
            </EmptyState>
          ) : (
            <EmptyState title="No runs yet" action={<Link to={paths.runs.new.getHref()} className={buttonClasses()}>Start a run</Link>}>
              A run draws a scenario’s population with a seed and reports the predicted magnetic fraction with its Monte Carlo error.
            </EmptyState>
          )
        ) : (
          <div className="flex flex-col gap-4" aria-busy={runs.isFetching && runs.isPlaceholderData}>
            <RunsTable
              runs={data!.runs}
              state={state}
              onSort={(field) => onStateChange(toggleSort(state, field))}
              selected={selected}
              onToggle={toggle}
              selectionFull={picked.length >= COMPARE_MAX}
              caption={`Runs, page ${state.page} of ${pageCount}, sorted by ${SORT_LABELS[state.sort].toLowerCase()}`}
            />
            <nav aria-label="Pages of runs" className="flex flex-wrap items-end justify-between gap-3">
              <div className="flex items-center gap-3">
                <Button variant="secondary" size="sm" disabled={state.page <= 1} onClick={() => onStateChange({ ...state, page: state.page - 1 })}>
                  Previous page
                </Button>
                <span className="text-foam-300" aria-live="polite">
                  Page {state.page} of {pageCount}
                </span>
                <Button variant="secondary" size="sm" disabled={state.page >= pageCount} onClick={() => onStateChange({ ...state, page: state.page + 1 })}>
                  Next page
                </Button>
              </div>
              <Select
                label="Rows per page"
                hideLabel
                value={String(state.pageSize)}
                options={pageSizeOptions}
                onChange={(e) => onStateChange({ ...state, pageSize: Number(e.target.value), page: 1 })}
                className="w-40"
              />
            </nav>
          </div>
        )}
      </Card>
    </div>
  );
}

function CompareBar({ picked, onClear, onRemove }: { picked: RunSummary[]; onClear: () => void; onRemove: (run: RunSummary) => void }) {
  const ready = picked.length >= COMPARE_MIN;
  return (
    <section aria-label="Runs picked for comparison" className="flex flex-wrap items-center gap-3 rounded-lg border border-ink-700 bg-ink-900 px-5 py-4">
      <p className="text-foam-300" aria-live="polite">
        {picked.length === 0
          ? `Tick two to four finished runs to compare them on the same axes.`
          : `${picked.length} of at most ${COMPARE_MAX} runs picked${ready ? '.' : ': pick at least one more.'}`}
      </p>
      {picked.length > 0 && (
        <ul className="flex flex-wrap gap-2">
          {picked.map((r) => (
            <li key={r.id}>
              <Button variant="secondary" size="sm" onClick={() => onRemove(r)}>
                {r.scenarioName} ({r.seed})<span aria-hidden="true">×</span>
                <span className="sr-only">: remove from the comparison</span>
              </Button>
            </li>
          ))}
        </ul>
      )}
      <div className="ml-auto flex gap-2">
        {picked.length > 0 && (
          <Button variant="ghost" size="sm" onClick={onClear}>
            Clear
          </Button>
        )}
        {ready ? (
          <Link to={paths.compare.withRuns(picked.map((r) => r.id))} className={buttonClasses({ size: 'sm' })}>
            Compare {picked.length} runs
          </Link>
        ) : (
          <Button size="sm" disabled>
            Compare runs
          </Button>
        )}
      </div>
    </section>
  );
}
