import { Link } from 'react-router-dom';
import type { SweepSummary } from '../../../../shared/contracts/sweeps.ts';
import { Badge } from '../../../components/ui/badge.tsx';
import { Card } from '../../../components/ui/card.tsx';
import { EmptyState } from '../../../components/ui/empty-state.tsx';
import { QueryState } from '../../../components/ui/query-state.tsx';
import { Table, type TableColumn } from '../../../components/ui/table.tsx';
import { paths } from '../../../config/paths.ts';
import { formatDateTimeUtc } from '../../../lib/format.ts';
import { useSweeps } from '../api/get-sweeps.ts';
import { parameterTitle } from './sweep-axes.ts';
import { SWEEP_STATUS_TEXT, pointsProgress } from './sweep-text.ts';
import { useScenarioChoices } from '../../../lib/api/scenario-choices.ts';

/** The department's sweeps, newest first; rows update while points complete. */
export function SweepsTable({ departmentId }: { departmentId: string }) {
  const sweeps = useSweeps(departmentId);
  const scenarios = useScenarioChoices(departmentId);
  const scenarioName = (id: string) => scenarios.data?.scenarios.find((s) => s.id === id)?.name ?? 'A removed scenario';

  const columns: TableColumn<SweepSummary>[] = [
    { id: 'name', header: 'Sweep', rowHeader: true, sortValue: (s) => s.name, cell: (s) => <Link to={paths.sweeps.detail.getHref(s.id)}>{s.name}</Link> },
    { id: 'scenario', header: 'Scenario', sortValue: (s) => scenarioName(s.scenarioId), cell: (s) => `${scenarioName(s.scenarioId)} (v${s.scenarioVersion})` },
    { id: 'parameters', header: 'Varies', cell: (s) => s.axes.map((a) => `${parameterTitle(a)}: ${a.values.length} values`).join(' × ') },
    {
      id: 'points',
      header: 'Points',
      align: 'end',
      sortValue: (s) => s.pointCount,
      cell: (s) => <span className="whitespace-nowrap tabular-nums">{pointsProgress(s).text}</span>,
    },
    { id: 'systems', header: 'Systems per point', align: 'end', sortValue: (s) => s.systems, cell: (s) => <span className="tabular-nums">{s.systems.toLocaleString('en-US')}</span> },
    {
      id: 'status',
      header: 'Status',
      sortValue: (s) => s.status,
      cell: (s) => <Badge tone={SWEEP_STATUS_TEXT[s.status].tone}>{SWEEP_STATUS_TEXT[s.status].label}</Badge>,
    },
    { id: 'created', header: 'Created', sortValue: (s) => new Date(s.createdAt), cell: (s) => <span className="whitespace-nowrap">{formatDateTimeUtc(s.createdAt)}</span> },
  ];

  return (
    <Card title="The department’s sweeps" description="Every point of a sweep is a run with the same seed; the table follows them as they finish.">
      <QueryState query={sweeps} loadingLabel="Loading sweeps…" errorTitle="The sweeps could not be loaded">
        {({ sweeps: list }) => (
          <Table
            caption="Sweeps"
            hideCaption
            columns={columns}
            rows={list}
            rowKey={(s) => s.id}
            initialSort={{ columnId: 'created', direction: 'descending' }}
            stackOnNarrow
            empty={<EmptyState title="No sweeps yet">Set one up above: choose a scenario and the parameter to vary.</EmptyState>}
          />
        )}
      </QueryState>
    </Card>
  );
}
