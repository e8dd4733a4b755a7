import { PageHeader } from '../../components/ui/page-header.tsx';
import { useSignedInMe } from '../../features/auth/hooks/use-signed-in-me.ts';
import { ConstraintSetsPanel } from '../../features/constraints/components/constraint-sets-panel.tsx';

export function Component() {
  const me = useSignedInMe();
  return (
    <>
      <PageHeader
        eyebrow={me.department.name}
        title="Constraint sets"
        description="The observations a run is judged by, all at once: published ones from the library and your own counts and lists."
      />
      <ConstraintSetsPanel departmentId={me.department.id} />
    </>
  );
}
