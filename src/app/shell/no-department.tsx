import { useNavigate } from 'react-router-dom';
import type { MeResponse } from '../../../shared/contracts/auth.ts';
import { DocumentTitle } from '../../components/ui/document-title.tsx';
import { EmptyState } from '../../components/ui/empty-state.tsx';
import { TidefieldMark } from '../../components/ui/icons.tsx';
import { paths } from '../../config/paths.ts';
import { SignOutButton } from '../../features/auth/components/sign-out-button.tsx';

/** What a signed-in user sees after every one of their memberships was removed. */
export function NoDepartment({ me }: { me: MeResponse }) {
  const navigate = useNavigate();
  return (
    <main className="mx-auto flex min-h-dvh max-w-2xl flex-col justify-center gap-6 px-4 py-10">
      <DocumentTitle title="No department" />
      <p className="flex items-center gap-3 text-xl font-bold">
        <TidefieldMark />
        Tidefield
      </p>
      <EmptyState
        headingLevel={1}
        title="You are not in a department any more"
        action={<SignOutButton onSignedOut={() => navigate(paths.signIn.getHref(), { replace: true })} />}
      >
        You are signed in as {me.user.name} ({me.user.email}), but no department lists you as a member, so there is
        nothing to show. An admin of your department can add you again.
      </EmptyState>
    </main>
  );
}
