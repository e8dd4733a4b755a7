import { useState } from 'react';
import { PASSWORD_MIN_LENGTH } from '../../../../shared/contracts/auth.ts';
import { emailChangeBodySchema, passwordChangeBodySchema, profileBodySchema } from '../../../../shared/contracts/settings.ts';
import { Alert } from '../../../components/ui/alert.tsx';
import { Badge } from '../../../components/ui/badge.tsx';
import { Button } from '../../../components/ui/button.tsx';
import { Card } from '../../../components/ui/card.tsx';
import { ConfirmDialog } from '../../../components/ui/confirm-dialog.tsx';
import { errorMessage } from '../../../components/ui/error-state.tsx';
import { QueryState } from '../../../components/ui/query-state.tsx';
import { TextField } from '../../../components/ui/text-field.tsx';
import { useSchemaForm } from '../../../hooks/use-schema-form.ts';
import { formatDateTimeUtc } from '../../../lib/format.ts';
import { useChangePassword } from '../api/change-password.ts';
import { useRequestEmailChange } from '../api/request-email-change.ts';
import { useSaveName } from '../api/save-name.ts';
import { useSessions } from '../api/get-sessions.ts';
import { useSignOutEverywhere } from '../api/sign-out-everywhere.ts';

/** Your name as the department sees it (runs list their owner by it). */
export function NameForm({ name }: { name: string }) {
  const save = useSaveName();
  const [done, setDone] = useState<string | null>(null);
  const form = useSchemaForm(profileBodySchema, async (values) => setDone((await save.mutateAsync(values)).message));
  return (
    <Card title="Name" description="Shown beside your runs, sweeps and samples.">
      <form {...form.formProps} aria-label="Change your name" className="flex flex-col gap-4" onInput={() => setDone(null)}>
        <Alert message={form.formError} />
        <TextField label="Name" name="name" defaultValue={name} autoComplete="name" maxLength={120} error={form.fieldErrors.name} />
        <Alert tone="success" message={done ?? undefined} />
        <div>
          <Button type="submit" variant="secondary" pending={form.submitting}>
            Save the name
          </Button>
        </div>
      </form>
    </Card>
  );
}

/** A new address takes effect when the link mailed to it is opened. */
export function EmailForm({ email }: { email: string }) {
  const request = useRequestEmailChange();
  const [done, setDone] = useState<string | null>(null);
  const form = useSchemaForm(emailChangeBodySchema, async (values) => setDone((await request.mutateAsync(values)).message));
  return (
    <Card title="E-mail address" description={<>You sign in with <span className="font-bold text-foam-50">{email}</span>. A new address is used once you open the link we send to it.</>}>
      <form {...form.formProps} aria-label="Change your e-mail address" className="flex flex-col gap-4" onInput={() => setDone(null)}>
        <Alert message={form.formError} />
        <TextField label="New e-mail address" name="email" type="email" autoComplete="email" error={form.fieldErrors.email} />
        <TextField label="Current password" name="currentPassword" type="password" autoComplete="current-password" error={form.fieldErrors.currentPassword} hint="To show it is you." />
        <Alert tone="success" message={done ?? undefined} />
        <div>
          <Button type="submit" variant="secondary" pending={form.submitting}>
            Send the confirmation link
          </Button>
        </div>
      </form>
    </Card>
  );
}

export function PasswordForm({ userId }: { userId: string }) {
  const change = useChangePassword(userId);
  const [done, setDone] = useState<string | null>(null);
  const form = useSchemaForm(passwordChangeBodySchema, async (values) => {
    setDone((await change.mutateAsync(values)).message);
  });
  return (
    <Card title="Password" description="Changing it signs out every other session of your account; this one stays signed in.">
      <form {...form.formProps} aria-label="Change your password" className="flex flex-col gap-4" onInput={() => setDone(null)}>
        <Alert message={form.formError} />
        <TextField label="Current password" name="currentPassword" type="password" autoComplete="current-password" error={form.fieldErrors.currentPassword} />
        <TextField label="New password" name="password" type="password" autoComplete="new-password" hint={`At least ${PASSWORD_MIN_LENGTH} characters.`} error={form.fieldErrors.password} />
        <Alert tone="success" message={done ?? undefined} />
        <div>
          <Button type="submit" variant="secondary" pending={form.submitting}>
            Change the password
          </Button>
        </div>
      </form>
    </Card>
  );
}

/** Where the account is signed in, and the one button that ends all of it. */
export function SessionsPanel({ userId }: { userId: string }) {
  const sessions = useSessions(userId);
  const everywhere = useSignOutEverywhere();
  const [confirming, setConfirming] = useState(false);
  return (
    <Card
      title="Signed-in sessions"
      description="Each browser you signed in from. Sign out everywhere if a device was lost or shared; API tokens are managed on their own page."
      actions={
        <Button variant="danger" size="sm" onClick={() => setConfirming(true)}>
          Sign out everywhere
        </Button>
      }
    >
      <QueryState query={sessions} loadingLabel="Loading your sessions…" errorTitle="Your sessions could not be loaded">
        {(data) => (
          <ul className="flex flex-col divide-y divide-ink-700" aria-label="Sessions">
            {data.sessions.map((s, i) => (
              <li key={`${s.expiresAt}-${i}`} className="flex flex-wrap items-center justify-between gap-2 py-2">
                <span>
                  {s.current ? 'This browser' : `Another session${s.departmentName ? ` (working in ${s.departmentName})` : ''}`}
                  <span className="block text-sm text-foam-400">ends {formatDateTimeUtc(s.expiresAt)} unless used again</span>
                </span>
                {s.current && <Badge tone="success">current</Badge>}
              </li>
            ))}
          </ul>
        )}
      </QueryState>
      <ConfirmDialog
        open={confirming}
        title="Sign out everywhere?"
        confirmLabel="Sign out everywhere"
        tone="danger"
        pending={everywhere.isPending}
        error={everywhere.isError ? errorMessage(everywhere.error) : undefined}
        onConfirm={() => everywhere.mutate()}
        onCancel={() => setConfirming(false)}
      >
        Every session of your account ends, this one included; you will sign in again here.
      </ConfirmDialog>
    </Card>
  );
}
