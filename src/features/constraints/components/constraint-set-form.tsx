import { useState, type FormEvent } from 'react';
import { CONSTRAINT_CSV_COLUMNS, type ConstraintInput } from '../../../../shared/contracts/constraints.ts';
import { Alert } from '../../../components/ui/alert.tsx';
import { Button } from '../../../components/ui/button.tsx';
import { Card } from '../../../components/ui/card.tsx';
import { Field, controlClasses } from '../../../components/ui/field.tsx';
import { Select } from '../../../components/ui/select.tsx';
import { TextField } from '../../../components/ui/text-field.tsx';
import { isApiError } from '../../../lib/api-client.ts';
import { useCreateConstraintSet } from '../api/create-constraint-set.ts';

type ListChoice = 'magneticMasses' | 'nonMagneticMasses' | 'fields' | 'periods' | 'coolingAge';
const CHOICES: { value: ListChoice; label: string; columns: readonly string[] }[] = [
  { value: 'magneticMasses', label: 'Masses of magnetic white dwarfs (Msun)', columns: CONSTRAINT_CSV_COLUMNS.meanMass },
  { value: 'nonMagneticMasses', label: 'Masses of non-magnetic white dwarfs (Msun)', columns: CONSTRAINT_CSV_COLUMNS.meanMass },
  { value: 'fields', label: 'Fields above a survey threshold (MG)', columns: CONSTRAINT_CSV_COLUMNS.fieldDistribution },
  { value: 'periods', label: 'Post-common-envelope periods (days)', columns: CONSTRAINT_CSV_COLUMNS.postCommonEnvelopePeriods },
  { value: 'coolingAge', label: 'Magnetic incidence by cooling age (counts per bin)', columns: CONSTRAINT_CSV_COLUMNS.coolingAgeIncidence },
];

function constraintFor(choice: ListChoice, csv: string, label: string): ConstraintInput {
  const common = { csv, ...(label.trim() ? { label: label.trim() } : {}) };
  switch (choice) {
    case 'magneticMasses':
      return { kind: 'meanMass', population: 'magnetic', ...common };
    case 'nonMagneticMasses':
      return { kind: 'meanMass', population: 'nonMagnetic', ...common };
    case 'fields':
      return { kind: 'fieldDistribution', ...common };
    case 'periods':
      return { kind: 'postCommonEnvelopePeriods', ...common };
    case 'coolingAge':
      return { kind: 'coolingAgeIncidence', ...common };
  }
}

/** A new constraint set from one CSV list (and, if wanted, the published library); nothing is stored unless every line is right. */
export function ConstraintSetForm({ departmentId, onCreated }: { departmentId: string; onCreated: (id: string, name: string) => void }) {
  const create = useCreateConstraintSet(departmentId);
  const [name, setName] = useState('');
  const [label, setLabel] = useState('');
  const [choice, setChoice] = useState<ListChoice>('magneticMasses');
  const [csv, setCsv] = useState('');
  const [withLibrary, setWithLibrary] = useState(false);
  const columns = CHOICES.find((c) => c.value === choice)!.columns;
  const error = create.error;
  const details = isApiError(error) ? error.details : undefined;

  function submit(event: FormEvent) {
    event.preventDefault();
    const constraints: ConstraintInput[] = [constraintFor(choice, csv, label), ...(withLibrary ? [{ libraryId: 'tout2008-wd-dm-zero' }, { libraryId: 'jordan2007-about-10pc' }] : [])];
    create.mutate({ name, constraints }, { onSuccess: (r) => onCreated(r.id, name) });
  }

  return (
    <Card title="New constraint set" description="Bring your own list as CSV with a header row. Every line is checked; nothing is stored unless all are right.">
      <form onSubmit={submit} className="flex flex-col gap-5" noValidate>
        <div className="grid gap-5 md:grid-cols-2">
          <TextField label="Name of the set" value={name} maxLength={160} error={isApiError(error) && error.field === 'name' ? error.message : undefined} onChange={(e) => setName(e.target.value)} />
          <TextField label="Label of the constraint (optional)" value={label} maxLength={200} onChange={(e) => setLabel(e.target.value)} />
          <Select label="What the list holds" options={CHOICES.map(({ value, label: l }) => ({ value, label: l }))} value={choice} onChange={(e) => setChoice(e.target.value as ListChoice)} />
          <Field label="CSV file" hint={`Columns: ${columns.join(', ')} (others are ignored).`}>
            {(control) => (
              <input {...control} type="file" accept=".csv,text/csv" className={controlClasses} onChange={(e) => void e.target.files?.[0]?.text().then(setCsv)} />
            )}
          </Field>
        </div>
        <Field label="CSV text" hint="Or paste the CSV here; choosing a file fills this in.">
          {(control) => <textarea {...control} rows={6} value={csv} onChange={(e) => setCsv(e.target.value)} className={`${controlClasses} font-mono`} />}
        </Field>
        <label className="flex items-center gap-2">
          <input type="checkbox" checked={withLibrary} onChange={(e) => setWithLibrary(e.target.checked)} />
          Also include the published detached-companion zero and the overall ≈10% from the library
        </label>
        {error && (
          <Alert
            message={
              <>
                <p className="font-bold">{error.message}</p>
                {details && (
                  <ul className="mt-2 list-disc pl-5" data-testid="csv-problems">
                    {details.map((d) => (
                      <li key={`${d.line}-${d.column ?? ''}-${d.message}`}>{`Line ${d.line}${d.column ? `, column ${d.column}` : ''}: ${d.message}`}</li>
                    ))}
                  </ul>
                )}
              </>
            }
          />
        )}
        <div>
          <Button type="submit" pending={create.isPending}>
            Save the set
          </Button>
        </div>
      </form>
    </Card>
  );
}
