import { useCallback } from 'react';
import { Link, useSearchParams } from 'react-router-dom';
import { buttonClasses } from '../../components/ui/button.tsx';
import { PageHeader } from '../../components/ui/page-header.tsx';
import { paths } from '../../config/paths.ts';
import { useSignedInMe } from '../../features/auth/hooks/use-signed-in-me.ts';
import { runListStateFromSearch, searchFromRunListState, type RunListState } from '../../features/runs/components/run-list-params.ts';
import { RunsPanel } from '../../features/runs/components/runs-panel.tsx';

export function Component() {
  const me = useSignedInMe();
  const [search, setSearch] = useSearchParams();
  const state = runListStateFromSearch(search);
  // Filters live in the address bar, so that a filtered list can be bookmarked or shared.
  const onStateChange = useCallback((next: RunListState) => setSearch(searchFromRunListState(next), { replace: true }), [setSearch]);

  return (
    <>
      <PageHeader
        eyebrow={me.department.name}
        title="Runs"
        description="Seeded Monte Carlo runs of the department’s scenarios, with their predicted magnetic fraction and its Monte Carlo error."
        actions={
          <Link to={paths.runs.new.getHref()} className={buttonClasses()}>
            Start a run
          </Link>
        }
      />
      <RunsPanel departmentId={me.department.id} state={state} onStateChange={onStateChange} />
    </>
  );
}
