import { Link } from 'react-router-dom';
import { paths } from '../../config/paths.ts';
import { ForgotPasswordForm } from '../../features/account/components/forgot-password-form.tsx';
import { AuthLayout } from '../../features/auth/components/auth-layout.tsx';

export function Component() {
  return (
    <AuthLayout
      title="Forgot your password?"
      intro="Give the e-mail address of your account and Tidefield sends a link to choose a new password."
      footer={
        <>
          Remembered it? <Link to={paths.signIn.getHref()}>Sign in</Link>
        </>
      }
    >
      <ForgotPasswordForm />
    </AuthLayout>
  );
}
