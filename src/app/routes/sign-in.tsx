import { Link, Navigate, useNavigate, useSearchParams } from 'react-router-dom';
import { paths, redirectTargetFrom } from '../../config/paths.ts';
import { useMe } from '../../features/auth/api/get-me.ts';
import { AuthLayout } from '../../features/auth/components/auth-layout.tsx';
import { SignInForm } from '../../features/auth/components/sign-in-form.tsx';

export function Component() {
  const me = useMe();
  const navigate = useNavigate();
  const [search] = useSearchParams();
  const target = redirectTargetFrom(search);

  if (me.data) return <Navigate to={target} replace />;
  return (
    <AuthLayout
      title="Sign in"
      intro="Welcome back. Sign in to your department's scenarios, runs and samples."
      footer={
        <>
          New to Tidefield? <Link to={paths.signUp.getHref(target)}>Create an account</Link>
        </>
      }
    >
      <SignInForm onSignedIn={() => navigate(target, { replace: true })} />
    </AuthLayout>
  );
}
