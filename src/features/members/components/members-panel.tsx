import { useState } from 'react';
import { ROLE_LABELS, ROLES, type Role } from '../../../../shared/contracts/roles.ts';
import type { Member } from '../../../../shared/contracts/members.ts';
import { Alert, type AlertTone } from '../../../components/ui/alert.tsx';
import { Badge } from '../../../components/ui/badge.tsx';
import { Button } from '../../../components/ui/button.tsx';
import { Card } from '../../../components/ui/card.tsx';
import { ConfirmDialog } from '../../../components/ui/confirm-dialog.tsx';
import { EmptyState } from '../../../components/ui/empty-state.tsx';
import { errorMessage } from '../../../components/ui/error-state.tsx';
import { QueryState } from '../../../components/ui/query-state.tsx';
import { Select } from '../../../components/ui/select.tsx';
import { Table, type TableColumn } from '../../../components/ui/table.tsx';
import { formatDate } from '../../../lib/format.ts';
import { roleWithArticle } from '../../../lib/role-text.ts';
import { useChangeMemberRole } from '../api/change-member-role.ts';
import { useMembers } from '../api/get-members.ts';
import { useRemoveMember } from '../api/remove-member.ts';

export interface MembersPanelProps {
  departmentId: string;
  departmentName: string;
  currentUserId: string;
  /** The signed-in user's own role or membership changed: the session must be reloaded. */
  onOwnMembershipChanged: () => void;
}

type Pending = { kind: 'remove'; member: Member } | { kind: 'demote-self'; member: Member; role: Role };

const roleOptions = ROLES.map((role) => ({ value: role, label: ROLE_LABELS[role] }));

export function MembersPanel({ departmentId, departmentName, currentUserId, onOwnMembershipChanged }: MembersPanelProps) {
  const members = useMembers(departmentId);
  const changeRole = useChangeMemberRole(departmentId);
  const remove = useRemoveMember(departmentId);
  const [notice, setNotice] = useState<{ tone: AlertTone; text: string } | null>(null);
  const [confirming, setConfirming] = useState<Pending | null>(null);

  const afterOwnChange = (userId: string) => userId === currentUserId && onOwnMembershipChanged();

  function applyRole(member: Member, role: Role) {
    setNotice(null);
    changeRole.mutate(
      { userId: member.userId, role },
      {
        onSuccess: () => {
          setNotice({ tone: 'success', text: `${member.name} is now ${roleWithArticle(role)}.` });
          setConfirming(null);
          afterOwnChange(member.userId);
        },
        onError: (error) => {
          setConfirming(null);
          setNotice({ tone: 'danger', text: errorMessage(error) });
        },
      },
    );
  }

  function requestRole(member: Member, role: Role) {
    if (role === member.role) return;
    // Giving up one's own admin role locks one out of this page: ask first.
    if (member.userId === currentUserId && member.role === 'admin') setConfirming({ kind: 'demote-self', member, role });
    else applyRole(member, role);
  }

  function confirmRemove(member: Member) {
    remove.mutate(member.userId, {
      onSuccess: () => {
        setNotice({ tone: 'success', text: `${member.name} was removed from ${departmentName}.` });
        setConfirming(null);
        afterOwnChange(member.userId);
      },
    });
  }

  const columns: TableColumn<Member>[] = [
    {
      id: 'name',
      header: 'Name',
      rowHeader: true,
      sortValue: (m) => m.name,
      cell: (m) => (
        <span className="flex flex-wrap items-center gap-2">
          {m.name}
          {m.userId === currentUserId && <Badge>you</Badge>}
        </span>
      ),
    },
    { id: 'email', header: 'E-mail', sortValue: (m) => m.email, cell: (m) => m.email },
    {
      id: 'role',
      header: 'Role',
      sortValue: (m) => ROLES.indexOf(m.role),
      cell: (m) => (
        <Select
          label={`Role of ${m.name}`}
          hideLabel
          value={changeRole.isPending && changeRole.variables.userId === m.userId ? changeRole.variables.role : m.role}
          disabled={changeRole.isPending}
          onChange={(event) => requestRole(m, event.target.value as Role)}
          options={roleOptions}
          className="min-w-40 max-md:min-w-0"
        />
      ),
    },
    {
      id: 'joined',
      header: 'Joined',
      sortValue: (m) => new Date(m.joinedAt),
      cell: (m) => <span className="whitespace-nowrap">{formatDate(m.joinedAt)}</span>,
    },
    {
      id: 'actions',
      header: <span className="sr-only">Actions</span>,
      stackedLabel: false,
      align: 'end',
      cell: (m) => (
        <Button
          variant="ghost"
          size="sm"
          className="text-coral-300"
          onClick={() => {
            remove.reset();
            setConfirming({ kind: 'remove', member: m });
          }}
        >
          Remove<span className="sr-only"> {m.name}</span>
        </Button>
      ),
    },
  ];

  return (
    <Card title="People in this department" description="Every department keeps at least one admin.">
      <Alert message={notice?.text} tone={notice?.tone} className={notice ? 'mb-4' : undefined} />
      <QueryState query={members} loadingLabel="Loading members…" errorTitle="The member list could not be loaded">
        {(list) => (
          <Table
            caption={`Members of ${departmentName}`}
            hideCaption
            columns={columns}
            rows={list.members}
            rowKey={(m) => m.userId}
            initialSort={{ columnId: 'name', direction: 'ascending' }}
            stackOnNarrow
            empty={<EmptyState title="No members yet">Invite colleagues by e-mail below.</EmptyState>}
          />
        )}
      </QueryState>

      <ConfirmDialog
        open={confirming?.kind === 'remove'}
        title={confirming ? `Remove ${confirming.member.name}?` : ''}
        confirmLabel="Remove"
        tone="danger"
        pending={remove.isPending}
        error={remove.isError ? errorMessage(remove.error) : undefined}
        onConfirm={() => confirming && confirmRemove(confirming.member)}
        onCancel={() => setConfirming(null)}
      >
        {confirming?.member.userId === currentUserId
          ? `You will leave ${departmentName} and lose access to its scenarios, runs and samples.`
          : `${confirming?.member.name ?? ''} will lose access to the scenarios, runs and samples of ${departmentName}.`}
      </ConfirmDialog>

      <ConfirmDialog
        open={confirming?.kind === 'demote-self'}
        title="Give up your admin role?"
        confirmLabel={confirming?.kind === 'demote-self' ? `Become ${ROLE_LABELS[confirming.role].toLowerCase()}` : 'Confirm'}
        tone="danger"
        pending={changeRole.isPending}
        onConfirm={() => confirming?.kind === 'demote-self' && applyRole(confirming.member, confirming.role)}
        onCancel={() => setConfirming(null)}
      >
        You will no longer be able to manage members or credits of {departmentName}. Another admin can give the role
        back.
      </ConfirmDialog>
    </Card>
  );
}
