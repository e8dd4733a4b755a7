import { Link, Navigate } from 'react-router-dom';
import { paths } from '../../config/paths.ts';
import { AuthLayout } from '../../features/auth/components/auth-layout.tsx';
import { SignUpForm } from '../../features/auth/components/sign-up-form.tsx';
import { useAuthRedirect } from '../../features/auth/hooks/use-auth-redirect.ts';

export function Component() {
  const { target, signedIn } = useAuthRedirect();
  if (signedIn) return <Navigate to={target} replace />;
  return (
    <AuthLayout
      title="Create an account"
      intro="One account for the web pages, the REST API and the command line. We e-mail you a link that creates it."
      footer={
        <>
          Already have an account? <Link to={paths.signIn.getHref(target)}>Sign in</Link>
        </>
      }
    >
      <SignUpForm />
    </AuthLayout>
  );
}
