import { PageHeader } from '../../components/ui/page-header.tsx';
import { EmailForm, NameForm, PasswordForm, SessionsPanel } from '../../features/account/components/settings-forms.tsx';
import { NotificationSettingsForm } from '../../features/account/components/notification-settings-form.tsx';
import { useSignedInMe } from '../../features/auth/hooks/use-signed-in-me.ts';
import { AccountPanel } from '../../features/overview/components/account-panel.tsx';

/** Everything about the user's own account in one place: who they are, how they sign in, and what they are told by e-mail. */
export function Component() {
  const me = useSignedInMe();
  return (
    <>
      <PageHeader eyebrow={me.department.name} title="Settings" description="Your name, address, password, sessions and e-mail notices." />
      <div className="grid items-start gap-6 lg:grid-cols-2">
        <AccountPanel me={me} />
        <NameForm name={me.user.name} />
        <EmailForm email={me.user.email} />
        <PasswordForm userId={me.user.id} />
        <SessionsPanel userId={me.user.id} />
        <div id="notices" className="scroll-mt-6">
          <NotificationSettingsForm userId={me.user.id} email={me.user.email} />
        </div>
      </div>
    </>
  );
}
