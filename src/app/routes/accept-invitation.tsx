import { useQueryClient } from '@tanstack/react-query';
import { Link, useLocation, useNavigate, useSearchParams } from 'react-router-dom';
import { LoadingState } from '../../components/ui/loading-state.tsx';
import { paths } from '../../config/paths.ts';
import { getMeQueryOptions, isMeQuery, useMe } from '../../lib/api/get-me.ts';
import { AuthLayout } from '../../features/auth/components/auth-layout.tsx';
import { SignOutButton } from '../../features/auth/components/sign-out-button.tsx';
import { AcceptInvitationPanel } from '../../features/invitations/components/accept-invitation-panel.tsx';

export function Component() {
  const me = useMe();
  const [search] = useSearchParams();
  const location = useLocation();
  const navigate = useNavigate();
  const queryClient = useQueryClient();
  const here = location.pathname + location.search;

  return (
    <AuthLayout
      title="Join a department"
      intro="An admin invited you to work with their department on Tidefield."
      footer={
        <>
          Not for you? You can close this page: nothing happens unless you accept. <Link to={paths.overview.getHref()}>Go to Tidefield</Link>
        </>
      }
    >
      {me.isPending ? (
        <LoadingState label="Checking your session…" />
      ) : (
        <AcceptInvitationPanel
          token={search.get('token') ?? ''}
          me={me.data ?? null}
          signInHref={paths.signIn.getHref(here)}
          signOut={<SignOutButton onSignedOut={() => navigate(here, { replace: true })} />}
          onAccepted={(accepted) => {
            // The new department is the active one now: drop what was cached for another.
            queryClient.removeQueries({ predicate: (query) => !isMeQuery(query) });
            queryClient.setQueryData(getMeQueryOptions().queryKey, accepted);
            navigate(paths.overview.getHref(), { replace: true });
          }}
        />
      )}
    </AuthLayout>
  );
}
