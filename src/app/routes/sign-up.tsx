import { Link, Navigate, useNavigate, useSearchParams } from 'react-router-dom';
import { paths, redirectTargetFrom } from '../../config/paths.ts';
import { useMe } from '../../features/auth/api/get-me.ts';
import { AuthLayout } from '../../features/auth/components/auth-layout.tsx';
import { SignUpForm } from '../../features/auth/components/sign-up-form.tsx';

export function Component() {
  const me = useMe();
  const navigate = useNavigate();
  const [search] = useSearchParams();
  const target = redirectTargetFrom(search);

  if (me.data) return <Navigate to={target} replace />;
  return (
    <AuthLayout
      title="Create an account"
      intro="One account for the web pages, the REST API and the command line."
      footer={
        <>
          Already have an account? <Link to={paths.signIn.getHref(target)}>Sign in</Link>
        </>
      }
    >
      <SignUpForm onSignedUp={() => navigate(target, { replace: true })} />
    </AuthLayout>
  );
}
