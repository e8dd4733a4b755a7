import { useState } from 'react';
import { Link, useNavigate, useParams } from 'react-router-dom';
import { roleAtLeast } from '../../../shared/contracts/roles.ts';
import type { TableDetail } from '../../../shared/contracts/occurrence-tables-api.ts';
import { Button, buttonClasses } from '../../components/ui/button.tsx';
import { Card } from '../../components/ui/card.tsx';
import { ConfirmDialog } from '../../components/ui/confirm-dialog.tsx';
import { errorMessage } from '../../components/ui/error-state.tsx';
import { PageHeader } from '../../components/ui/page-header.tsx';
import { QueryState } from '../../components/ui/query-state.tsx';
import { paths } from '../../config/paths.ts';
import { useSignedInMe } from '../../features/auth/hooks/use-signed-in-me.ts';
import { useDeleteTable } from '../../features/tables/api/delete-table.ts';
import { useTable } from '../../features/tables/api/get-table.ts';
import { tableCsvHref } from '../../features/tables/api/get-table-csv.ts';
import { RowsEditor } from '../../features/tables/components/rows-editor.tsx';
import { TableDetailsForm } from '../../features/tables/components/table-details-form.tsx';
import { formatDateTimeUtc } from '../../lib/format.ts';

export function Component() {
  const me = useSignedInMe();
  const { id = '' } = useParams();
  const table = useTable(me.department.id, id);
  return (
    <QueryState query={table} loadingLabel="Loading the table…" errorTitle="The occurrence table could not be loaded">
      {(t) => <TablePage key={t.id} table={t} />}
    </QueryState>
  );
}

function TablePage({ table }: { table: TableDetail }) {
  const me = useSignedInMe();
  const navigate = useNavigate();
  // Observers change only the tables they uploaded; the server checks the same rule.
  const canWrite = roleAtLeast(me.role, 'modeller') || table.ownerUserId === me.user.id;
  const remove = useDeleteTable(me.department.id);
  const [confirming, setConfirming] = useState(false);
  return (
    <>
      <PageHeader
        eyebrow={<Link to={paths.occurrenceTables.getHref()}>Occurrence tables</Link>}
        title={table.name}
        description={
          <>
            {table.rowCount} row{table.rowCount === 1 ? '' : 's'}, last changed {formatDateTimeUtc(table.updatedAt)}. Id <code className="font-mono text-base">{table.id}</code>, for a
            scenario’s companions.tableId.
            {table.description && <span className="mt-2 block text-base">{table.description}</span>}
          </>
        }
        actions={
          <>
            <a href={tableCsvHref(table.id)} download className={buttonClasses({ variant: 'secondary' })}>
              Download CSV
            </a>
            {canWrite && (
              <Button
                variant="danger"
                onClick={() => {
                  remove.reset();
                  setConfirming(true);
                }}
              >
                Delete table
              </Button>
            )}
          </>
        }
      />
      <div className="flex flex-col gap-6">
        <Card
          title="Rows"
          description="Each row: the probability that a star hosts one companion of that class, mass and period range (rows are independent), the shape inside the row, and where the numbers come from."
        >
          <RowsEditor departmentId={me.department.id} table={table} readOnly={!canWrite} />
        </Card>
        {canWrite && (
          <Card title="Name and description">
            <TableDetailsForm departmentId={me.department.id} table={table} />
          </Card>
        )}
      </div>
      <ConfirmDialog
        open={confirming}
        title={`Delete ${table.name}?`}
        confirmLabel="Delete the table"
        tone="danger"
        pending={remove.isPending}
        error={remove.isError ? errorMessage(remove.error) : undefined}
        onConfirm={() => remove.mutate(table.id, { onSuccess: () => navigate(paths.occurrenceTables.getHref()) })}
        onCancel={() => setConfirming(false)}
      >
        The table and its {table.rowCount} rows are removed for everyone in the department. Scenarios that name it by id can no longer start runs until they use other rows; runs already made keep the rows they used.
      </ConfirmDialog>
    </>
  );
}
