import { useNavigate, useSearchParams } from 'react-router-dom';
import { roleAtLeast } from '../../../shared/contracts/roles.ts';
import { Card } from '../../components/ui/card.tsx';
import { PageHeader } from '../../components/ui/page-header.tsx';
import { paths } from '../../config/paths.ts';
import { useSignedInMe } from '../../features/auth/hooks/use-signed-in-me.ts';
import { RunCostNotice } from '../../features/billing/components/run-cost-notice.tsx';
import { ImpliedAnswer } from '../../features/implied/components/implied-answer.tsx';
import { ImpliedForm } from '../../features/implied/components/implied-form.tsx';
import { useSampleChoices } from '../../lib/api/scenario-choices.ts';

const SETTING_WORDS = { single: 'single white dwarfs', detachedCompanion: 'white dwarfs with a detached companion' } as const;

export function Component() {
  const me = useSignedInMe();
  const navigate = useNavigate();
  const [search] = useSearchParams();
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
        description="The observer’s question: given a scenario and the magnetic white dwarfs you counted, how common may companions be? The answer is the range of a multiplier on the scenario’s companion occurrence that your counts allow, at 68% and 95%."
      />
      <div className="flex flex-col gap-6">
        <Card title="Ask" description="One run of the scenario is enough: the kernel tallies the magnetic fraction at every multiplier with the same random numbers.">
          <ImpliedForm
            departmentId={me.department.id}
            limitSystems={!roleAtLeast(me.role, 'modeller')}
            onStarted={(run, sampleOf) => navigate(paths.impliedOccurrence.withRun(run, sampleOf))}
            renderCost={(systems) =>
              systems === null || !Number.isInteger(systems) || systems < 1e3 || systems > 1e10 ? (
                <p className="text-foam-300">Choose a scenario and a valid number of systems to see what the run costs.</p>
              ) : (
                <RunCostNotice departmentId={me.department.id} systems={systems} />
              )
            }
          />
        </Card>
        {runId && sampleId && <ImpliedAnswer key={`${runId}-${sampleId}`} departmentId={me.department.id} runId={runId} sampleId={sampleId} settingCaveat={settingCaveat} />}
      </div>
    </>
  );
}
