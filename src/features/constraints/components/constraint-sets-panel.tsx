import { useState } from 'react';
import { Link } from 'react-router-dom';
import { Alert } from '../../../components/ui/alert.tsx';
import { Badge } from '../../../components/ui/badge.tsx';
import { Card } from '../../../components/ui/card.tsx';
import { QueryState } from '../../../components/ui/query-state.tsx';
import { Table } from '../../../components/ui/table.tsx';
import { paths } from '../../../config/paths.ts';
import { useConstraintLibrary } from '../api/get-constraint-library.ts';
import { useConstraintSets } from '../api/get-constraint-sets.ts';
import { ConstraintSetForm } from './constraint-set-form.tsx';

/** The department's constraint sets, the published library, and a form for a new set. */
export function ConstraintSetsPanel({ departmentId }: { departmentId: string }) {
  const sets = useConstraintSets(departmentId);
  const library = useConstraintLibrary(departmentId);
  const [created, setCreated] = useState<string | null>(null);
  return (
    <div className="flex flex-col gap-6">
      <Alert
        tone="success"
        message={created && <>Saved “{created}”. Open a finished run from <Link to={paths.runs.getHref()}>the runs</Link> and pick it in the run’s scorecard.</>}
      />
      <Card title="Constraint sets" description="Pick one in a run's scorecard or on the Compare page.">
        <QueryState query={sets} loadingLabel="Loading the sets…" errorTitle="The sets could not be loaded">
          {(data) => (
            <Table
              caption="Constraint sets"
              hideCaption
              rowKey={(s) => s.id}
              rows={data.constraintSets}
              stackOnNarrow
              columns={[
                { id: 'name', header: 'Name', rowHeader: true, cell: (s) => <span className="flex items-center gap-2">{s.name}{s.library && <Badge tone="info">published</Badge>}</span> },
                { id: 'count', header: 'Constraints', align: 'end', cell: (s) => s.constraintCount },
                { id: 'kinds', header: 'Kinds', cell: (s) => s.kinds.join(', ') },
                { id: 'version', header: 'Version', align: 'end', cell: (s) => (s.library ? '—' : s.currentVersion) },
              ]}
            />
          )}
        </QueryState>
      </Card>
      <ConstraintSetForm departmentId={departmentId} onCreated={(_id, name) => setCreated(name)} />
      <Card title="The published library" description="Each entry as its paper states it; anything Tidefield assumed in reading it is said beside it.">
        <QueryState query={library} loadingLabel="Loading the library…" errorTitle="The library could not be loaded">
          {(data) => (
            <ul className="flex flex-col gap-4">
              {data.constraints.map((c) => (
                <li key={c.id} className="flex flex-col gap-1">
                  <span className="font-bold">
                    {c.name} {c.fromMemory && <Badge tone="warning">from memory</Badge>}
                  </span>
                  <span className="text-sm text-foam-300">{c.citation}</span>
                  <span className="text-sm text-foam-300">{c.provenance}</span>
                </li>
              ))}
            </ul>
          )}
        </QueryState>
      </Card>
    </div>
  );
}
