import { PageHeader } from '../../components/ui/page-header.tsx';
import { useSignedInMe } from '../../features/auth/hooks/use-signed-in-me.ts';
import { TwoSampleForm } from '../../features/constraints/components/two-sample-form.tsx';

export function Component() {
  const me = useSignedInMe();
  return (
    <>
      <PageHeader
        eyebrow={me.department.name}
        title="Two-sample test"
        description="Could two observed samples — say single white dwarfs and those with a detached companion — share one magnetic fraction?"
      />
      <TwoSampleForm />
    </>
  );
}
