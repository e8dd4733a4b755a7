import { PageHeader } from '../../components/ui/page-header.tsx';
import { useSignedInMe } from '../../features/auth/hooks/use-signed-in-me.ts';
import { OutboxList } from '../../features/outbox/components/outbox-list.tsx';

export function Component() {
  const me = useSignedInMe();
  return (
    <>
      <PageHeader
        eyebrow={me.department.name}
        title="Outbox"
        description={
          me.role === 'admin'
            ? "In local development Tidefield sends e-mail to a stand-in mail server instead of real inboxes. Here is the mail sent to you, and this department's receipts and run notices. Links that grant access (invitations, password resets) are shown to their recipient only."
            : 'In local development Tidefield sends e-mail to a stand-in mail server instead of real inboxes. Here is the mail sent to you, so that your own links can be followed.'
        }
      />
      <OutboxList departmentId={me.department.id} />
    </>
  );
}
