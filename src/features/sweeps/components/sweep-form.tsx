import { useEffect, useId, useRef, useState, type FormEvent, type ReactNode } from 'react';
import { createRunBodySchema } from '../../../../shared/contracts/runs.ts';
import { SWEEPABLE_PARAMETERS } from '../../../../shared/contracts/scenario.ts';
import { createSweepBodySchema, type CreateSweepBody } from '../../../../shared/contracts/sweeps.ts';
import { Alert } from '../../../components/ui/alert.tsx';
import { Button } from '../../../components/ui/button.tsx';
import { Select } from '../../../components/ui/select.tsx';
import { NumberField, TextField } from '../../../components/ui/text-field.tsx';
import { isApiError } from '../../../lib/api-client.ts';
import { cx } from '../../../lib/class-names.ts';
import { parseNumberText } from '../../../lib/number-input.ts';
import { useCreateSweep } from '../api/create-sweep.ts';
import { AxisFields } from './axis-fields.tsx';
import {
  axisFieldErrors,
  axisValues,
  gridPointCount,
  gridTooLarge,
  newAxisDraft,
  parameterApplies,
  sweepFieldKey,
  valueAt,
  type AxisDraft,
} from './sweep-axes.ts';
import { useScenarioChoice, useScenarioChoices } from '../../../lib/api/scenario-choices.ts';

export interface SweepFormProps {
  departmentId: string;
  initialScenarioId?: string | null;
  onStarted: (id: string) => void;
  /** What the sweep would cost, composed by the route (billing lives in its own feature). */
  renderCost?: (systemsPerPoint: number | null, points: number | null) => ReactNode;
}

type Errors = Partial<Record<string, string>>;

const FIRST_PARAMETER = 'envelope.alpha';
const count = (n: number) => n.toLocaleString('en-US');
const sentence = (text: string) => text.charAt(0).toUpperCase() + text.slice(1);

/** The order in which errors are met on the form, for moving focus to the first. */
const AXIS_KEYS = (i: number) => [`axes.${i}.path`, `axes.${i}.start`, `axes.${i}.stop`, `axes.${i}.count`, `axes.${i}.list`, `axes.${i}.values`];
const FIELD_ORDER = ['scenarioId', 'name', ...AXIS_KEYS(0), ...AXIS_KEYS(1), 'axes', 'systems', 'seed'];

/**
 * Set up a 1-D or 2-D sweep: a scenario, one or two parameters with their values (an even grid
 * or a list), systems per point and the seed every point shares. For modellers and admins (the
 * server refuses observers).
 */
