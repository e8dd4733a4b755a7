import { useEffect, useMemo, useState } from 'react';
import { Link } from 'react-router-dom';
import { z } from 'zod';
import type { Role } from '../../../../shared/contracts/roles.ts';
import { runAgainBodySchema } from '../../../../shared/contracts/runs.ts';
import { sweepPointText } from '../../../../shared/contracts/sweep-point.ts';
import { Alert } from '../../../components/ui/alert.tsx';
import { Button } from '../../../components/ui/button.tsx';
import { QueryState } from '../../../components/ui/query-state.tsx';
import { NumberField, TextField } from '../../../components/ui/text-field.tsx';
import { paths } from '../../../config/paths.ts';
import { useSchemaForm } from '../../../hooks/use-schema-form.ts';
import { useRun } from '../api/get-run.ts';
import { useRunAgain } from '../api/run-again.ts';
import { formatCount, parseSystemsInput } from './run-text.ts';
import { observerCapMessage, prefilledSystems, systemsCapFor, withSystemsCap } from './systems-cap.ts';

const runAgainFormSchema = z.strictObject({
  systems: z.string().transform((text) => parseSystemsInput(text) ?? undefined).pipe(runAgainBodySchema.shape.systems),
  seed: z.string().transform((text) => text.trim() || undefined).pipe(runAgainBodySchema.shape.seed),
});

export interface RunAgainFormProps {
  departmentId: string;
  role: Role;
  runId: string;
  onSystemsChange: (systems: number | null) => void;
  onStarted: (runId: string) => void;
}

/** Runs a run's own scenario document again: for a sweep's point, the base scenario at the point's values. */
export function RunAgainForm({ departmentId, role, runId, onSystemsChange, onStarted }: RunAgainFormProps) {
  const run = useRun(departmentId, runId);
  return (
    <QueryState query={run} loadingLabel="Loading the run…" errorTitle="The run to repeat could not be loaded">
      {(r) => <AgainForm key={r.id} departmentId={departmentId} role={role} run={r} onSystemsChange={onSystemsChange} onStarted={onStarted} />}
    </QueryState>
  );
}

function AgainForm({ departmentId, role, run, onSystemsChange, onStarted }: Omit<RunAgainFormProps, 'runId'> & { run: NonNullable<ReturnType<typeof useRun>['data']> }) {
  const cap = systemsCapFor(role);
  const [systemsText, setSystemsText] = useState(() => prefilledSystems(run.systems, cap));
  const again = useRunAgain(departmentId, run.id);
  const schema = useMemo(() => withSystemsCap(runAgainFormSchema, cap), [cap]);
  const form = useSchemaForm(schema, async (values) => {
    const { id } = await again.mutateAsync(values);
    onStarted(id);
  });
  const parsed = parseSystemsInput(systemsText);
  const valid = runAgainBodySchema.shape.systems.safeParse(parsed ?? undefined);
  useEffect(() => onSystemsChange(valid.success && valid.data !== undefined ? valid.data : null), [valid.success, valid.data, onSystemsChange]);
  const overCap = cap !== null && parsed !== null && Number.isFinite(parsed) && parsed > cap;
  const point = run.sweepPoint ?? null;

  return (
    <form {...form.formProps} aria-label="Run again" className="flex flex-col gap-5">
      <Alert message={form.formError} />
      <div className="rounded-md border border-ink-700 bg-ink-900 p-4">
        {point ? (
          <>
            <p className="font-bold text-foam-50">
              Point {point.number} of {point.pointCount} of the sweep <Link to={paths.sweeps.detail.getHref(point.sweepId)}>{point.sweepName}</Link>
            </p>
            <p className="text-foam-300">
              {run.scenarioName} at {sweepPointText(point.values)}: the point’s own scenario document, exactly as the sweep ran it.
            </p>
          </>
        ) : (
          <p className="text-foam-300">
            The scenario document of <Link to={paths.runs.detail.getHref(run.id)}>the run of {run.scenarioName}</Link>, exactly as it ran (version {run.scenarioVersion}).
          </p>
        )}
      </div>
      <NumberField
        label="Systems"
        name="systems"
        unit="primaries"
        value={systemsText}
        onChange={(event) => setSystemsText(event.target.value)}
        error={form.fieldErrors.systems ?? (overCap ? observerCapMessage(parsed) : undefined)}
        hint={
          cap === null
            ? `1,000 to 10,000,000,000 (10^10). The run had ${formatCount(run.systems)}.`
            : `1,000 to ${formatCount(cap)}, the most an observer may start. The run had ${formatCount(run.systems)}.`
        }
      />
      <TextField
        label="Seed"
        name="seed"
        defaultValue={run.seed}
        maxLength={200}
        autoComplete="off"
        spellCheck={false}
        error={form.fieldErrors.seed}
        hint="The same seed and size reproduce the run’s counts exactly; another seed gives an independent run."
      />
      <div>
        <Button type="submit" pending={form.submitting}>
          {point ? 'Run this point again' : 'Run again'}
        </Button>
      </div>
    </form>
  );
}
