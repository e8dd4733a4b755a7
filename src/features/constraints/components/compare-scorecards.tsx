import { useState } from 'react';
import { Badge } from '../../../components/ui/badge.tsx';
import { Card } from '../../../components/ui/card.tsx';
import { LoadingState } from '../../../components/ui/loading-state.tsx';
import { Select } from '../../../components/ui/select.tsx';
import { useConstraintSets } from '../api/get-constraint-sets.ts';
import { useRunEvaluations, type Evaluation } from '../api/get-run-evaluation.ts';
import { shortVerdict, sigmaCell, toneOf } from './scorecard-text.ts';

export interface CompareScorecardsProps {
  departmentId: string;
  runs: readonly { id: string; name: string }[];
}

/** The scorecards of several runs side by side: which channel mix survives which observable. */
export function CompareScorecards({ departmentId, runs }: CompareScorecardsProps) {
  const sets = useConstraintSets(departmentId);
  const [setId, setSetId] = useState('library');
  const evaluations = useRunEvaluations(departmentId, runs.map((r) => r.id), setId);
  const loaded = evaluations.map((q) => q.data).filter((d): d is Evaluation => Boolean(d));
  const lines = loaded[0]?.constraints ?? [];
  const options = (sets.data?.constraintSets ?? [{ id: 'library', name: 'Published constraints (library)' }]).map((s) => ({ value: s.id, label: s.name }));
  return (
    <Card title="Scorecards" description="Every run against the same constraint set; each cell is that run's σ and verdict for the line.">
      <div className="flex flex-col gap-4">
        <Select label="Constraint set" options={options} value={setId} onChange={(e) => setSetId(e.target.value)} className="max-w-md" />
        {loaded.length < runs.length ? (
          evaluations.some((q) => q.isError) ? <p className="text-coral-300">Some runs could not be scored against this set.</p> : <LoadingState label="Scoring the runs…" />
        ) : (
          <div className="overflow-x-auto">
            <table className="w-full text-left">
              <caption className="sr-only">Scorecards of the compared runs</caption>
              <thead>
                <tr>
                  <th scope="col" className="px-3 py-2">Constraint</th>
                  {runs.map((r) => (
                    <th key={r.id} scope="col" className="px-3 py-2">{r.name}</th>
                  ))}
                </tr>
              </thead>
              <tbody>
                {lines.map((line, i) => (
                  <tr key={line.id} className="border-t border-ink-700">
                    <th scope="row" className="px-3 py-2 font-bold">{line.label}</th>
                    {loaded.map((e, j) => {
                      const c = e.constraints[i];
                      return (
                        <td key={runs[j].id} className="px-3 py-2 tabular-nums">
                          <span className="flex flex-wrap items-center gap-2">
                            {sigmaCell(c)} <Badge tone={toneOf(c)}>{shortVerdict(c)}</Badge>
                          </span>
                        </td>
                      );
                    })}
                  </tr>
                ))}
                <tr className="border-t-2 border-ink-500">
                  <th scope="row" className="px-3 py-2 font-bold">Joint (constraints taken as independent)</th>
                  {loaded.map((e, j) => (
                    <td key={runs[j].id} className="px-3 py-2 tabular-nums">
                      {e.combined.sigma === null && e.combined.scored > 0 ? '∞σ' : e.combined.sigma === null ? '—' : sigmaCell({ status: 'scored', sigma: e.combined.sigma })}
                    </td>
                  ))}
                </tr>
              </tbody>
            </table>
          </div>
        )}
      </div>
    </Card>
  );
}
