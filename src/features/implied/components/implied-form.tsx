import { useMemo, useState, type ReactNode } from 'react';
import { z } from 'zod';
import { OBSERVER_MAX_SYSTEMS } from '../../../../shared/contracts/pricing.ts';
import { impliedOccurrenceBodySchema } from '../../../../shared/contracts/implied-occurrence.ts';
import { Alert } from '../../../components/ui/alert.tsx';
import { Button } from '../../../components/ui/button.tsx';
import { Select } from '../../../components/ui/select.tsx';
import { NumberField, TextField } from '../../../components/ui/text-field.tsx';
import { useSchemaForm } from '../../../hooks/use-schema-form.ts';
import { parseNumberText } from '../../../lib/number-input.ts';
import { useStartImpliedOccurrence } from '../api/start-implied-occurrence.ts';
import { useSampleChoices, useScenarioChoice, useScenarioChoices } from '../../../lib/api/scenario-choices.ts';

export interface ImpliedFormProps {
  departmentId: string;
  /** Observers may run at most 10^6 systems; the form says so and fills that in. */
  limitSystems: boolean;
  /** Called with the fit that answers the question. */
  onStarted: (fitId: string) => void;
  /** What the fit would cost for this many systems per value of m, composed by the route (billing is its own feature). */
  renderCost?: (systems: number | null) => ReactNode;
}

const count = (n: number) => n.toLocaleString('en-US');
const emptyToUndefined = (value: unknown) => (typeof value === 'string' && value.trim() === '' ? undefined : typeof value === 'string' ? value.trim() : value);

function formSchema(limitSystems: boolean, scenarioSystems: number | null) {
  return z
    .strictObject({
      scenarioId: z.string({ error: 'Choose a scenario.' }).min(1, { error: 'Choose a scenario.' }),
      sampleId: z.string({ error: 'Choose a sample with counts.' }).min(1, { error: 'Choose a sample with counts.' }),
      systems: z.preprocess((v) => (typeof v === 'string' ? (parseNumberText(v, { grouping: true }) ?? undefined) : v), impliedOccurrenceBodySchema.shape.systems),
      seed: z.preprocess(emptyToUndefined, impliedOccurrenceBodySchema.shape.seed),
    })
    .superRefine((body, ctx) => {
      const systems = body.systems ?? scenarioSystems;
      if (limitSystems && systems !== null && systems > OBSERVER_MAX_SYSTEMS) {
        ctx.addIssue({ code: 'custom', path: ['systems'], message: `Observers may run at most ${count(OBSERVER_MAX_SYSTEMS)} systems (this would be ${count(systems)}).` });
      }
    });
}

/** The observer's question: a scenario, a sample with counts, and how many systems to draw. */
export function ImpliedForm({ departmentId, limitSystems, onStarted, renderCost }: ImpliedFormProps) {
  const scenarios = useScenarioChoices(departmentId);
  const samples = useSampleChoices(departmentId);
  const [scenarioId, setScenarioId] = useState('');
  const [systems, setSystems] = useState('');
  const [systemsTouched, setSystemsTouched] = useState(false);
  const scenario = useScenarioChoice(departmentId, scenarioId || null);
  const scenarioSystems = typeof scenario.data?.resolved.systems === 'number' ? scenario.data.resolved.systems : null;
  const start = useStartImpliedOccurrence();
  const schema = useMemo(() => formSchema(limitSystems, scenarioSystems), [limitSystems, scenarioSystems]);
  const form = useSchemaForm(schema, async (body) => {
    const started = await start.mutateAsync(body);
    onStarted(started.fitId);
  });

  // An observer's run is capped: fill in the cap (or the scenario's own, if smaller) until they type their own.
  const suggested = limitSystems && scenarioSystems !== null ? String(Math.min(OBSERVER_MAX_SYSTEMS, scenarioSystems)) : '';
  const shownSystems = systemsTouched ? systems : suggested;
  const typed = parseNumberText(shownSystems, { grouping: true });
  const effectiveSystems = typed === null ? scenarioSystems : Number.isFinite(typed) ? typed : null;

  const countsSamples = (samples.data?.samples ?? []).filter((s) => s.kind === 'counts');
  const scenarioOptions = [
    { value: '', label: scenarios.isPending ? 'Loading scenarios…' : 'Choose a scenario', disabled: true },
    ...(scenarios.data?.scenarios ?? []).map((s) => ({ value: s.id, label: s.name })),
  ];
  const sampleOptions = [
    { value: '', label: samples.isPending ? 'Loading samples…' : 'Choose a sample', disabled: true },
    ...countsSamples.map((s) => ({ value: s.id, label: `${s.name}: ${s.magnetic} of ${s.total}${s.library ? ' (library)' : ''}` })),
  ];

  return (
    <form {...form.formProps} aria-label="Ask what occurrence a sample implies" className="flex flex-col gap-5">
      <Alert message={form.formError} />
      {(scenarios.isError || samples.isError) && <Alert message="The scenarios or samples could not be loaded. Reload the page to try again." />}
      <fieldset disabled={form.submitting} className="flex min-w-0 flex-col gap-5">
        <legend className="sr-only">Question</legend>
        <div className="grid gap-5 md:grid-cols-2">
          <Select
            label="Scenario"
            name="scenarioId"
            value={scenarioId}
            onChange={(e) => setScenarioId(e.target.value)}
            options={scenarioOptions}
            error={form.fieldErrors.scenarioId}
            hint="Its companion occurrence table is what the multiplier scales."
          />
          <Select
            label="Observed sample"
            name="sampleId"
            defaultValue=""
            options={sampleOptions}
            error={form.fieldErrors.sampleId}
            hint={samples.data && countsSamples.length === 0 ? 'No sample with counts yet: record one under Samples.' : 'Only samples with counts (magnetic of total) can be tested exactly.'}
          />
        </div>
        <div className="grid gap-5 md:grid-cols-2">
          <NumberField
            label="Systems"
            name="systems"
            unit="systems"
            value={shownSystems}
            onChange={(e) => {
              setSystemsTouched(true);
              setSystems(e.target.value);
            }}
            placeholder={scenarioSystems ? String(scenarioSystems) : undefined}
            error={form.fieldErrors.systems}
            hint={
              limitSystems
                ? `At most ${count(OBSERVER_MAX_SYSTEMS)} for observers; per value of m; more systems make the curve’s own Monte Carlo error smaller.`
                : `1,000 to 10^10, e.g. 1e6; empty for the scenario’s own${scenarioSystems ? ` (${count(scenarioSystems)})` : ''}.`
            }
          />
          <TextField label="Seed" name="seed" autoComplete="off" spellCheck={false} error={form.fieldErrors.seed} hint="Optional; empty for the scenario’s own, so the answer can be reproduced." />
        </div>
        {renderCost?.(effectiveSystems)}
        <div>
          <Button type="submit" pending={form.submitting}>
            Find the implied occurrence
          </Button>
        </div>
      </fieldset>
    </form>
  );
}
