import { useNavigate, useSearchParams } from 'react-router-dom';
import { IMPLIED_GRID_POINTS } from '../../../shared/contracts/implied-occurrence.ts';
import { listPriceCredits } from '../../../shared/contracts/pricing.ts';
import { roleAtLeast } from '../../../shared/contracts/roles.ts';
import { Card } from '../../components/ui/card.tsx';
import { PageHeader } from '../../components/ui/page-header.tsx';
import { paths } from '../../config/paths.ts';
import { useSignedInMe } from '../../features/auth/hooks/use-signed-in-me.ts';
import { formatCredits } from '../../features/billing/components/amounts.ts';
import { RunCostNotice } from '../../features/billing/components/run-cost-notice.tsx';
import { CancelFitControl } from '../../features/fits/components/cancel-fit-control.tsx';
import { ImpliedAnswer, ImpliedFitAnswer } from '../../features/implied/components/implied-answer.tsx';
import { ImpliedForm } from '../../features/implied/components/implied-form.tsx';
import { useSampleChoices } from '../../lib/api/scenario-choices.ts';

const SETTING_WORDS = { single: 'single white dwarfs', detachedCompanion: 'white dwarfs with a detached companion' } as const;

export function Component() {
  const me = useSignedInMe();
  const navigate = useNavigate();
  const [search] = useSearchParams();
  const fitId = search.get('fit');
  const runId = search.get('run');
  const sampleId = search.get('sample');
  const samples = useSampleChoices(me.department.id);
  const sample = samples.data?.samples.find((s) => s.id === sampleId);
  const settingCaveat =
    sample && sample.setting !== 'all'
      ? `“${sample.name}” counts ${SETTING_WORDS[sample.setting]} only, while the curve is the fraction among all white dwarfs of the scenario; read the range with that in mind.`
      : null;

  return (
    <>
      <PageHeader
        eyebrow={me.department.name}
        title="Implied occurrence"
        description="The observer’s question: given a scenario and the magnetic white dwarfs you counted, how common may companions be? The answer is a multiplier on the scenario’s companion occurrence, found by a one-parameter fit: the range your counts allow by the exact binomial test (a confidence range) and the fit’s posterior (a credible interval), each at 68% and 95%."
      />
      <div className="flex flex-col gap-6">
        <Card
          title="Ask"
          description={`A fit over the multiplier m from 0 to the largest value the occurrence table allows, on ${IMPLIED_GRID_POINTS} values in one pass over the same random numbers, with a uniform prior on m.`}
        >
          <ImpliedForm
            departmentId={me.department.id}
            limitSystems={!roleAtLeast(me.role, 'modeller')}
            onStarted={(fit) => navigate(paths.impliedOccurrence.withFit(fit))}
            renderCost={(systems) =>
              systems === null || !Number.isInteger(systems) || systems < 1e3 || systems > 1e10 ? (
                <p className="text-foam-300">Choose a scenario and a valid number of systems to see what the run costs.</p>
              ) : (
                <div className="flex flex-col gap-2">
                  <RunCostNotice departmentId={me.department.id} systems={systems * IMPLIED_GRID_POINTS} runs={1} />
                  <p className="text-sm text-foam-400">
                    Like any fit, credit is reserved for every value of m: {IMPLIED_GRID_POINTS} × {systems.toLocaleString('en-US')} systems ={' '}
                    {(IMPLIED_GRID_POINTS * systems).toLocaleString('en-US')} systems (at list price {formatCredits(listPriceCredits(IMPLIED_GRID_POINTS * systems))}); refunded if the fit fails or is cancelled.
                  </p>
                </div>
              )
            }
          />
        </Card>
        {fitId && (
          <ImpliedFitAnswer
            key={fitId}
            departmentId={me.department.id}
            fitId={fitId}
            progressActions={(a) =>
              a.ownerUserId === me.user.id || roleAtLeast(me.role, 'modeller') ? (
                <CancelFitControl departmentId={me.department.id} fit={{ id: a.fitId, status: a.status, progress: a.progress, costCredits: a.costCredits }} label="Cancel the question" />
              ) : null
            }
          />
        )}
        {!fitId && runId && sampleId && <ImpliedAnswer key={`${runId}-${sampleId}`} departmentId={me.department.id} runId={runId} sampleId={sampleId} settingCaveat={settingCaveat} />}
      </div>
    </>
  );
}
