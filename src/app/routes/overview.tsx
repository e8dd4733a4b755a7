import { PageHeader } from '../../components/ui/page-header.tsx';
import { useSignedInMe } from '../../features/auth/hooks/use-signed-in-me.ts';
import { HealthPanel } from '../../features/overview/components/health-panel.tsx';
import { RecentFits } from '../../features/overview/components/recent-fits.tsx';
import { StartHere } from '../../features/overview/components/start-here.tsx';
import { WhatYouCanDo } from '../../features/overview/components/what-you-can-do.tsx';
import { useRuns } from '../../features/runs/api/get-runs.ts';
import { RecentRuns } from '../../features/runs/components/recent-runs.tsx';
import { RecentSweeps } from '../../features/sweeps/components/recent-sweeps.tsx';

/** The user's work first: a start for a new department, recent runs, sweeps and fits with their status, then what the role can do. */
export function Component() {
  const me = useSignedInMe();
  // Any run of the department, the caller's or not: "start here" is for a department with none.
  const anyRun = useRuns(me.department.id, { pageSize: 1 });
  return (
    <>
      <PageHeader eyebrow={me.department.name} title="Overview" description={`Welcome, ${me.user.name}.`} />
      <div className="grid items-start gap-6 lg:grid-cols-2">
        <div className="lg:col-span-2 empty:hidden">
          <StartHere departmentId={me.department.id} role={me.role} hasRuns={anyRun.data ? anyRun.data.page.total > 0 : null} />
        </div>
        <RecentRuns departmentId={me.department.id} />
        <RecentSweeps departmentId={me.department.id} />
        <div className="lg:col-span-2 empty:hidden">
          <RecentFits departmentId={me.department.id} />
        </div>
        <div className="lg:col-span-2">
          <WhatYouCanDo role={me.role} />
        </div>
        {/* The service's own state matters to whoever looks after the department, not to everyone's day. */}
        {me.role === 'admin' && <HealthPanel />}
      </div>
    </>
  );
}
