import { Link } from 'react-router-dom';
import { buttonClasses } from '../../components/ui/button.tsx';
import { PageHeader } from '../../components/ui/page-header.tsx';
import { paths } from '../../config/paths.ts';
import { useSignedInMe } from '../../features/auth/hooks/use-signed-in-me.ts';
import { SamplesPanels } from '../../features/samples/components/samples-panels.tsx';

export function Component() {
  const me = useSignedInMe();
  return (
    <>
      <PageHeader
        eyebrow={me.department.name}
        title="Samples"
        description="Observed counts of white dwarfs, magnetic or not, to set runs, sweeps and implied-occurrence questions against."
        actions={
          <Link to={paths.samples.new.getHref()} className={buttonClasses()}>
            New sample
          </Link>
        }
      />
      <SamplesPanels departmentId={me.department.id} />
    </>
  );
}
