import { Link } from 'react-router-dom';
import { Alert } from '../../components/ui/alert.tsx';
import { errorMessage } from '../../components/ui/error-state.tsx';
import { LoadingState } from '../../components/ui/loading-state.tsx';
import { paths } from '../../config/paths.ts';
import { useLinkToken } from '../../hooks/use-link-token.ts';
import { useConfirmEmailChange } from '../../features/account/api/confirm-email-change.ts';
import { AuthLayout } from '../../features/auth/components/auth-layout.tsx';

/** Opened from the link mailed to a new address: confirms it once. */
export function Component() {
  const confirm = useConfirmEmailChange();
  const token = useLinkToken(confirm.mutate);
  return (
    <AuthLayout title="Confirm your new address" intro="Tidefield checks that the new address is yours before you sign in with it." footer={<Link to={paths.settings.getHref()}>Go to Settings</Link>}>
      {!token ? (
        <Alert message="This page needs the link from the confirmation e-mail; open that link again." />
      ) : confirm.isPending || confirm.isIdle ? (
        <LoadingState label="Confirming…" />
      ) : confirm.isError ? (
        <Alert message={errorMessage(confirm.error)} />
      ) : (
        <Alert tone="success" message={confirm.data?.message} />
      )}
    </AuthLayout>
  );
}
