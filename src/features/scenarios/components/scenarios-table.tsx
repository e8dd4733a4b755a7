import type { ReactNode } from 'react';
import { Link } from 'react-router-dom';
import type { ScenarioSummary } from '../../../../shared/contracts/scenarios-api.ts';
import { EmptyState } from '../../../components/ui/empty-state.tsx';
import { QueryState } from '../../../components/ui/query-state.tsx';
import { Table, type TableColumn } from '../../../components/ui/table.tsx';
import { paths } from '../../../config/paths.ts';
import { formatDate } from '../../../lib/format.ts';
import { useScenarios } from '../api/get-scenarios.ts';

const columns: TableColumn<ScenarioSummary>[] = [
  {
    id: 'name',
    header: 'Name',
    rowHeader: true,
    sortValue: (s) => s.name.toLowerCase(),
    cell: (s) => (
      <span className="flex flex-col">
        <Link to={paths.scenarios.detail.getHref(s.id)}>{s.name}</Link>
        {s.title && s.title !== s.name && <span className="text-sm text-foam-400">{s.title}</span>}
      </span>
    ),
  },
  { id: 'version', header: 'Version', align: 'end', sortValue: (s) => s.currentVersion, cell: (s) => <span className="tabular-nums">{s.currentVersion}</span> },
  { id: 'owner', header: 'Owner', sortValue: (s) => s.ownerName, cell: (s) => s.ownerName },
  {
    id: 'hash',
    header: 'Document',
    cell: (s) => (
      <code className="font-mono text-sm text-foam-300" title={`Scenario hash ${s.documentHash}`}>
        {s.documentHash.slice(0, 10)}
      </code>
    ),
  },
  { id: 'updated', header: 'Changed', sortValue: (s) => new Date(s.updatedAt), cell: (s) => <span className="whitespace-nowrap">{formatDate(s.updatedAt)}</span> },
];

/** The department's scenarios, newest change first; `emptyAction` gets a modeller going. */
export function ScenariosTable({ departmentId, emptyAction }: { departmentId: string; emptyAction?: ReactNode }) {
  const scenarios = useScenarios(departmentId);
  return (
    <QueryState query={scenarios} loadingLabel="Loading scenarios…" errorTitle="The scenarios could not be loaded">
      {(data) => (
        <Table
          caption="The department’s scenarios"
          hideCaption
          columns={columns}
          rows={data.scenarios}
          rowKey={(s) => s.id}
          initialSort={{ columnId: 'updated', direction: 'descending' }}
          stackOnNarrow
          empty={
            <EmptyState title="No scenarios yet" action={emptyAction}>
              A scenario describes a population of white-dwarf progenitors and their companions. Start from one of the examples.
            </EmptyState>
          }
        />
      )}
    </QueryState>
  );
}
