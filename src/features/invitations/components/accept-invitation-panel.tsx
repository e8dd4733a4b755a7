import type { ReactNode } from 'react';
import { Link } from 'react-router-dom';
import type { MeResponse } from '../../../../shared/contracts/auth.ts';
import { PASSWORD_MIN_LENGTH } from '../../../../shared/contracts/auth.ts';
import { acceptInvitationBodySchema, type InvitationPreview } from '../../../../shared/contracts/invitations.ts';
import { ROLE_LABELS } from '../../../../shared/contracts/roles.ts';
import { Alert } from '../../../components/ui/alert.tsx';
import { Button } from '../../../components/ui/button.tsx';
import { DescriptionList } from '../../../components/ui/description-list.tsx';
import { ErrorState, errorMessage } from '../../../components/ui/error-state.tsx';
import { LoadingState } from '../../../components/ui/loading-state.tsx';
import { TextField } from '../../../components/ui/text-field.tsx';
import { useSchemaForm } from '../../../hooks/use-schema-form.ts';
import { formatDateTimeUtc } from '../../../lib/format.ts';
import { useAcceptInvitation } from '../api/accept-invitation.ts';
import { useInvitationPreview } from '../api/get-invitation-preview.ts';

const newAccountSchema = acceptInvitationBodySchema.pick({ name: true, password: true }).required();

export interface AcceptInvitationPanelProps {
  token: string;
  /** The signed-in user, or null. */
  me: MeResponse | null;
  /** Where the sign-in page is, coming back here afterwards. */
  signInHref: string;
  onAccepted: (me: MeResponse) => void;
  /** Shown when the signed-in account is not the invited one. */
  signOut: ReactNode;
}

function Offer({ preview }: { preview: InvitationPreview }) {
  return (
    <DescriptionList
      className="mb-5"
      items={[
        { term: 'Department', description: preview.departmentName },
        { term: 'Role', description: ROLE_LABELS[preview.role] },
        { term: 'Invited by', description: preview.invitedByName },
        { term: 'For', description: preview.email },
        { term: 'Link valid until', description: formatDateTimeUtc(preview.expiresAt) },
      ]}
    />
  );
}

function NewAccountForm({ token, email, onAccepted }: { token: string; email: string; onAccepted: (me: MeResponse) => void }) {
  const accept = useAcceptInvitation();
  const form = useSchemaForm(newAccountSchema, async (values) => onAccepted(await accept.mutateAsync({ token, ...values })));
  return (
    <form {...form.formProps} className="flex flex-col gap-5" aria-label="Create your account">
      <Alert message={form.formError} />
      <TextField label="E-mail" value={email} readOnly />
      <TextField label="Name" name="name" autoComplete="name" required error={form.fieldErrors.name} />
      <TextField
        label="Password"
        name="password"
        type="password"
        autoComplete="new-password"
        hint={`At least ${PASSWORD_MIN_LENGTH} characters.`}
        required
        error={form.fieldErrors.password}
      />
      <Button type="submit" pending={form.submitting} className="w-full">
        Create account and join
      </Button>
    </form>
  );
}

/** The page behind an invitation link: what it offers, and the one way to accept that fits who is here. */
export function AcceptInvitationPanel({ token, me, signInHref, onAccepted, signOut }: AcceptInvitationPanelProps) {
  const preview = useInvitationPreview(token);
  const accept = useAcceptInvitation();
  if (!token) return <Alert message="This page needs the link from the invitation e-mail; open that link again." />;
  if (preview.isPending) return <LoadingState label="Checking the invitation…" />;
  if (preview.isError) return <ErrorState error={preview.error} title="This invitation cannot be used" />;
  const invite = preview.data;

  if (me && me.user.email !== invite.email) {
    return (
      <>
        <Offer preview={invite} />
        <Alert message={`This invitation is for ${invite.email}, but you are signed in as ${me.user.email}. Sign out, then open the link again.`} className="mb-4" />
        {signOut}
      </>
    );
  }
  if (me) {
    return (
      <>
        <Offer preview={invite} />
        <Alert message={accept.isError ? errorMessage(accept.error) : undefined} className={accept.isError ? 'mb-4' : undefined} />
        <Button className="w-full" pending={accept.isPending} onClick={() => accept.mutate({ token }, { onSuccess: onAccepted })}>
          Join {invite.departmentName}
        </Button>
      </>
    );
  }
  // The preview never says whether the address has an account (that would let a link holder
  // probe addresses): both ways are offered, as the e-mail explains.
  return (
    <>
      <Offer preview={invite} />
      <p className="mb-4 text-foam-300">
        Already have a Tidefield account with {invite.email}?{' '}
        <Link to={signInHref} className="font-bold">
          Sign in to accept
        </Link>{' '}
        and you come back here to join. Otherwise create your account below.
      </p>
      <NewAccountForm token={token} email={invite.email} onAccepted={onAccepted} />
    </>
  );
}
