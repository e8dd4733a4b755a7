import { useState, type FormEvent, type ReactNode } from 'react';
import { FIT_MAX_PARAMETERS, FIT_MAX_POINTS, createFitBodySchema } from '../../../../shared/contracts/fits.ts';
import { SWEEPABLE_PARAMETERS } from '../../../../shared/contracts/scenario.ts';
import { Alert } from '../../../components/ui/alert.tsx';
import { Button } from '../../../components/ui/button.tsx';
import { Select, type SelectOption } from '../../../components/ui/select.tsx';
import { NumberField } from '../../../components/ui/text-field.tsx';
import { ApiError } from '../../../lib/api-client.ts';
import { useCreateFit } from '../api/create-fit.ts';

interface ParameterRow {
  path: string;
  min: string;
  max: string;
  points: string;
  scale: 'linear' | 'log';
  prior: 'uniform' | 'logUniform';
}

const newRow = (path: string): ParameterRow => {
  const known = SWEEPABLE_PARAMETERS.find((p) => p.path === path);
  return { path, min: String(known?.min ?? 0), max: String(Math.min(known?.max ?? 1, 10)), points: '10', scale: 'linear', prior: 'uniform' };
};

export interface FitFormProps {
  departmentId: string;
  scenarios: readonly SelectOption[];
  constraintSets: readonly SelectOption[];
  /** The cost of `systems` × the grid, shown before anything else (the billing feature's notice, passed in). */
  cost: (systems: number | null, points: number | null) => ReactNode;
  onCreated: (id: string) => void;
}

/** Choose scenario, constraint set and 1–4 parameters (range, points, spacing, prior); the cost comes first. */
export function FitForm({ departmentId, scenarios, constraintSets, cost, onCreated }: FitFormProps) {
  const [scenarioId, setScenarioId] = useState(scenarios[0]?.value ?? '');
  const [constraintSetId, setConstraintSetId] = useState(constraintSets[0]?.value ?? 'library');
  const [systems, setSystems] = useState('100000');
  const [rows, setRows] = useState<ParameterRow[]>([newRow('companions.multiplier')]);
  const [error, setError] = useState<string | null>(null);
  const create = useCreateFit(departmentId);

  const points = rows.reduce((n, r) => n * (Number.isInteger(Number(r.points)) ? Number(r.points) : NaN), 1);
  const systemsNumber = Number(systems);
  const update = (i: number, change: Partial<ParameterRow>) => setRows((rs) => rs.map((r, k) => (k === i ? { ...r, ...change } : r)));

  function submit(event: FormEvent) {
    event.preventDefault();
    const body = {
      scenarioId,
      constraintSetId,
      systems: systemsNumber,
      parameters: rows.map((r) => ({ path: r.path, min: Number(r.min), max: Number(r.max), points: Number(r.points), scale: r.scale, prior: r.prior })),
    };
    const checked = createFitBodySchema.safeParse(body);
    if (!checked.success) {
      const issue = checked.error.issues[0];
      setError(issue.message.startsWith('parameters') ? issue.message : `${issue.path.join('.')}: ${issue.message}`);
      return;
    }
    setError(null);
    create.mutate(body, {
      onSuccess: (res) => onCreated(res.id),
      onError: (e) => setError(e instanceof ApiError ? e.message : String(e)),
    });
  }

  return (
    <form onSubmit={submit} className="flex flex-col gap-4" aria-label="New fit">
      <div data-testid="fit-cost">{cost(Number.isInteger(systemsNumber) && systemsNumber >= 1e3 ? systemsNumber : null, Number.isFinite(points) ? points : null)}</div>
      <div className="grid gap-4 sm:grid-cols-3">
        <Select label="Scenario" value={scenarioId} onChange={(e) => setScenarioId(e.target.value)} options={scenarios} />
        <Select label="Constraint set" value={constraintSetId} onChange={(e) => setConstraintSetId(e.target.value)} options={constraintSets} />
        <NumberField label="Systems per grid point" value={systems} onChange={(e) => setSystems(e.target.value)} />
      </div>
      {rows.map((r, i) => (
        <fieldset key={i} className="grid gap-3 sm:grid-cols-6" aria-label={`Parameter ${i + 1}`}>
          <Select
            label={`Parameter ${i + 1}`}
            value={r.path}
            onChange={(e) => update(i, newRow(e.target.value))}
            options={SWEEPABLE_PARAMETERS.map((p) => ({ value: p.path, label: p.label }))}
          />
          <NumberField label="From" value={r.min} onChange={(e) => update(i, { min: e.target.value })} />
          <NumberField label="To" value={r.max} onChange={(e) => update(i, { max: e.target.value })} />
          <NumberField label="Points" value={r.points} onChange={(e) => update(i, { points: e.target.value })} />
          <Select label="Spacing" value={r.scale} onChange={(e) => update(i, { scale: e.target.value as ParameterRow['scale'] })} options={[{ value: 'linear', label: 'Linear' }, { value: 'log', label: 'Logarithmic' }]} />
          <Select label="Prior" value={r.prior} onChange={(e) => update(i, { prior: e.target.value as ParameterRow['prior'] })} options={[{ value: 'uniform', label: 'Uniform' }, { value: 'logUniform', label: 'Log-uniform (∝ 1/x)' }]} />
        </fieldset>
      ))}
      <div className="flex gap-3">
        {rows.length < FIT_MAX_PARAMETERS ? (
          <Button variant="secondary" onClick={() => setRows((rs) => [...rs, newRow(SWEEPABLE_PARAMETERS.find((p) => !rs.some((r) => r.path === p.path))?.path ?? 'envelope.alpha')])}>
            Add a parameter
          </Button>
        ) : null}
        {rows.length > 1 ? (
          <Button variant="ghost" onClick={() => setRows((rs) => rs.slice(0, -1))}>
            Remove the last parameter
          </Button>
        ) : null}
      </div>
      <p className="text-sm text-foam-300">
        {Number.isFinite(points) ? `${points.toLocaleString('en-US')} grid points` : 'Points must be whole numbers'} (at most {FIT_MAX_POINTS.toLocaleString('en-US')}); every point is computed from the same draws.
      </p>
      {error ? <Alert message={error} /> : null}
      <div>
        <Button type="submit" pending={create.isPending}>
          Start the fit
        </Button>
      </div>
    </form>
  );
}
