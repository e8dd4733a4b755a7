import { PageHeader } from '../../components/ui/page-header.tsx';
import { NotificationSettingsForm } from '../../features/account/components/notification-settings-form.tsx';
import { useSignedInMe } from '../../features/auth/hooks/use-signed-in-me.ts';

export function Component() {
  const me = useSignedInMe();
  return (
    <>
      <PageHeader title="E-mail notices" description="Tidefield can tell you by e-mail when a long run of yours ends." />
      <NotificationSettingsForm userId={me.user.id} email={me.user.email} />
    </>
  );
}