export function SweepForm({ departmentId, initialScenarioId, onStarted, renderCost }: SweepFormProps) {
  const ids = useId();
  const scenarios = useScenarioChoices(departmentId);
  const [scenarioId, setScenarioId] = useState(initialScenarioId ?? '');
  const scenario = useScenarioChoice(departmentId, scenarioId || null);
  const resolved = scenario.data?.resolved;
  const [name, setName] = useState('');
  const [axes, setAxes] = useState<AxisDraft[]>([newAxisDraft(FIRST_PARAMETER)]);
  const [systems, setSystems] = useState('');
  const [seed, setSeed] = useState('');
  const [errors, setErrors] = useState<Errors>({});
  const [formError, setFormError] = useState<string | undefined>();
  const focusPending = useRef(false);
  const formRef = useRef<HTMLFormElement>(null);
  const create = useCreateSweep(departmentId);

  // A newly chosen scenario: start each axis around that scenario's own value.
  const initialisedFor = useRef<string | null>(null);
  useEffect(() => {
    if (!resolved || !scenario.data || initialisedFor.current === scenario.data.id) return;
    initialisedFor.current = scenario.data.id;
    setAxes((current) =>
      current.map((axis, i) => {
        const taken = current.filter((_, j) => j !== i).map((a) => a.path);
        const path = parameterApplies(resolved, axis.path) ? axis.path : (SWEEPABLE_PARAMETERS.find((p) => parameterApplies(resolved, p.path) && !taken.includes(p.path))?.path ?? axis.path);
        return newAxisDraft(path, valueAt(resolved, path));
      }),
    );
  }, [resolved, scenario.data]);

  useEffect(() => {
    if (!focusPending.current) return;
    focusPending.current = false;
    const first = FIELD_ORDER.find((key) => errors[key]);
    const element = first ? formRef.current?.querySelector<HTMLElement>(`[data-field="${first}"]`) : null;
    element?.focus();
  }, [errors]);

  const values = axes.map(axisValues);
  const points = gridPointCount(values);
  const typedSystems = parseNumberText(systems, { grouping: true });
  const scenarioSystems = typeof resolved?.systems === 'number' ? resolved.systems : null;
  const systemsPerPoint = typedSystems === null ? scenarioSystems : Number.isFinite(typedSystems) ? typedSystems : null;

  function clear(key: string) {
    if (errors[key] || errors.axes) setErrors((e) => ({ ...e, [key]: undefined, axes: undefined }));
  }

  function show(next: Errors, message?: string) {
    focusPending.current = true;
    setErrors(next);
    setFormError(message);
  }

  function validate(): { body?: CreateSweepBody; errors: Errors } {
    const found: Errors = {};
    if (!scenarioId) found.scenarioId = 'Choose the scenario to sweep.';
    // Every problem at once, each at its own input.
    axes.forEach((axis, i) => {
      const fieldErrors = axisFieldErrors(axis);
      for (const [field, message] of Object.entries(fieldErrors)) found[`axes.${i}.${field}`] = message;
      if (Object.keys(fieldErrors).length === 0 && values[i].error) found[`axes.${i}.${axis.mode === 'list' ? 'list' : 'values'}`] = values[i].error;
    });
    if (axes.length === 2 && axes[0].path === axes[1].path) found['axes.1.path'] = 'The second parameter must differ from the first.';
    const tooLarge = gridTooLarge(points);
    if (tooLarge) found.axes = tooLarge;
    if (typedSystems !== null) {
      const checked = createRunBodySchema.shape.systems.safeParse(typedSystems);
      if (!checked.success) found.systems = sentence(checked.error.issues[0].message);
    }
    if (Object.values(found).some(Boolean)) return { errors: found };
    const body = {
      scenarioId,
      ...(name.trim() ? { name: name.trim() } : {}),
      axes: axes.map((axis, i) => ({ path: axis.path, values: values[i].values ?? [] })),
      ...(typedSystems === null ? {} : { systems: typedSystems }),
      ...(seed.trim() ? { seed: seed.trim() } : {}),
    };
    const parsed = createSweepBodySchema.safeParse(body);
    if (parsed.success) return { body: parsed.data, errors: {} };
    for (const issue of parsed.error.issues) found[sweepFieldKey(issue.path.join('.')) || 'axes'] ??= sentence(issue.message);
    return { errors: found };
  }

  async function onSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    if (create.isPending) return;
    const { body, errors: found } = validate();
    if (!body) return show(found);
    show({});
    focusPending.current = false;
    try {
      const { id } = await create.mutateAsync(body);
      onStarted(id);
    } catch (error) {
      const message = isApiError(error) ? sentence(error.message) : 'Something went wrong in the page. Reload it and try again.';
      const key = isApiError(error) && error.field ? sweepFieldKey(error.field) : null;
      if (key && FIELD_ORDER.includes(key)) show({ [key]: message });
      else show({}, message);
    }
  }

  const scenarioOptions = [
    { value: '', label: scenarios.isPending ? 'Loading scenarios…' : 'Choose a scenario', disabled: true },
    ...(scenarios.data?.scenarios ?? []).map((s) => ({ value: s.id, label: `${s.name} (version ${s.currentVersion})` })),
  ];

  return (
    <form ref={formRef} onSubmit={(e) => void onSubmit(e)} noValidate aria-label="New sweep" className="flex flex-col gap-6">
      <Alert message={formError} />
      {scenarios.isError && <Alert message={`The scenarios could not be loaded: ${scenarios.error.message}`} />}
      <fieldset disabled={create.isPending} className="flex min-w-0 flex-col gap-6">
        <legend className="sr-only">Sweep</legend>
        <div className="grid gap-5 md:grid-cols-2">
          <Select
            label="Scenario"
            value={scenarioId}
            onChange={(e) => {
              setScenarioId(e.target.value);
              clear('scenarioId');
            }}
            options={scenarioOptions}
            error={errors.scenarioId}
            data-field="scenarioId"
            hint={scenario.data ? `Its own: ${count(scenario.data.resolved.systems as number)} systems, seed “${String(scenario.data.resolved.seed)}”.` : 'Every point runs this scenario with one parameter changed.'}
          />
          <TextField
            label="Name"
            value={name}
            onChange={(e) => {
              setName(e.target.value);
              clear('name');
            }}
            autoComplete="off"
            hint="Optional; by default the scenario and the parameters."
            error={errors.name}
            data-field="name"
          />
        </div>

        {axes.map((axis, i) => (
          <AxisFields
            key={i}
            index={i}
            axis={axis}
            values={values[i]}
            resolved={resolved}
            otherPath={axes[1 - i]?.path}
            pathError={errors[`axes.${i}.path`]}
            valuesError={errors[`axes.${i}.values`]}
            fieldErrors={{ start: errors[`axes.${i}.start`], stop: errors[`axes.${i}.stop`], count: errors[`axes.${i}.count`], list: errors[`axes.${i}.list`] }}
            onChange={(next, changedPath, changedField) => {
              setAxes((list) => list.map((a, j) => (j === i ? (changedPath ? newAxisDraft(next.path, valueAt(resolved, next.path)) : next) : a)));
              // Editing one input clears its own message only; a new parameter or mode starts the axis afresh.
              const own = changedField && ['start', 'stop', 'count', 'list'].includes(changedField) ? [`axes.${i}.${changedField}`] : AXIS_KEYS(i);
              setErrors((e) => ({ ...e, ...Object.fromEntries([...own, `axes.${i}.values`, 'axes'].map((k) => [k, undefined])) }));
            }}
            onRemove={i === 1 ? () => setAxes((list) => list.slice(0, 1)) : undefined}
          />
        ))}
        {axes.length === 1 && (
          <div>
            <Button
              variant="secondary"
              size="sm"
              onClick={() => {
                const path = SWEEPABLE_PARAMETERS.find((p) => p.path !== axes[0].path && (!resolved || parameterApplies(resolved, p.path)))?.path ?? 'envelope.lambda';
                setAxes((list) => [...list, newAxisDraft(path, valueAt(resolved, path))]);
              }}
            >
              Add a second parameter (a 2-D grid)
            </Button>
          </div>
        )}

        <div className="grid gap-5 md:grid-cols-2">
          <NumberField
            label="Systems per point"
            unit="systems"
            value={systems}
            onChange={(e) => {
              setSystems(e.target.value);
              clear('systems');
            }}
            placeholder={scenarioSystems ? String(scenarioSystems) : undefined}
            hint={`1,000 to 10^10, e.g. 1e6; empty for the scenario’s own${scenarioSystems ? ` (${count(scenarioSystems)})` : ''}.`}
            error={errors.systems}
            data-field="systems"
          />
          <TextField
            label="Seed"
            value={seed}
            onChange={(e) => {
              setSeed(e.target.value);
              clear('seed');
            }}
            autoComplete="off"
            spellCheck={false}
            hint="Every point draws with this seed (common random numbers), so the curve is smooth; empty for the scenario’s own."
            error={errors.seed}
            data-field="seed"
          />
        </div>

        <div id={`${ids}-grid`} data-field="axes" tabIndex={-1} className={cx('rounded-md border px-4 py-3', errors.axes ? 'border-coral-300' : 'border-ink-700')}>
          <p className="font-bold text-foam-50" aria-live="polite">
            {points === null
              ? 'The grid appears once every parameter has its values.'
              : `${points} grid point${points === 1 ? '' : 's'}${systemsPerPoint ? ` × ${count(systemsPerPoint)} systems = ${count(points * systemsPerPoint)} systems in all` : ''}.`}
          </p>
          {errors.axes && <p className="mt-1 text-sm font-bold text-coral-300">{errors.axes}</p>}
        </div>

        {renderCost?.(systemsPerPoint, points)}

        <div>
          <Button type="submit" pending={create.isPending}>
            Start the sweep
          </Button>
        </div>
      </fieldset>
    </form>
  );
}
