import type { Invitation } from '../../../../shared/contracts/invitations.ts';
import { ROLE_LABELS } from '../../../../shared/contracts/roles.ts';
import { Alert } from '../../../components/ui/alert.tsx';
import { Button } from '../../../components/ui/button.tsx';
import { Card } from '../../../components/ui/card.tsx';
import { EmptyState } from '../../../components/ui/empty-state.tsx';
import { ErrorState, errorMessage } from '../../../components/ui/error-state.tsx';
import { LoadingState } from '../../../components/ui/loading-state.tsx';
import { Table, type TableColumn } from '../../../components/ui/table.tsx';
import { formatDate } from '../../../lib/format.ts';
import { useInvitations } from '../api/get-invitations.ts';
import { useRevokeInvitation } from '../api/revoke-invitation.ts';

/** Invitations sent and not yet used, with a way to withdraw each. */
export function PendingInvitations({ departmentId }: { departmentId: string }) {
  const invitations = useInvitations(departmentId);
  const revoke = useRevokeInvitation(departmentId);
  const columns: TableColumn<Invitation>[] = [
    { id: 'email', header: 'E-mail', rowHeader: true, sortValue: (i) => i.email, cell: (i) => i.email },
    { id: 'role', header: 'Role', cell: (i) => ROLE_LABELS[i.role] },
    { id: 'by', header: 'Invited by', cell: (i) => i.invitedByName },
    { id: 'expires', header: 'Link valid until', cell: (i) => <span className="whitespace-nowrap">{formatDate(i.expiresAt)}</span> },
    {
      id: 'actions',
      header: <span className="sr-only">Actions</span>,
      stackedLabel: false,
      align: 'end',
      cell: (i) => (
        <Button variant="ghost" size="sm" className="text-coral-300" pending={revoke.isPending && revoke.variables === i.id} onClick={() => revoke.mutate(i.id)}>
          Withdraw<span className="sr-only"> the invitation of {i.email}</span>
        </Button>
      ),
    },
  ];
  return (
    <Card title="Open invitations" description="Each link works once, for seven days. Inviting the same address again replaces its link.">
      <Alert message={revoke.isError ? errorMessage(revoke.error) : undefined} className={revoke.isError ? 'mb-4' : undefined} />
      {invitations.isPending ? (
        <LoadingState label="Loading invitations…" />
      ) : invitations.isError ? (
        <ErrorState error={invitations.error} title="The invitations could not be loaded" onRetry={() => void invitations.refetch()} retrying={invitations.isFetching} />
      ) : (
        <Table
          caption="Open invitations"
          hideCaption
          columns={columns}
          rows={invitations.data.invitations}
          rowKey={(i) => i.id}
          initialSort={{ columnId: 'email', direction: 'ascending' }}
          stackOnNarrow
          empty={<EmptyState title="No open invitations">Invitations you send appear here until they are accepted.</EmptyState>}
        />
      )}
    </Card>
  );
}
