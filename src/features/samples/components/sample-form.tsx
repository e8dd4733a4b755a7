import { useCallback, useEffect, useRef, useState, type FormEvent } from 'react';
import { Link } from 'react-router-dom';
import { BIN_SETTINGS, SAMPLE_SETTINGS, type Sample, type SampleBin } from '../../../../shared/contracts/samples.ts';
import { Alert } from '../../../components/ui/alert.tsx';
import { Button } from '../../../components/ui/button.tsx';
import { Field, controlClasses } from '../../../components/ui/field.tsx';
import { Select } from '../../../components/ui/select.tsx';
import { NumberField, TextField } from '../../../components/ui/text-field.tsx';
import { useSchemaForm } from '../../../hooks/use-schema-form.ts';
import { cx } from '../../../lib/class-names.ts';
import { useCreateSample } from '../api/create-sample.ts';
import { useUpdateSample } from '../api/update-sample.ts';
import { sampleBodyFromEntries, sampleFormDefaults, sampleFormSchema } from './sample-form-values.ts';
import { SampleIntervals } from './sample-intervals.tsx';
import { BIN_SETTING_TEXT, SAMPLE_SETTING_TEXT, countsInterval, countsText, type CountsInterval } from './sample-text.ts';

export interface SampleFormProps {
  departmentId: string;
  /** The sample being edited; a new one without it. */
  sample?: Sample;
  /** Where "Cancel" goes. */
  cancelHref: string;
  onSaved: (id: string) => void;
}

interface BinDraft {
  key: number;
  kind: SampleBin['kind'];
  initial?: SampleBin;
}

interface Preview {
  main: CountsInterval | null;
  bins: (CountsInterval | null)[];
}

const settingOptions = SAMPLE_SETTINGS.map((value) => ({ value, label: SAMPLE_SETTING_TEXT[value] }));
const binSettingOptions = BIN_SETTINGS.map((value) => ({ value, label: BIN_SETTING_TEXT[value] }));

function readPreview(form: HTMLFormElement | null): Preview {
  if (!form) return { main: null, bins: [] };
  const body = sampleBodyFromEntries(Object.fromEntries(new FormData(form)));
  const bins = body.bins as { magnetic?: number; total?: number }[];
  return {
    main: countsInterval(body.magnetic as number | undefined, body.total as number | undefined),
    bins: bins.map((b) => countsInterval(b.magnetic, b.total)),
  };
}

/**
 * Create or edit an observed sample: magnetic of total with its setting, detection threshold
 * and provenance, and optional splits by setting or mass bin. The Clopper–Pearson intervals
 * follow the numbers as they are typed.
 */
