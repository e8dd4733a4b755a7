import { useId, type ReactNode } from 'react';
import { Link } from 'react-router-dom';
import type { RunSummary } from '../../../../shared/contracts/runs.ts';
import { fractionOrLimitText } from '../../../../shared/engine/stats/fraction-text.ts';
import { SortableHeaderCell } from '../../../components/ui/table.tsx';
import { paths } from '../../../config/paths.ts';
import { cx } from '../../../lib/class-names.ts';
import { formatDate, formatDateTimeUtc } from '../../../lib/format.ts';
import type { RunListState } from './run-list-params.ts';
import { RunStatusBadge } from './run-status-badge.tsx';
import { formatCount } from './run-text.ts';

type SortField = RunListState['sort'];

export interface RunsTableProps {
  runs: readonly RunSummary[];
  state: RunListState;
  onSort: (field: SortField) => void;
  selected: ReadonlySet<string>;
  onToggle: (run: RunSummary) => void;
  /** No more runs can be added to the comparison. */
  selectionFull: boolean;
  caption: string;
}

/** The fraction with its Monte Carlo error; the 95% upper limit when no magnetic white dwarf was drawn. */
export function fractionText(run: Pick<RunSummary, 'fraction' | 'fractionSe' | 'magnetic' | 'whiteDwarfs'>): string {
  if (run.fraction === null || run.fractionSe === null) return '—';
  return fractionOrLimitText(run.magnetic ?? 0, run.whiteDwarfs ?? 0, run.fractionSe) ?? '—';
}

function runName(run: RunSummary): string {
  return `${run.scenarioName}, ${formatDateTimeUtc(run.createdAt)}`;
}

interface Column {
  id: string;
  header: string;
  sort?: SortField;
  align?: 'end';
  cell: (run: RunSummary) => ReactNode;
}

/**
 * The department's runs, sorted by the server (the table shows one page of many), with a
 * checkbox on each finished run to pick two to four for comparison. Below 768 px each run is a
 * card instead of a row.
 */
export function RunsTable({ runs, state, onSort, selected, onToggle, selectionFull, caption }: RunsTableProps) {
  const captionId = useId();
  const direction = (field?: SortField) =>
    field && state.sort === field ? (state.order === 'asc' ? 'ascending' : 'descending') : 'none';

  const columns: Column[] = [
    { id: 'status', header: 'Status', sort: 'status', cell: (r) => <RunStatusBadge status={r.status} progress={r.progress} /> },
    {
      id: 'scenario',
      header: 'Scenario',
      sort: 'scenarioName',
      cell: (r) => (
        <span className="flex min-w-40 flex-col">
          <Link to={paths.runs.detail.getHref(r.id)} className="font-bold">
            {r.scenarioName}
            <span className="sr-only">, run of {formatDateTimeUtc(r.createdAt)}</span>
          </Link>
          <span className="text-sm text-foam-400">
            version {r.scenarioVersion} · seed “{r.seed}”
          </span>
        </span>
      ),
    },
    { id: 'systems', header: 'Systems', sort: 'systems', align: 'end', cell: (r) => formatCount(r.systems) },
    {
      id: 'fraction',
      header: 'Fraction ± MC error',
      sort: 'fraction',
      align: 'end',
      cell: (r) => <span className="whitespace-nowrap">{fractionText(r)}</span>,
    },
    { id: 'owner', header: 'Who', cell: (r) => <span className="inline-block max-w-44">{r.ownerName}</span> },
    {
      id: 'when',
      header: 'Started',
      sort: 'createdAt',
      cell: (r) => (
        <span className="inline-flex flex-col whitespace-nowrap max-md:flex-row max-md:gap-2">
          <span>{formatDate(r.createdAt)}</span>
          <span className="text-sm text-foam-400">{r.createdAt.slice(11, 16)} UTC</span>
        </span>
      ),
    },
  ];

  const checkbox = (r: RunSummary) => {
    const finished = r.status === 'succeeded';
    const isSelected = selected.has(r.id);
    return (
      <input
        type="checkbox"
        className="size-5 cursor-pointer accent-lantern-400 disabled:cursor-not-allowed"
        checked={isSelected}
        disabled={!finished || (selectionFull && !isSelected)}
        onChange={() => onToggle(r)}
        aria-label={`Compare ${runName(r)}`}
        title={finished ? undefined : 'Only finished runs can be compared'}
      />
    );
  };

  return (
    <>
      <div role="region" aria-labelledby={captionId} tabIndex={0} className="overflow-x-auto rounded-md border border-ink-700 max-md:hidden">
        <table className="w-full border-collapse text-left">
          <caption id={captionId} className="sr-only">
            {caption}
          </caption>
          <thead className="bg-ink-800 text-foam-300">
            <tr>
              <th scope="col" className="w-10 py-3 pr-1 pl-4">
                <span className="sr-only">Compare</span>
              </th>
              {columns.map((c) =>
                c.sort ? (
                  <SortableHeaderCell key={c.id} align={c.align === 'end' ? 'end' : 'start'} direction={direction(c.sort)} onSort={() => onSort(c.sort!)}>
                    {c.header}
                  </SortableHeaderCell>
                ) : (
                  <th key={c.id} scope="col" className={cx('px-4 py-3 font-bold', c.align === 'end' && 'text-right')}>
                    {c.header}
                  </th>
                ),
              )}
            </tr>
          </thead>
          <tbody>
            {runs.map((r) => (
              <tr key={r.id} className={cx('border-t border-ink-700 hover:bg-ink-800/60', selected.has(r.id) && 'bg-lantern-400/8')}>
                <td className="py-3 pr-1 pl-4">{checkbox(r)}</td>
                {columns.map((c) => {
                  const Cell = c.id === 'scenario' ? 'th' : 'td';
                  return (
                    <Cell key={c.id} scope={c.id === 'scenario' ? 'row' : undefined} className={cx('px-3 py-3 align-middle font-normal', c.align === 'end' && 'text-right tabular-nums')}>
                      {c.cell(r)}
                    </Cell>
                  );
                })}
              </tr>
            ))}
          </tbody>
        </table>
      </div>

      <ul aria-label={caption} className="flex flex-col gap-3 md:hidden">
        {runs.map((r) => (
          <li key={r.id} className={cx('rounded-md border border-ink-700 bg-ink-900 p-4', selected.has(r.id) && 'border-lantern-400/60')}>
            <div className="flex items-start gap-3">
              <div className="pt-1">{checkbox(r)}</div>
              <div className="flex min-w-0 flex-1 flex-col gap-1">
                <div className="flex flex-wrap items-center justify-between gap-2">
                  {columns[1].cell(r)}
                  {columns[0].cell(r)}
                </div>
                <dl className="mt-1 flex flex-col gap-1 text-sm">
                  {columns.slice(2).map((c) => (
                    <div key={c.id} className="flex flex-wrap items-baseline justify-between gap-x-4">
                      <dt className="text-foam-400">{c.header}</dt>
                      <dd className="ml-auto min-w-0 text-right tabular-nums">{c.cell(r)}</dd>
                    </div>
                  ))}
                </dl>
              </div>
            </div>
          </li>
        ))}
      </ul>
    </>
  );
}
