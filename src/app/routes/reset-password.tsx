import { useState } from 'react';
import { Link, useSearchParams } from 'react-router-dom';
import { Alert } from '../../components/ui/alert.tsx';
import { paths } from '../../config/paths.ts';
import { ResetPasswordForm } from '../../features/account/components/reset-password-form.tsx';
import { AuthLayout } from '../../features/auth/components/auth-layout.tsx';

export function Component() {
  const [search] = useSearchParams();
  const [done, setDone] = useState(false);
  return (
    <AuthLayout
      title="Choose a new password"
      intro="The link from the e-mail works once and for one hour."
      footer={
        <>
          Link expired? <Link to={paths.forgotPassword.getHref()}>Ask for a new one</Link>
        </>
      }
    >
      {done ? (
        <Alert
          tone="success"
          message={
            <>
              Your password was changed and every other session ended. <Link to={paths.signIn.getHref()}>Sign in</Link> with the new one.
            </>
          }
        />
      ) : (
        <ResetPasswordForm token={search.get('token') ?? ''} onDone={() => setDone(true)} />
      )}
    </AuthLayout>
  );
}
