import { z } from 'zod';
import { emailSchema } from '../../../../shared/contracts/auth.ts';
import { ROLE_LABELS, ROLES, roleSchema } from '../../../../shared/contracts/roles.ts';
import { Alert } from '../../../components/ui/alert.tsx';
import { Button } from '../../../components/ui/button.tsx';
import { Card } from '../../../components/ui/card.tsx';
import { Select } from '../../../components/ui/select.tsx';
import { TextField } from '../../../components/ui/text-field.tsx';
import { useSchemaForm } from '../../../hooks/use-schema-form.ts';

// Until the invitation contract exists in shared/contracts: the same field rules as sign-up.
const inviteFormSchema = z.strictObject({ email: emailSchema, role: roleSchema });
export type InviteFormValues = z.infer<typeof inviteFormSchema>;

export interface InviteMemberFormProps {
  /** Sends the invitation. Without it the form is shown switched off (no e-mail support yet). */
  onInvite?: (values: InviteFormValues) => Promise<unknown>;
}

const roleOptions = ROLES.map((role) => ({ value: role, label: ROLE_LABELS[role] }));

export function InviteMemberForm({ onInvite }: InviteMemberFormProps) {
  const form = useSchemaForm(inviteFormSchema, async (values) => onInvite?.(values));
  const enabled = Boolean(onInvite);

  return (
    <Card title="Invite by e-mail" description="Colleagues get a link that adds them to this department with the role you choose.">
      {!enabled && (
        <Alert
          tone="info"
          className="mb-5"
          message="Invitations arrive with e-mail support. Until then this form is switched off."
        />
      )}
      <form {...form.formProps} aria-label="Invite by e-mail">
        <fieldset disabled={!enabled || form.submitting} className="grid items-end gap-4 sm:grid-cols-[1fr_12rem_auto]">
          <legend className="sr-only">Invitation</legend>
          <Alert message={form.formError} className="sm:col-span-3" />
          <TextField label="E-mail" name="email" type="email" autoComplete="off" spellCheck={false} error={form.fieldErrors.email} />
          <Select label="Role" name="role" defaultValue="observer" options={roleOptions} error={form.fieldErrors.role} />
          <Button type="submit" variant="secondary" pending={form.submitting}>
            Send invitation
          </Button>
        </fieldset>
      </form>
    </Card>
  );
}
