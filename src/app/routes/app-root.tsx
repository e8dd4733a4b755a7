import { Navigate, useLocation } from 'react-router-dom';
import { ErrorState } from '../../components/ui/error-state.tsx';
import { LoadingState } from '../../components/ui/loading-state.tsx';
import { paths } from '../../config/paths.ts';
import { useMe } from '../../lib/api/get-me.ts';
import { hasActiveDepartment } from '../../lib/active-me.ts';
import { AppShell } from '../shell/app-shell.tsx';
import { NoDepartment } from '../shell/no-department.tsx';

/** The sign-in guard around every page of the app: signed-out users go to sign in, then back here. */
export function Component() {
  const me = useMe();
  const location = useLocation();

  if (me.data) return hasActiveDepartment(me.data) ? <AppShell me={me.data} /> : <NoDepartment me={me.data} />;
  if (me.data === null) {
    return <Navigate to={paths.signIn.getHref(location.pathname + location.search + location.hash)} replace />;
  }
  if (me.isError) {
    return (
      <div className="mx-auto flex min-h-dvh max-w-xl items-center px-4">
        <ErrorState
          error={me.error}
          title="Tidefield could not check your session"
          onRetry={() => void me.refetch()}
          retrying={me.isFetching}
          className="w-full"
        />
      </div>
    );
  }
  return <LoadingState variant="page" label="Opening Tidefield…" />;
}
