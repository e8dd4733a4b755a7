import { useCallback } from 'react';
import { useParams, useSearchParams } from 'react-router-dom';
import { useSignedInMe } from '../../features/auth/hooks/use-signed-in-me.ts';
import { RunScorecardCard } from '../../features/constraints/components/run-scorecard-card.tsx';
import { RunExportsSection } from '../../features/exports/components/run-exports-section.tsx';
import { RunPage } from '../../features/runs/components/run-page.tsx';

export function Component() {
  const me = useSignedInMe();
  const { id = '' } = useParams();
  const [search, setSearch] = useSearchParams();
  // The chosen sample lives in the address bar, so that a link shows the same comparison.
  const onSampleChange = useCallback((sample: string) => setSearch({ sample }, { replace: true, preventScrollReset: true }), [setSearch]);
  return (
    <RunPage
      key={id}
      departmentId={me.department.id}
      runId={id}
      userId={me.user.id}
      role={me.role}
      sampleId={search.get('sample')}
      onSampleChange={onSampleChange}
      resultSections={<RunScorecardCard departmentId={me.department.id} runId={id} />}
      exportsSection={<RunExportsSection departmentId={me.department.id} role={me.role} runId={id} />}
    />
  );
}
