import { Link, useNavigate, useSearchParams } from 'react-router-dom';
import { runLetter } from '../../components/charts/result-series.ts';
import { EmptyState } from '../../components/ui/empty-state.tsx';
import { PageHeader } from '../../components/ui/page-header.tsx';
import { paths } from '../../config/paths.ts';
import { useSignedInMe } from '../../features/auth/hooks/use-signed-in-me.ts';
import { COMPARE_MAX_RUNS, COMPARE_MIN_RUNS, runIdsFrom } from '../../features/compare/components/compare-text.ts';
import { CompareView } from '../../features/compare/components/compare-view.tsx';
import { CompareScorecards } from '../../features/constraints/components/compare-scorecards.tsx';

export function Component() {
  const me = useSignedInMe();
  const [search] = useSearchParams();
  const navigate = useNavigate();
  const runIds = runIdsFrom(search.get('runs'));
  const usable = runIds.length >= COMPARE_MIN_RUNS && runIds.length <= COMPARE_MAX_RUNS;

  return (
    <>
      <PageHeader
        eyebrow={me.department.name}
        title="Compare runs"
        description="Two to four finished runs side by side on the same axes, each with its Monte Carlo error."
      />
      {usable ? (
        <div className="flex flex-col gap-6">
          <CompareView
            key={runIds.join(',')}
            departmentId={me.department.id}
            runIds={runIds}
            onRemove={(id) => navigate(paths.compare.withRuns(runIds.filter((r) => r !== id)), { replace: true })}
          />
          <CompareScorecards departmentId={me.department.id} runs={runIds.map((id, i) => ({ id, name: `Run ${runLetter(i)}` }))} />
        </div>
      ) : (
        <EmptyState
          title={runIds.length > COMPARE_MAX_RUNS ? `At most ${COMPARE_MAX_RUNS} runs at a time` : 'Pick the runs to compare'}
          action={<Link to={paths.runs.getHref()}>Go to the runs</Link>}
        >
          In the runs table, tick two to four finished runs and press Compare.
        </EmptyState>
      )}
    </>
  );
}
