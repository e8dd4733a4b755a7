import { useQueryClient } from '@tanstack/react-query';
import { PageHeader } from '../../components/ui/page-header.tsx';
import { getMeQueryOptions } from '../../lib/api/get-me.ts';
import { useSignedInMe } from '../../features/auth/hooks/use-signed-in-me.ts';
import { InviteMemberForm } from '../../features/members/components/invite-member-form.tsx';
import { MembersPanel } from '../../features/members/components/members-panel.tsx';
import { useCreateInvitation } from '../../features/invitations/api/create-invitation.ts';
import { PendingInvitations } from '../../features/invitations/components/pending-invitations.tsx';

export function Component() {
  const me = useSignedInMe();
  const queryClient = useQueryClient();
  const invite = useCreateInvitation(me.department.id);
  return (
    <>
      <PageHeader
        eyebrow={me.department.name}
        title="Members"
        description="Who belongs to the department and what each may do: observers read and compare, modellers also write scenarios and start heavy runs, admins also manage members and credits."
      />
      <div className="flex flex-col gap-6">
        <MembersPanel
          departmentId={me.department.id}
          departmentName={me.department.name}
          currentUserId={me.user.id}
          onOwnMembershipChanged={() => void queryClient.invalidateQueries({ queryKey: getMeQueryOptions().queryKey })}
        />
        <InviteMemberForm onInvite={(values) => invite.mutateAsync(values)} />
        <PendingInvitations departmentId={me.department.id} />
      </div>
    </>
  );
}
