import type { HealthResponse } from '../../../../shared/contracts/auth.ts';
import { Badge } from '../../../components/ui/badge.tsx';
import { Button } from '../../../components/ui/button.tsx';
import { Card } from '../../../components/ui/card.tsx';
import { DescriptionList } from '../../../components/ui/description-list.tsx';
import { QueryState } from '../../../components/ui/query-state.tsx';
import { formatDateTimeUtc } from '../../../lib/format.ts';
import { useHealth } from '../api/get-health.ts';

function HealthReport({ report }: { report: HealthResponse }) {
  const { database } = report;
  return (
    <DescriptionList
      items={[
        {
          term: 'Status',
          description: report.status === 'ok' ? <Badge tone="success">Working</Badge> : <Badge tone="warning">Degraded</Badge>,
        },
        {
          term: 'Database',
          description: database.reachable ? (
            <>
              Reachable
              {database.latencyMs !== undefined && <span className="text-foam-400"> · {Math.round(database.latencyMs)} ms</span>}
            </>
          ) : (
            <span className="text-coral-300">Not reachable</span>
          ),
        },
        { term: 'Version', description: <span className="font-mono">{report.version}</span> },
        { term: 'Server time', description: formatDateTimeUtc(report.time) },
      ]}
    />
  );
}

export function HealthPanel() {
  const health = useHealth();
  return (
    <Card
      title="Service health"
      description="The server and its database, checked every minute."
      actions={
        health.data && (
          <Button variant="secondary" size="sm" onClick={() => void health.refetch()} pending={health.isFetching}>
            Check again
          </Button>
        )
      }
    >
      <QueryState query={health} loadingLabel="Checking the server…" errorTitle="The health check did not answer">
        {(report) => <HealthReport report={report} />}
      </QueryState>
    </Card>
  );
}
