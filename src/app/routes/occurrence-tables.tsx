import { useNavigate } from 'react-router-dom';
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
        {me.role === 'observer' && (
          <p className="text-foam-300">As an observer you upload your own tables and edit or delete only those; everyone in the department can read and download every table.</p>
        )}
        <CsvUploadCard departmentId={me.department.id} onStored={open} />
        <Card title="Start an empty table" description="To type the rows in by hand.">
          <NewTableForm departmentId={me.department.id} onCreated={open} />
        </Card>
      </div>
    </>
  );
}
