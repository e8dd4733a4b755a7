import { PageHeader } from '../../components/ui/page-header.tsx';
import { useSignedInMe } from '../../features/auth/hooks/use-signed-in-me.ts';
import { AccountPanel } from '../../features/overview/components/account-panel.tsx';
import { HealthPanel } from '../../features/overview/components/health-panel.tsx';
import { WhatYouCanDo } from '../../features/overview/components/what-you-can-do.tsx';

export function Component() {
  const me = useSignedInMe();
  return (
    <>
      <PageHeader eyebrow={me.department.name} title="Overview" description={`Welcome, ${me.user.name}.`} />
      <div className="grid gap-6 lg:grid-cols-2">
        <AccountPanel me={me} />
        <HealthPanel />
        <div className="lg:col-span-2">
          <WhatYouCanDo role={me.role} />
        </div>
      </div>
    </>
  );
}
