import { useState } from 'react';
import { Card } from '../../components/ui/card.tsx';
import { PageHeader } from '../../components/ui/page-header.tsx';
import { useSignedInMe } from '../../features/auth/hooks/use-signed-in-me.ts';
import { DepartmentShareLinks } from '../../features/exports/components/department-share-links.tsx';
import { CreateTokenForm, type CreatedToken } from '../../features/tokens/components/create-token-form.tsx';
import { CurlExample } from '../../features/tokens/components/curl-example.tsx';
import { NewTokenSecret } from '../../features/tokens/components/new-token-secret.tsx';
import { TokensPanel } from '../../features/tokens/components/tokens-panel.tsx';

export function Component() {
  const me = useSignedInMe();
  const [created, setCreated] = useState<CreatedToken | null>(null);
  return (
    <>
      <PageHeader
        eyebrow={me.department.name}
        title="API tokens"
        description="Personal tokens for the REST API and the command line (a script sends one in the Authorization header instead of signing in), and the department's read-only links."
      />
      <div className="flex flex-col gap-6">
        {created ? (
          <NewTokenSecret created={created} onDone={() => setCreated(null)} />
        ) : (
          <Card title="Create a token" description="The secret is shown once, right after it is created.">
            <CreateTokenForm departmentId={me.department.id} userId={me.user.id} onCreated={setCreated} />
            <h3 className="mt-6 font-bold text-foam-50">Using a token</h3>
            <CurlExample />
          </Card>
        )}
        <TokensPanel departmentId={me.department.id} userId={me.user.id} departmentName={me.department.name} />
        <DepartmentShareLinks departmentId={me.department.id} role={me.role} />
      </div>
    </>
  );
}
