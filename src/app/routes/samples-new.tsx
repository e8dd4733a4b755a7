import { Link, useNavigate } from 'react-router-dom';
import { Card } from '../../components/ui/card.tsx';
import { PageHeader } from '../../components/ui/page-header.tsx';
import { paths } from '../../config/paths.ts';
import { useSignedInMe } from '../../features/auth/hooks/use-signed-in-me.ts';
import { SampleForm } from '../../features/samples/components/sample-form.tsx';

export function Component() {
  const me = useSignedInMe();
  const navigate = useNavigate();
  return (
    <>
      <PageHeader
        eyebrow={<Link to={paths.samples.getHref()}>Samples</Link>}
        title="New sample"
        description="How many white dwarfs of a survey are magnetic. The exact 68% and 95% intervals follow the numbers as you type."
      />
      <Card>
        <SampleForm departmentId={me.department.id} cancelHref={paths.samples.getHref()} onSaved={(id) => navigate(paths.samples.detail.getHref(id))} />
      </Card>
    </>
  );
}
