import { Link, Navigate } from 'react-router-dom';
import { paths } from '../../config/paths.ts';
import { AuthLayout } from '../../features/auth/components/auth-layout.tsx';
import { SignInForm } from '../../features/auth/components/sign-in-form.tsx';
import { useAuthRedirect } from '../../features/auth/hooks/use-auth-redirect.ts';

export function Component() {
  const { target, signedIn, proceed } = useAuthRedirect();
  if (signedIn) return <Navigate to={target} replace />;
  return (
    <AuthLayout
      title="Sign in"
      intro="Welcome back. Sign in to your department's scenarios, runs and samples."
      footer={
        <>
          New to Tidefield? <Link to={paths.signUp.getHref(target)}>Create an account</Link>
          <span className="mt-2 block">
            <Link to={paths.forgotPassword.getHref()}>Forgot your password?</Link>
          </span>
        </>
      }
    >
      <SignInForm onSignedIn={proceed} />
    </AuthLayout>
  );
}
