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
        description="In local development Tidefield sends e-mail to a stand-in mail server instead of real inboxes. What it sent about this department is here, so invitation and reset links can be followed."
      />
      <OutboxList departmentId={me.department.id} />
    </>
  );
}
