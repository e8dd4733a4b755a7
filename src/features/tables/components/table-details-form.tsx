import { useState } from 'react';
import { z } from 'zod';
import { nameSchema } from '../../../../shared/contracts/common.ts';
import type { TableDetail, UpdateTableBody } from '../../../../shared/contracts/occurrence-tables-api.ts';
import { Alert } from '../../../components/ui/alert.tsx';
import { Button } from '../../../components/ui/button.tsx';
import { Field, controlClasses } from '../../../components/ui/field.tsx';
import { TextField } from '../../../components/ui/text-field.tsx';
import { useSchemaForm } from '../../../hooks/use-schema-form.ts';
import { cx } from '../../../lib/class-names.ts';
import { useUpdateTable } from '../api/update-table.ts';

// The form's fields with the server's rules for them; an emptied description clears it.
const detailsSchema = z
  .object({ name: nameSchema, description: z.string().max(4000, { error: 'description must be at most 4000 characters' }) })
  .transform(({ name, description }): UpdateTableBody => ({ name, description: description.trim() === '' ? null : description.trim() }));

/** Rename a table and say what it is. */
export function TableDetailsForm({ departmentId, table }: { departmentId: string; table: TableDetail }) {
  const update = useUpdateTable(departmentId);
  const [saved, setSaved] = useState(false);
  const form = useSchemaForm(detailsSchema, async (body) => {
    setSaved(false);
    await update.mutateAsync({ id: table.id, body });
    setSaved(true);
  });
  return (
    <form {...form.formProps} aria-label="Name and description" className="flex flex-col gap-4">
      <Alert message={form.formError} />
      <TextField label="Name" name="name" defaultValue={table.name} maxLength={160} autoComplete="off" error={form.fieldErrors.name} />
      <Field label="Description" hint="What the table is and where its numbers come from." error={form.fieldErrors.description}>
        {(control) => <textarea {...control} name="description" rows={3} maxLength={4000} defaultValue={table.description ?? ''} className={cx(controlClasses, 'resize-y')} />}
      </Field>
      <div className="flex flex-wrap items-center gap-3">
        <Button type="submit" variant="secondary" pending={form.submitting}>
          Save name and description
        </Button>
        <span aria-live="polite" className="text-sm font-bold text-kelp-300">
          {saved ? 'Saved.' : ''}
        </span>
      </div>
    </form>
  );
}
