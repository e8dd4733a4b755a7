import { PageHeader } from '../../components/ui/page-header.tsx';
import { WorkersTable } from '../../features/workers/components/workers-table.tsx';

export function Component() {
  return (
    <>
      <PageHeader
        eyebrow="Service"
        title="Compute workers"
        description="Where runs are computed: the machines, their threads and the jobs each has done. Every worker gives the same result bit for bit."
      />
      <WorkersTable />
    </>
  );
}
