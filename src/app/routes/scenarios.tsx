import { Link } from 'react-router-dom';
import { roleAtLeast } from '../../../shared/contracts/roles.ts';
import { buttonClasses } from '../../components/ui/button.tsx';
import { PageHeader } from '../../components/ui/page-header.tsx';
import { paths } from '../../config/paths.ts';
import { useSignedInMe } from '../../features/auth/hooks/use-signed-in-me.ts';
import { ScenariosTable } from '../../features/scenarios/components/scenarios-table.tsx';

export function Component() {
  const me = useSignedInMe();
  const canWrite = roleAtLeast(me.role, 'modeller');
  const newLink = (
    <Link to={paths.scenarios.new.getHref()} className={buttonClasses()}>
      New scenario
    </Link>
  );
  return (
    <>
      <PageHeader
        eyebrow={me.department.name}
        title="Scenarios"
        description="Each scenario is one seeded description of a Galactic population: primaries, companions and the physics that decides their fate. Every save keeps a version; runs record the version they drew."
        actions={canWrite ? newLink : undefined}
      />
      <ScenariosTable departmentId={me.department.id} emptyAction={canWrite ? newLink : undefined} />
    </>
  );
}
