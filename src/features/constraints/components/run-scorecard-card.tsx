import { useState } from 'react';
import { Link } from 'react-router-dom';
import { Card } from '../../../components/ui/card.tsx';
import { QueryState } from '../../../components/ui/query-state.tsx';
import { Select } from '../../../components/ui/select.tsx';
import { paths } from '../../../config/paths.ts';
import { useConstraintSets } from '../api/get-constraint-sets.ts';
import { useRunEvaluation } from '../api/get-run-evaluation.ts';
import { ObservedOverlayChart } from './observed-overlay-chart.tsx';
import { ScorecardTable } from './scorecard-table.tsx';

export interface RunScorecardCardProps {
  departmentId: string;
  runId: string;
}

/** A finished run judged by every constraint of a chosen set at once (the library by default). */
export function RunScorecardCard({ departmentId, runId }: RunScorecardCardProps) {
  const sets = useConstraintSets(departmentId);
  const [setId, setSetId] = useState<string>('library');
  const evaluation = useRunEvaluation(departmentId, runId, setId);
  const options = (sets.data?.constraintSets ?? [{ id: 'library', name: 'Published constraints (library)', constraintCount: 0 }]).map((s) => ({
    value: s.id,
    label: `${s.name}${s.constraintCount ? ` (${s.constraintCount})` : ''}`,
  }));
  return (
    <Card
      title="Scorecard"
      description="The run against every observable of a constraint set at once: one line per constraint, then the joint score."
      actions={<Link to={paths.constraintSets.getHref()}>Constraint sets</Link>}
    >
      <div className="flex flex-col gap-4">
        <Select label="Constraint set" options={options} value={setId} onChange={(e) => setSetId(e.target.value)} className="max-w-md" />
        <QueryState query={evaluation} loadingLabel="Scoring the run…" errorTitle="The run could not be scored">
          {(data) => (
            <div className="flex flex-col gap-5">
              <ScorecardTable evaluation={data} />
              {data.constraints.some((c) => c.overlay) && (
                <div className="grid gap-6 xl:grid-cols-2">
                  {data.constraints.map((c) => c.overlay && <ObservedOverlayChart key={c.id} evaluation={c} />)}
                </div>
              )}
            </div>
          )}
        </QueryState>
      </div>
    </Card>
  );
}
