import { Link, Navigate } from 'react-router-dom';
import { Alert } from '../../components/ui/alert.tsx';
import { errorMessage } from '../../components/ui/error-state.tsx';
import { LoadingState } from '../../components/ui/loading-state.tsx';
import { paths } from '../../config/paths.ts';
import { useLinkToken } from '../../hooks/use-link-token.ts';
import { useConfirmSignUp } from '../../features/auth/api/sign-up.ts';
import { AuthLayout } from '../../features/auth/components/auth-layout.tsx';

/** Opened from the link mailed after sign-up: creates the account and its department once, then opens the overview. */
export function Component() {
  const confirm = useConfirmSignUp();
  const token = useLinkToken(confirm.mutate);
  if (confirm.isSuccess) return <Navigate to={paths.overview.getHref()} replace />;
  return (
    <AuthLayout
      title="Create your account"
      intro="The link from the e-mail proves the address is yours; opening it creates the account and its department."
      footer={
        <>
          Have an account already? <Link to={paths.signIn.getHref()}>Sign in</Link>
        </>
      }
    >
      {!token ? (
        <Alert message="This page needs the link from the sign-up e-mail; open that link again." />
      ) : confirm.isError ? (
        <div className="flex flex-col gap-3">
          <Alert message={errorMessage(confirm.error)} />
          <Link to={paths.signUp.getHref()}>Sign up again</Link>
        </div>
      ) : (
        <LoadingState label="Creating your account…" />
      )}
    </AuthLayout>
  );
}
