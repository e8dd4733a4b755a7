import { useState, type FormEvent } from 'react';
import { formatPercentRange } from '../../../../shared/engine/stats/format.ts';
import { Alert } from '../../../components/ui/alert.tsx';
import { Button } from '../../../components/ui/button.tsx';
import { Card } from '../../../components/ui/card.tsx';
import { NumberField, TextField } from '../../../components/ui/text-field.tsx';
import { isApiError } from '../../../lib/api-client.ts';
import { useTwoSample, type TwoSampleResponse } from '../api/post-two-sample.ts';
import { pCell, sigmaCell } from './scorecard-text.ts';

type Side = 'a' | 'b';
const FIELDS = ['magnetic', 'total'] as const;

function intervalText(s: TwoSampleResponse['a'], which: 'interval68' | 'interval95'): string {
  const [, lo, hi] = formatPercentRange(s.fraction, s[which][0], s[which][1]);
  return `${lo}–${hi}%`;
}

/** Two observed samples (say single white dwarfs vs those with a detached companion): can they share one magnetic fraction? */
export function TwoSampleForm() {
  const test = useTwoSample();
  const [labels, setLabels] = useState<Record<Side, string>>({ a: 'Single white dwarfs', b: 'With a detached companion' });
  const [values, setValues] = useState<Record<`${Side}.${(typeof FIELDS)[number]}`, string>>({ 'a.magnetic': '', 'a.total': '', 'b.magnetic': '', 'b.total': '' });
  const fieldError = (key: string) => (isApiError(test.error) && test.error.field === key ? test.error.message : undefined);
  const otherError = test.isError && !(isApiError(test.error) && test.error.field && test.error.field in values) ? test.error.message : undefined;

  function submit(event: FormEvent) {
    event.preventDefault();
    const n = (key: keyof typeof values) => (values[key].trim() === '' ? Number.NaN : Number(values[key]));
    test.mutate({ a: { magnetic: n('a.magnetic'), total: n('a.total') }, b: { magnetic: n('b.magnetic'), total: n('b.total') } });
  }

  return (
    <div className="flex flex-col gap-6">
      <Card title="Two samples" description="Magnetic white dwarfs among the total of each sample. Fisher's exact test asks whether one magnetic fraction could give both.">
        <form onSubmit={submit} className="flex flex-col gap-5" noValidate>
          <div className="grid gap-6 md:grid-cols-2">
            {(['a', 'b'] as const).map((side) => (
              <fieldset key={side} className="flex flex-col gap-3 rounded-md border border-ink-700 p-4">
                <legend className="px-1 font-bold">Sample {side.toUpperCase()}</legend>
                <TextField label="What it is" value={labels[side]} onChange={(e) => setLabels({ ...labels, [side]: e.target.value })} />
                {FIELDS.map((f) => (
                  <NumberField
                    key={f}
                    label={`${side.toUpperCase()}: ${f === 'magnetic' ? 'magnetic white dwarfs' : 'white dwarfs in total'}`}
                    value={values[`${side}.${f}`]}
                    error={fieldError(`${side}.${f}`)}
                    onChange={(e) => setValues({ ...values, [`${side}.${f}`]: e.target.value })}
                  />
                ))}
              </fieldset>
            ))}
          </div>
          <Alert message={otherError} />
          <div>
            <Button type="submit" pending={test.isPending}>
              Test
            </Button>
          </div>
        </form>
      </Card>
      {test.data && (
        <Card title="Can they share one magnetic fraction?">
          <div className="flex flex-col gap-4" data-testid="two-sample-result">
            <p className="text-lg font-bold">{test.data.verdict}</p>
            <p className="tabular-nums">
              {pCell(test.data.p)} · {sigmaCell({ status: 'scored', sigma: test.data.sigma })}
            </p>
            <table className="w-full text-left">
              <caption className="sr-only">Both samples with their Clopper–Pearson intervals</caption>
              <thead>
                <tr>
                  <th scope="col" className="px-3 py-2">Sample</th>
                  <th scope="col" className="px-3 py-2 text-right">Magnetic</th>
                  <th scope="col" className="px-3 py-2 text-right">68% interval</th>
                  <th scope="col" className="px-3 py-2 text-right">95% interval</th>
                </tr>
              </thead>
              <tbody>
                {(['a', 'b'] as const).map((side) => {
                  const s = test.data[side];
                  return (
                    <tr key={side} className="border-t border-ink-700 tabular-nums">
                      <th scope="row" className="px-3 py-2">{labels[side] || `Sample ${side.toUpperCase()}`}</th>
                      <td className="px-3 py-2 text-right">{`${s.magnetic} of ${s.total}`}</td>
                      <td className="px-3 py-2 text-right">{intervalText(s, 'interval68')}</td>
                      <td className="px-3 py-2 text-right">{intervalText(s, 'interval95')}</td>
                    </tr>
                  );
                })}
              </tbody>
            </table>
            <p className="text-sm text-foam-300">
              {test.data.method}. {test.data.intervalMethod}.
            </p>
          </div>
        </Card>
      )}
    </div>
  );
}
