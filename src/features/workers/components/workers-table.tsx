import type { WorkerStatus, WorkersResponse } from '../../../../shared/contracts/workers.ts';
import { Card } from '../../../components/ui/card.tsx';
import { QueryState } from '../../../components/ui/query-state.tsx';
import { Table, type TableColumn } from '../../../components/ui/table.tsx';
import { formatDateTimeUtc } from '../../../lib/format.ts';
import { useWorkers } from '../api/get-workers.ts';

const COLUMNS: readonly TableColumn<WorkerStatus>[] = [
  { id: 'host', header: 'Machine', cell: (w) => `${w.host} (pid ${w.pid})`, sortValue: (w) => w.host, rowHeader: true },
  { id: 'threads', header: 'Threads', cell: (w) => w.threads, sortValue: (w) => w.threads, align: 'end' },
  { id: 'active', header: 'Jobs running', cell: (w) => w.activeJobs, sortValue: (w) => w.activeJobs, align: 'end' },
  { id: 'done', header: 'Jobs done', cell: (w) => w.jobsDone.toLocaleString('en-US'), sortValue: (w) => w.jobsDone, align: 'end' },
  { id: 'started', header: 'Started (UTC)', cell: (w) => formatDateTimeUtc(w.startedAt), sortValue: (w) => w.startedAt },
  { id: 'seen', header: 'Last heard (UTC)', cell: (w) => formatDateTimeUtc(w.lastSeenAt), sortValue: (w) => w.lastSeenAt },
];

function Explanation({ data }: { data: WorkersResponse }) {
  if (data.mode === 'embedded') {
    return <p className="text-foam-300">Runs are computed on this server&apos;s own worker threads (no REDIS_URL is set). A job is a batch of chunks of 65,536 systems.</p>;
  }
  return (
    <p className="text-foam-300">
      Runs are computed by <code>npm run worker</code> processes that take jobs from Redis. A worker that stops sending its heartbeat drops off this list
      within seconds; jobs it had not finished go to another worker.
    </p>
  );
}

/** Connected compute workers with their threads and jobs, refreshed every few seconds. */
export function WorkersTable() {
  const workers = useWorkers();
  return (
    <QueryState query={workers} loadingLabel="Asking the workers…" errorTitle="The worker list could not be read">
      {(data) => (
        <Card className="space-y-4">
          <Explanation data={data} />
          <Table
            caption={data.mode === 'embedded' ? 'The embedded worker pool' : 'Connected workers'}
            columns={COLUMNS}
            rows={data.workers}
            rowKey={(w) => w.id}
            empty={<p>No worker is connected: runs wait in the queue until one starts (<code>REDIS_URL=… npm run worker</code>).</p>}
          />
        </Card>
      )}
    </QueryState>
  );
}