export function SampleForm({ departmentId, sample, cancelHref, onSaved }: SampleFormProps) {
  const create = useCreateSample(departmentId);
  const update = useUpdateSample(departmentId);
  const defaults = sampleFormDefaults(sample);
  const nextKey = useRef(defaults.bins.length);
  const [bins, setBins] = useState<BinDraft[]>(() => defaults.bins.map((bin, key) => ({ key, kind: bin.kind, initial: bin })));
  const [preview, setPreview] = useState<Preview>({ main: null, bins: [] });
  const [saved, setSaved] = useState(false);

  const form = useSchemaForm(sampleFormSchema, async (body) => {
    setSaved(false);
    if (sample) {
      const updated = await update.mutateAsync({ id: sample.id, body });
      setSaved(true);
      onSaved(updated.id);
    } else {
      const { id } = await create.mutateAsync(body);
      onSaved(id);
    }
  });
  const formRef = form.formProps.ref;
  const refresh = useCallback(() => setPreview(readPreview(formRef.current)), [formRef]);
  // After the first render and whenever a split is added or removed (their indices shift).
  useEffect(refresh, [refresh, bins]);

  function onChange(event: FormEvent<HTMLFormElement>) {
    form.formProps.onChange(event);
    setSaved(false);
    refresh();
  }

  const addBin = (kind: SampleBin['kind']) => setBins((list) => [...list, { key: nextKey.current++, kind }]);
  const removeBin = (key: number) => setBins((list) => list.filter((b) => b.key !== key));

  return (
    <form {...form.formProps} onChange={onChange} aria-label={sample ? `Edit ${sample.name}` : 'New sample'} className="flex flex-col gap-6">
      <Alert message={form.formError} />
      <div className="grid items-start gap-6 lg:grid-cols-[minmax(0,1fr)_22rem]">
        <fieldset className="flex min-w-0 flex-col gap-5">
          <legend className="sr-only">The sample</legend>
          <TextField label="Name" name="name" defaultValue={defaults.name} autoComplete="off" error={form.fieldErrors.name} hint="Say where the numbers come from, e.g. “40 pc survey, 2026”." />
          <div className="grid gap-5 sm:grid-cols-2">
            <NumberField
              label="Magnetic"
              name="magnetic"
              unit="white dwarfs"
              defaultValue={defaults.magnetic}
              hint="With a field at or above the threshold."
              error={form.fieldErrors.magnetic}
            />
            <NumberField
              label="Total"
              name="total"
              unit="white dwarfs"
              defaultValue={defaults.total}
              hint="Every white dwarf in the sample, 1 to 100,000,000."
              error={form.fieldErrors.total}
            />
          </div>
          <div className="grid gap-5 sm:grid-cols-2">
            <Select label="Setting" name="setting" defaultValue={defaults.setting} options={settingOptions} error={form.fieldErrors.setting} hint="Which white dwarfs the counts are of." />
            <NumberField
              label="Field threshold"
              name="fieldThresholdMG"
              unit="MG"
              defaultValue={defaults.fieldThresholdMG}
              hint="The weakest field the survey detects, 0.001 to 1000 MG; empty if none is stated."
              error={form.fieldErrors.fieldThresholdMG}
            />
          </div>
          <Field label="Provenance" hint="Survey, selection, paper or notebook: what a referee would ask for. Up to 4000 characters." error={form.fieldErrors.provenance}>
            {(control) => <textarea {...control} name="provenance" rows={4} maxLength={4000} defaultValue={defaults.provenance} className={cx(controlClasses, 'resize-y')} />}
          </Field>
        </fieldset>

        <aside aria-label="Interval of the counts as typed" className="rounded-lg border border-ink-700 bg-ink-900 p-4 lg:sticky lg:top-4">
          <h3 className="mb-3 font-bold text-foam-50">Observed fraction</h3>
          <div aria-live="polite">
            {preview.main ? (
              <SampleIntervals interval={preview.main} />
            ) : (
              <p className="text-foam-300">Enter whole numbers, with magnetic no larger than total, to see the fraction and its 68% and 95% intervals.</p>
            )}
          </div>
        </aside>
      </div>

      <fieldset className="flex min-w-0 flex-col gap-4 rounded-lg border border-ink-700 p-4 sm:p-5">
        <legend className="px-2 text-lg font-bold text-foam-50">Splits (optional)</legend>
        <p className="text-foam-300">
          Counts within part of the sample, by setting or by white-dwarf mass (bins from the lower mass up to, not including, the upper). Up to 50.
        </p>
        {bins.length === 0 && <p className="text-foam-400">No splits.</p>}
        <ol className="flex flex-col gap-4">
          {bins.map((bin, index) => (
            <BinRow key={bin.key} index={index} bin={bin} errors={form.fieldErrors} interval={preview.bins[index] ?? null} onRemove={() => removeBin(bin.key)} />
          ))}
        </ol>
        <div className="flex flex-wrap gap-3">
          <Button variant="secondary" size="sm" onClick={() => addBin('setting')} disabled={bins.length >= 50}>
            Add a split by setting
          </Button>
          <Button variant="secondary" size="sm" onClick={() => addBin('massBin')} disabled={bins.length >= 50}>
            Add a mass bin
          </Button>
        </div>
      </fieldset>

      <div className="flex flex-wrap items-center gap-3">
        <Button type="submit" pending={form.submitting}>
          {sample ? 'Save changes' : 'Create sample'}
        </Button>
        <Link to={cancelHref}>Cancel</Link>
        <Alert tone="success" message={saved ? 'Saved.' : undefined} />
      </div>
    </form>
  );
}

interface BinRowProps {
  index: number;
  bin: BinDraft;
  errors: Partial<Record<string, string>>;
  interval: CountsInterval | null;
  onRemove: () => void;
}

function BinRow({ index, bin, errors, interval, onRemove }: BinRowProps) {
  const name = (field: string) => `bins.${index}.${field}`;
  const initial = bin.initial;
  const title = `Split ${index + 1}: ${bin.kind === 'setting' ? 'by setting' : 'mass bin'}`;
  return (
    <li className="rounded-md border border-ink-700 bg-ink-900/60 p-4">
      <fieldset className="flex min-w-0 flex-col gap-4">
        <legend className="mb-3 font-bold text-foam-50">{title}</legend>
        <input type="hidden" name={name('kind')} value={bin.kind} />
        <div className={cx('grid gap-4', bin.kind === 'setting' ? 'sm:grid-cols-3' : 'sm:grid-cols-2')}>
          {bin.kind === 'setting' ? (
            <Select
              label="Setting"
              name={name('setting')}
              defaultValue={initial?.kind === 'setting' ? initial.setting : 'single'}
              options={binSettingOptions}
              error={errors[name('setting')]}
            />
          ) : (
            <>
              <NumberField label="From mass" name={name('massMinMsun')} unit="Msun" defaultValue={initial?.kind === 'massBin' ? String(initial.massMinMsun) : ''} hint="0.1 to 1.44" error={errors[name('massMinMsun')]} />
              <NumberField label="Below mass" name={name('massMaxMsun')} unit="Msun" defaultValue={initial?.kind === 'massBin' ? String(initial.massMaxMsun) : ''} hint="Above the lower mass" error={errors[name('massMaxMsun')]} />
            </>
          )}
          <NumberField label="Magnetic" name={name('magnetic')} unit="white dwarfs" defaultValue={initial ? String(initial.magnetic) : ''} error={errors[name('magnetic')]} />
          <NumberField label="Total" name={name('total')} unit="white dwarfs" defaultValue={initial ? String(initial.total) : ''} error={errors[name('total')]} />
        </div>
        <div className="flex flex-wrap items-center justify-between gap-3">
          <p className="text-sm text-foam-300 tabular-nums" aria-live="polite">
            {interval ? countsText(interval) : 'The interval appears when magnetic and total are whole numbers.'}
          </p>
          <Button variant="ghost" size="sm" className="text-coral-300" onClick={onRemove}>
            Remove<span className="sr-only"> split {index + 1}</span>
          </Button>
        </div>
      </fieldset>
    </li>
  );
}
