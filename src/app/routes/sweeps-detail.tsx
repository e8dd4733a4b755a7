import { Link, useParams, useSearchParams } from 'react-router-dom';
import { roleAtLeast } from '../../../shared/contracts/roles.ts';
import { PageHeader } from '../../components/ui/page-header.tsx';
import { QueryState } from '../../components/ui/query-state.tsx';
import { paths } from '../../config/paths.ts';
import { useSignedInMe } from '../../features/auth/hooks/use-signed-in-me.ts';
import { SweepExportsSection } from '../../features/exports/components/sweep-exports-section.tsx';
import { useSweep } from '../../features/sweeps/api/get-sweep.ts';
import { SweepProgress } from '../../features/sweeps/components/sweep-progress.tsx';
import { SweepResults } from '../../features/sweeps/components/sweep-results.tsx';
import { useSampleChoices, useScenarioChoices } from '../../lib/api/scenario-choices.ts';

export function Component() {
  const me = useSignedInMe();
  const { id = '' } = useParams();
  const [search, setSearch] = useSearchParams();
  const sampleId = search.get('sample');
  const sweep = useSweep(me.department.id, id, sampleId);
  const samples = useSampleChoices(me.department.id);
  const scenarios = useScenarioChoices(me.department.id);

  return (
    <QueryState query={sweep} loadingLabel="Loading the sweep…" errorTitle="The sweep could not be loaded">
      {(detail) => {
        const scenarioName = scenarios.data?.scenarios.find((s) => s.id === detail.scenarioId)?.name ?? 'A removed scenario';
        return (
          <>
            <PageHeader
              eyebrow={<Link to={paths.sweeps.getHref()}>Sweeps</Link>}
              title={detail.name}
              description={`${detail.pointCount} runs of “${scenarioName}”, all with the seed “${detail.seed}”.`}
            />
            <div className="flex flex-col gap-6">
              <SweepProgress departmentId={me.department.id} detail={detail} canCancel={roleAtLeast(me.role, 'modeller')} scenarioName={scenarioName} />
              <SweepResults
                detail={detail}
                samples={samples.data?.samples ?? []}
                sampleId={sampleId}
                updating={sweep.isPlaceholderData}
                onSampleChange={(next) =>
                  setSearch(
                    (current) => {
                      const params = new URLSearchParams(current);
                      if (next) params.set('sample', next);
                      else params.delete('sample');
                      return params;
                    },
                    { replace: true },
                  )
                }
              />
              <SweepExportsSection departmentId={me.department.id} role={me.role} sweepId={detail.id} />
            </div>
          </>
        );
      }}
    </QueryState>
  );
}
