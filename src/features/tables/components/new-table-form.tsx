import { z } from 'zod';
import { nameSchema } from '../../../../shared/contracts/common.ts';
import { Alert } from '../../../components/ui/alert.tsx';
import { Button } from '../../../components/ui/button.tsx';
import { TextField } from '../../../components/ui/text-field.tsx';
import { useSchemaForm } from '../../../hooks/use-schema-form.ts';
import { useCreateTable } from '../api/create-table.ts';

const newTableSchema = z.object({ name: nameSchema });

/** An empty table to fill in row by row, for when there is no CSV to start from. */
export function NewTableForm({ departmentId, onCreated }: { departmentId: string; onCreated: (id: string) => void }) {
  const create = useCreateTable(departmentId);
  const form = useSchemaForm(newTableSchema, async ({ name }) => {
    const { id } = await create.mutateAsync({ name, rows: [] });
    onCreated(id);
  });
  return (
    <form {...form.formProps} aria-label="New empty table" className="flex flex-col gap-4">
      <Alert message={form.formError} />
      <div className="grid items-start gap-3 sm:grid-cols-[minmax(0,1fr)_auto]">
        <TextField label="Name of the empty table" name="name" maxLength={160} autoComplete="off" error={form.fieldErrors.name} />
        <Button type="submit" variant="secondary" pending={form.submitting} className="sm:mt-9">
          Create and edit it
        </Button>
      </div>
    </form>
  );
}
