import { useEffect, useMemo, useState } from 'react';
import { Link } from 'react-router-dom';
import { z } from 'zod';
import type { Role } from '../../../../shared/contracts/roles.ts';
import { createRunBodySchema } from '../../../../shared/contracts/runs.ts';
import { Alert } from '../../../components/ui/alert.tsx';
import { Button } from '../../../components/ui/button.tsx';
import { EmptyState } from '../../../components/ui/empty-state.tsx';
import { ErrorState } from '../../../components/ui/error-state.tsx';
import { LoadingState } from '../../../components/ui/loading-state.tsx';
import { Select } from '../../../components/ui/select.tsx';
import { NumberField, TextField } from '../../../components/ui/text-field.tsx';
import { paths } from '../../../config/paths.ts';
import { useSchemaForm } from '../../../hooks/use-schema-form.ts';
import { useCreateRun } from '../api/create-run.ts';
import { formatCount, parseSystemsInput } from './run-text.ts';
import { observerCapMessage, prefilledSystems, systemsCapFor, withSystemsCap } from './systems-cap.ts';
import { useScenarioChoice, useScenarioChoices } from '../../../lib/api/scenario-choices.ts';

const { systems, seed } = createRunBodySchema.shape;

/** The form's text inputs read into the run request; the checks and messages are the contract's. */
export const startRunFormSchema = z.strictObject({
  scenarioId: z.string().min(1, { error: 'Choose a scenario to run' }).pipe(createRunBodySchema.shape.scenarioId),
  systems: z.string().transform((text) => parseSystemsInput(text) ?? undefined).pipe(systems),
  seed: z.string().transform((text) => text.trim() || undefined).pipe(seed),
});

/** A valid run size from the systems box, or null. */
function validSystems(text: string): number | null {
  const parsed = systems.safeParse(parseSystemsInput(text) ?? undefined);
  return parsed.success && parsed.data !== undefined ? parsed.data : null;
}

export interface StartRunFormProps {
  departmentId: string;
  role: Role;
  /** From ?scenario=… */
  initialScenarioId: string | null;
  /** The run size as typed, for the cost notice beside the form (null while it is not a valid size). */
  onSystemsChange: (systems: number | null) => void;
  onStarted: (runId: string) => void;
}

export function StartRunForm({ departmentId, role, initialScenarioId, onSystemsChange, onStarted }: StartRunFormProps) {
  const scenarios = useScenarioChoices(departmentId);
  const [scenarioId, setScenarioId] = useState(initialScenarioId ?? '');
  const scenario = useScenarioChoice(departmentId, scenarioId || null);
  const [systemsText, setSystemsText] = useState('');
  const [seedText, setSeedText] = useState('');
  const create = useCreateRun(departmentId);
  const cap = systemsCapFor(role);
  const schema = useMemo(() => withSystemsCap(startRunFormSchema, cap), [cap]);
  const form = useSchemaForm(schema, async (values) => {
    const { id } = await create.mutateAsync(values);
    onStarted(id);
  });

  // A newly chosen scenario brings its own systems and seed as the defaults.
  // Only when the chosen scenario (or its version) changes: a background refetch of the same
  // scenario must not overwrite what the user has typed.
  const resolved = scenario.data?.resolved as { systems?: number; seed?: string; description?: string } | undefined;
  const defaultsKey = scenario.data ? `${scenario.data.id}@${scenario.data.currentVersion}` : null;
  useEffect(() => {
    if (!defaultsKey || !resolved) return;
    setSystemsText(prefilledSystems(resolved.systems, cap));
    setSeedText(resolved.seed ?? '');
    // eslint-disable-next-line react-hooks/exhaustive-deps -- keyed on the scenario, not the object identity
  }, [defaultsKey]);

  useEffect(() => onSystemsChange(validSystems(systemsText)), [systemsText, onSystemsChange]);

  if (scenarios.isPending) return <LoadingState label="Loading scenarios…" />;
  if (scenarios.isError) {
    return <ErrorState error={scenarios.error} title="The scenarios could not be loaded" onRetry={() => void scenarios.refetch()} retrying={scenarios.isFetching} />;
  }
  const list = scenarios.data.scenarios;
  if (list.length === 0) {
    return (
      <EmptyState title="No scenarios to run yet" action={<Link to={paths.scenarios.getHref()}>Build a scenario</Link>}>
        A run draws the population a scenario describes. Build one first, from a preset or from scratch.
      </EmptyState>
    );
  }
  const unknownScenario = scenarioId !== '' && !list.some((s) => s.id === scenarioId);
  const options = [{ value: '', label: 'Choose a scenario…' }, ...list.map((s) => ({ value: s.id, label: `${s.name} (version ${s.currentVersion})` }))];
  const parsedSystems = parseSystemsInput(systemsText);
  // Checked as it is typed, so that the limit shows at the field before Start is pressed.
  const overCap = cap !== null && parsedSystems !== null && Number.isFinite(parsedSystems) && parsedSystems > cap;

  return (
    <form {...form.formProps} aria-label="Start a run" className="flex flex-col gap-5">
      <Alert message={form.formError} />
      {unknownScenario && <Alert message="The scenario in the link does not exist in this department (or was deleted). Choose another." />}
      <Select
        label="Scenario"
        name="scenarioId"
        value={unknownScenario ? '' : scenarioId}
        options={options}
        onChange={(event) => setScenarioId(event.target.value)}
        error={form.fieldErrors.scenarioId}
        hint={resolved?.description ?? 'The run uses the scenario’s current version; later edits make new versions and do not touch this run.'}
      />
      {scenario.isError && <ErrorState error={scenario.error} title="The scenario could not be loaded" onRetry={() => void scenario.refetch()} />}
      <fieldset disabled={!scenarioId || unknownScenario || scenario.isPending} className="flex flex-col gap-5">
        <legend className="sr-only">Run size and seed</legend>
        <NumberField
          label="Systems"
          name="systems"
          unit="primaries"
          value={systemsText}
          onChange={(event) => setSystemsText(event.target.value)}
          error={form.fieldErrors.systems ?? (overCap ? observerCapMessage(parsedSystems) : undefined)}
          hint={
            <>
              {cap === null
                ? 'How many primary stars to draw: 1,000 to 10,000,000,000 (10^10); “1e7” or “10^7” also work.'
                : `How many primary stars to draw: 1,000 to ${formatCount(cap)}, the most an observer may start; “1e6” or “10^6” also work.`}
              {parsedSystems !== null && Number.isFinite(parsedSystems) && parsedSystems >= 1000 && ` Reads as ${formatCount(parsedSystems)}.`}
            </>
          }
        />
        <TextField
          label="Seed"
          name="seed"
          value={seedText}
          onChange={(event) => setSeedText(event.target.value)}
          maxLength={200}
          autoComplete="off"
          spellCheck={false}
          error={form.fieldErrors.seed}
          hint="Any text. The same seed, scenario and engine version reproduce the run’s counts exactly."
        />
      </fieldset>
      <div>
        <Button type="submit" pending={form.submitting} disabled={!scenarioId || unknownScenario}>
          Start the run
        </Button>
      </div>
    </form>
  );
}
