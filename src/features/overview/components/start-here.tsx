import { Link } from 'react-router-dom';
import { roleAtLeast, type Role } from '../../../../shared/contracts/roles.ts';
import { Card } from '../../../components/ui/card.tsx';
import { paths } from '../../../config/paths.ts';
import { useSampleChoices, useScenarioChoices } from '../../../lib/api/scenario-choices.ts';

/**
 * The first steps for a department that has not done them yet: a scenario, a run of it, an
 * observed sample to test it against. Hidden once all three exist.
 */
export function StartHere({ departmentId, role, hasRuns }: { departmentId: string; role: Role; hasRuns: boolean | null }) {
  const scenarios = useScenarioChoices(departmentId);
  const samples = useSampleChoices(departmentId);
  if (!scenarios.data || !samples.data || hasRuns === null) return null;
  const hasScenario = scenarios.data.scenarios.length > 0;
  const hasSample = samples.data.samples.some((s) => !s.library);
  if (hasScenario && hasRuns && hasSample) return null;
  const modeller = roleAtLeast(role, 'modeller');
  const steps = [
    {
      done: hasScenario,
      text: modeller ? 'Build a scenario, starting from one of the documented examples.' : 'A modeller of the department builds the scenarios you run.',
      link: modeller ? { to: paths.scenarios.new.getHref(), label: 'Build a scenario' } : null,
    },
    { done: hasRuns, text: 'Run it: choose the number of systems and a seed; the page follows the run live.', link: hasScenario ? { to: paths.runs.new.getHref(), label: 'Start a run' } : null },
    { done: hasSample, text: 'Record an observed sample (magnetic of total white dwarfs) and test it against the run.', link: { to: paths.samples.new.getHref(), label: 'Record a sample' } },
  ];
  return (
    <Card title="Start here" description="Three steps from an empty department to a tested prediction.">
      <ol className="flex flex-col gap-3">
        {steps.map((step, i) => (
          <li key={step.text} className="flex gap-3">
            <span aria-hidden="true" className={step.done ? 'font-bold text-kelp-300' : 'font-bold text-lantern-300'}>
              {step.done ? '✓' : i + 1}
            </span>
            <span className={step.done ? 'text-foam-400' : 'text-foam-50'}>
              {step.done && <span className="sr-only">Done: </span>}
              {step.text}
              {!step.done && step.link && (
                <>
                  {' '}
                  <Link to={step.link.to} className="whitespace-nowrap">
                    {step.link.label}
                  </Link>
                </>
              )}
            </span>
          </li>
        ))}
      </ol>
    </Card>
  );
}
