import { Link } from 'react-router-dom';
import { Card } from '../../../components/ui/card.tsx';
import { EmptyState } from '../../../components/ui/empty-state.tsx';
import { QueryState } from '../../../components/ui/query-state.tsx';
import { Select } from '../../../components/ui/select.tsx';
import { paths } from '../../../config/paths.ts';
import { formatDate } from '../../../lib/format.ts';
import { useRunComparison } from '../api/get-run-comparison.ts';
import { useRuns } from '../api/get-runs.ts';
import { ComparisonBody } from './sample-comparison-card.tsx';
import { fractionText } from './runs-table.tsx';

export interface SampleTestCardProps {
  departmentId: string;
  sampleId: string;
  /** From the address bar (?run=…); null until a run is picked. */
  runId: string | null;
  onRunChange: (runId: string) => void;
}

/** A sample tested against a finished run of the user's choice: the same test as on the run page. */
export function SampleTestCard({ departmentId, sampleId, runId, onRunChange }: SampleTestCardProps) {
  const runs = useRuns(departmentId, { status: 'succeeded', pageSize: 100, sort: 'createdAt', order: 'desc' });
  const chosen = runId && runs.data?.runs.some((r) => r.id === runId) ? runId : null;
  const comparison = useRunComparison(departmentId, chosen ?? '', chosen ? sampleId : null);
  return (
    <Card title="Test against a run" description="Pick a finished run: the sample is tested against its prediction exactly as on the run’s own page (exact binomial test for counts, Gaussian for a published value).">
      <QueryState query={runs} loadingLabel="Loading the finished runs…" errorTitle="The runs could not be loaded">
        {(data) =>
          data.runs.length === 0 ? (
            <EmptyState title="No finished run yet" headingLevel={3} action={<Link to={paths.runs.new.getHref()}>Start a run</Link>}>
              A test needs a run’s prediction. Start one from any scenario; it appears here when it has finished.
            </EmptyState>
          ) : (
            <div className="flex flex-col gap-5">
              <Select
                label="Run"
                value={chosen ?? ''}
                onChange={(event) => event.target.value && onRunChange(event.target.value)}
                options={[
                  { value: '', label: 'Choose a finished run…' },
                  ...data.runs.map((r) => ({ value: r.id, label: `${r.scenarioName} · ${fractionText(r)} · ${formatDate(r.createdAt)}` })),
                ]}
                hint="The department’s finished runs, newest first."
                className="max-w-2xl"
              />
              {chosen && (
                <>
                  <p>
                    <Link to={`${paths.runs.detail.getHref(chosen)}?sample=${encodeURIComponent(sampleId)}`}>Open this test on the run’s page</Link>
                  </p>
                  <QueryState query={comparison} loadingLabel="Testing the sample against the run…" errorTitle="The test could not be made">
                    {(result) => <ComparisonBody comparison={result} />}
                  </QueryState>
                </>
              )}
            </div>
          )
        }
      </QueryState>
    </Card>
  );
}
