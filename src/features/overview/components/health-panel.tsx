import { Badge } from '../../../components/ui/badge.tsx';
import { Button } from '../../../components/ui/button.tsx';
import { Card } from '../../../components/ui/card.tsx';
import { DescriptionList } from '../../../components/ui/description-list.tsx';
import { ErrorState } from '../../../components/ui/error-state.tsx';
import { LoadingState } from '../../../components/ui/loading-state.tsx';
import { formatDateTimeUtc } from '../../../lib/format.ts';
import { useHealth } from '../api/get-health.ts';

export function HealthPanel() {
  const health = useHealth();
  const refetch = () => void health.refetch();

  return (
    <Card
      title="Service health"
      description="The server and its database, checked every minute."
      actions={
        health.data && (
          <Button variant="secondary" size="sm" onClick={refetch} pending={health.isFetching}>
            Check again
          </Button>
        )
      }
    >
      {health.isPending ? (
        <LoadingState label="Checking the server…" />
      ) : health.isError ? (
        <ErrorState error={health.error} title="The health check did not answer" onRetry={refetch} retrying={health.isFetching} />
      ) : (
        <DescriptionList
          items={[
            {
              term: 'Status',
              description:
                health.data.status === 'ok' ? <Badge tone="success">Working</Badge> : <Badge tone="warning">Degraded</Badge>,
            },
            {
              term: 'Database',
              description: health.data.database.reachable ? (
                <>
                  Reachable
                  {health.data.database.latencyMs !== undefined && (
                    <span className="text-foam-400"> · {Math.round(health.data.database.latencyMs)} ms</span>
                  )}
                </>
              ) : (
                <span className="text-coral-300">Not reachable{health.data.database.error && `: ${health.data.database.error}`}</span>
              ),
            },
            { term: 'Version', description: <span className="font-mono">{health.data.version}</span> },
            { term: 'Server time', description: formatDateTimeUtc(health.data.time) },
          ]}
        />
      )}
    </Card>
  );
}
