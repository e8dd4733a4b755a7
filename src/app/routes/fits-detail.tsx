import { Link, useParams } from 'react-router-dom';
import { PageHeader } from '../../components/ui/page-header.tsx';
import { QueryState } from '../../components/ui/query-state.tsx';
import { paths } from '../../config/paths.ts';
import { useSignedInMe } from '../../features/auth/hooks/use-signed-in-me.ts';
import { ScorecardTable } from '../../features/constraints/components/scorecard-table.tsx';
import { useFit } from '../../features/fits/api/get-fit.ts';
import { FitResults } from '../../features/fits/components/fit-results.tsx';
import { CancelFitControl } from '../../features/fits/components/cancel-fit-control.tsx';
import { ResumeFitButton } from '../../features/fits/components/resume-fit-button.tsx';
import { roleAtLeast } from '../../../shared/contracts/roles.ts';

export function Component() {
  const me = useSignedInMe();
  const { id = '' } = useParams();
  const fit = useFit(me.department.id, id);
  return (
    <QueryState query={fit} loadingLabel="Loading the fit…" errorTitle="The fit could not be loaded">
      {(detail) => (
        <>
          <PageHeader
            eyebrow={<Link to={paths.fits.getHref()}>Fits</Link>}
            title={detail.name}
            description={`“${detail.scenarioName}” against “${detail.constraintSetName}”: ${detail.pointCount.toLocaleString('en-US')} grid points × ${detail.systems.toLocaleString('en-US')} systems, seed “${detail.seed}”, engine ${detail.engineVersion}.`}
          />
          {roleAtLeast(me.role, 'modeller') ? <ResumeFitButton departmentId={me.department.id} fit={detail} /> : null}
          <FitResults
            fit={detail}
            scorecard={(evaluation) => <ScorecardTable evaluation={evaluation} />}
            progressActions={detail.ownerUserId === me.user.id || roleAtLeast(me.role, 'modeller') ? <CancelFitControl departmentId={me.department.id} fit={detail} /> : null}
          />
        </>
      )}
    </QueryState>
  );
}
