import { useNavigate } from 'react-router-dom';
import { roleAtLeast } from '../../../shared/contracts/roles.ts';
import { Card } from '../../components/ui/card.tsx';
import { PageHeader } from '../../components/ui/page-header.tsx';
import { paths } from '../../config/paths.ts';
import { useSignedInMe } from '../../features/auth/hooks/use-signed-in-me.ts';
import { CsvUploadCard } from '../../features/tables/components/csv-upload-card.tsx';
import { NewTableForm } from '../../features/tables/components/new-table-form.tsx';
import { TablesList } from '../../features/tables/components/tables-list.tsx';

export function Component() {
  const me = useSignedInMe();
  const navigate = useNavigate();
  const canWrite = roleAtLeast(me.role, 'modeller');
  const open = (id: string) => navigate(paths.occurrenceTables.detail.getHref(id));
  return (
    <>
      <PageHeader
        eyebrow={me.department.name}
        title="Occurrence tables"
        description="How often stars host planets, brown dwarfs and low-mass stellar companions, by mass and period, each row with its published source. A scenario uses a stored table by id."
      />
      <div className="flex flex-col gap-6">
        <Card title="Stored tables">
          <TablesList departmentId={me.department.id} />
        </Card>
        {canWrite ? (
          <>
            <CsvUploadCard departmentId={me.department.id} onStored={open} />
            <Card title="Start an empty table" description="To type the rows in by hand.">
              <NewTableForm departmentId={me.department.id} onCreated={open} />
            </Card>
          </>
        ) : (
          <p className="text-foam-300">Your role can read and download tables; a modeller or an admin can upload and edit them.</p>
        )}
      </div>
    </>
  );
}
