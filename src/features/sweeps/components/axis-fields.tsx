import { useId } from 'react';
import { SWEEPABLE_PARAMETERS } from '../../../../shared/contracts/scenario.ts';
import { Button } from '../../../components/ui/button.tsx';
import { Select } from '../../../components/ui/select.tsx';
import { NumberField, TextField } from '../../../components/ui/text-field.tsx';
import { cx } from '../../../lib/class-names.ts';
import { parameterApplies, parameterOf, valueAt, type AxisDraft, type AxisFieldErrors, type AxisValues } from './sweep-axes.ts';

export interface AxisFieldsProps {
  index: number;
  axis: AxisDraft;
  values: AxisValues;
  /** The chosen scenario's resolved document: which parameters it has, and their values. */
  resolved?: Record<string, unknown>;
  /** The other axis's parameter, which this one may not repeat. */
  otherPath?: string;
  pathError?: string;
  /** A problem of the values as a whole (e.g. the server's, for one value of the grid). */
  valuesError?: string;
  /** Each input's own problem, all shown at once. */
  fieldErrors?: AxisFieldErrors;
  /** `changedPath` when another parameter was chosen: the axis starts afresh around its value; `changedField` names the input edited. */
  onChange: (axis: AxisDraft, changedPath: boolean, changedField?: keyof AxisDraft) => void;
  onRemove?: () => void;
}

const modeOptions = [
  { value: 'range', label: 'Evenly spaced from a start to a stop' },
  { value: 'list', label: 'A list of values' },
];
const spacingOptions = [
  { value: 'linear', label: 'Equal steps' },
  { value: 'log', label: 'Equal ratios (logarithmic)' },
];

/** One axis of a sweep: the parameter (with its unit and allowed range) and its values. */
export function AxisFields({ index, axis, values, resolved, otherPath, pathError, valuesError, fieldErrors = {}, onChange, onRemove }: AxisFieldsProps) {
  const id = useId();
  const parameter = parameterOf(axis.path);
  const unit = parameter?.unit || 'dimensionless';
  const current = valueAt(resolved, axis.path);
  const set = (patch: Partial<AxisDraft>) => onChange({ ...axis, ...patch }, false, Object.keys(patch)[0] as keyof AxisDraft);

  const options = SWEEPABLE_PARAMETERS.map((p) => {
    const missing = resolved !== undefined && !parameterApplies(resolved, p.path);
    const taken = p.path === otherPath;
    const unitText = p.unit ? `, ${p.unit}` : '';
    const why = taken ? ' — used by the other axis' : missing ? ` — needs ${p.requires ?? 'another scenario'}` : '';
    return { value: p.path, label: `${p.label} (${p.min}–${p.max}${unitText})${why}`, disabled: taken || missing };
  });

  return (
    <fieldset className="flex min-w-0 flex-col gap-4 rounded-lg border border-ink-700 p-4 sm:p-5">
      <legend className="px-2 text-lg font-bold text-foam-50">
        {index === 0 ? 'Parameter to vary' : 'Second parameter'}
        <span className="font-normal text-foam-300">{index === 0 ? ' (the x axis)' : ' (the y axis of the heat map)'}</span>
      </legend>
      <Select
        label={index === 0 ? 'Parameter' : 'Second parameter'}
        value={axis.path}
        onChange={(e) => onChange({ ...axis, path: e.target.value }, true)}
        options={options}
        error={pathError}
        data-field={`axes.${index}.path`}
        hint={
          parameter && (
            <>
              Allowed from {parameter.min} to {parameter.max} ({unit})
              {typeof current === 'number' ? `; this scenario uses ${current}` : ''}. Sweeping it keeps every other setting of the scenario.
            </>
          )
        }
      />
      <Select label="Values" value={axis.mode} onChange={(e) => set({ mode: e.target.value as AxisDraft['mode'] })} options={modeOptions} />
      {axis.mode === 'range' ? (
        <div className="grid gap-4 sm:grid-cols-2 xl:grid-cols-4">
          <NumberField label="Start" unit={parameter?.unit || undefined} value={axis.start} onChange={(e) => set({ start: e.target.value })} error={fieldErrors.start} data-field={`axes.${index}.start`} hint={parameter?.unit ? undefined : 'Dimensionless'} />
          <NumberField label="Stop" unit={parameter?.unit || undefined} value={axis.stop} onChange={(e) => set({ stop: e.target.value })} error={fieldErrors.stop} data-field={`axes.${index}.stop`} hint={parameter?.unit ? undefined : 'Dimensionless'} />
          <NumberField label="Number of values" unit="values" value={axis.count} onChange={(e) => set({ count: e.target.value })} error={fieldErrors.count} data-field={`axes.${index}.count`} hint="2 to 25" />
          <Select label="Spacing" value={axis.spacing} onChange={(e) => set({ spacing: e.target.value as AxisDraft['spacing'] })} options={spacingOptions} />
        </div>
      ) : (
        <TextField
          label="List of values"
          unit={parameter?.unit || 'dimensionless'}
          value={axis.list}
          onChange={(e) => set({ list: e.target.value })}
          hint="Separated by commas or spaces, e.g. 0.25, 0.5, 1, 2, 4."
          error={fieldErrors.list ?? valuesError}
          data-field={`axes.${index}.list`}
          autoComplete="off"
          spellCheck={false}
        />
      )}
      {axis.mode === 'range' && valuesError && (
        <p data-field={`axes.${index}.values`} tabIndex={-1} className="text-sm font-bold text-coral-300">
          {valuesError}
        </p>
      )}
      <p id={`${id}-preview`} aria-live="polite" className={cx('text-sm tabular-nums', values.values ? 'text-foam-300' : 'text-foam-400')}>
        {values.values ? (
          <>
            <span className="font-bold text-foam-50">{values.values.length} values:</span> {values.values.join(', ')}
            {parameter?.unit ? ` ${parameter.unit}` : ''}
          </>
        ) : valuesError || Object.values(fieldErrors).some(Boolean) ? null : (
          values.error
        )}
      </p>
      {onRemove && (
        <div>
          <Button variant="ghost" size="sm" className="text-coral-300" onClick={onRemove}>
            Remove the second parameter
          </Button>
        </div>
      )}
    </fieldset>
  );
}
