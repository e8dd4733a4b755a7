import { useState } from 'react';
import { createInvitationBodySchema, type CreateInvitationBody } from '../../../../shared/contracts/invitations.ts';
import { ROLE_LABELS, ROLES } from '../../../../shared/contracts/roles.ts';
import { Alert } from '../../../components/ui/alert.tsx';
import { Button } from '../../../components/ui/button.tsx';
import { Card } from '../../../components/ui/card.tsx';
import { Select } from '../../../components/ui/select.tsx';
import { TextField } from '../../../components/ui/text-field.tsx';
import { useSchemaForm } from '../../../hooks/use-schema-form.ts';

export type InviteFormValues = CreateInvitationBody;

export interface InviteMemberFormProps {
  /** Sends the invitation; `emailed` false means it was saved but the mail server refused it. */
  onInvite: (values: InviteFormValues) => Promise<{ email: string; emailed: boolean }>;
}

const roleOptions = ROLES.map((role) => ({ value: role, label: ROLE_LABELS[role] }));

export function InviteMemberForm({ onInvite }: InviteMemberFormProps) {
  const [sent, setSent] = useState<{ email: string; emailed: boolean } | null>(null);
  const form = useSchemaForm(createInvitationBodySchema, async (values) => {
    setSent(null);
    const result = await onInvite(values);
    setSent(result);
    form.formProps.ref.current?.reset();
  });

  return (
    <Card title="Invite by e-mail" description="Colleagues get a link that adds them to this department with the role you choose. It works once, for seven days.">
      <Alert
        tone={sent?.emailed === false ? 'danger' : 'success'}
        className={sent ? 'mb-5' : undefined}
        message={
          sent &&
          (sent.emailed
            ? `Invitation sent to ${sent.email}.`
            : `The invitation for ${sent.email} was saved, but the mail server did not take the e-mail. Send it again in a moment.`)
        }
      />
      <form {...form.formProps} aria-label="Invite by e-mail">
        <fieldset disabled={form.submitting} className="grid items-end gap-4 sm:grid-cols-[1fr_12rem_auto]">
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
