import type { Member } from '../../../shared/contracts/members.ts';
import type { Role } from '../../../shared/contracts/roles.ts';
import type { Db } from '../../db/client.ts';
import { recordAudit } from '../audit/audit.service.ts';
import type { RequestAuth } from '../../lib/request-auth.ts';
import { departmentOf } from '../../lib/request-auth.ts';
import { deleteMembership, lockMemberships, membersOfDepartment, updateRole } from './departments.repository.ts';
import { lastAdmin, memberNotFound } from './members.errors.ts';

function toMember(row: { userId: string; email: string; name: string; role: Role; joinedAt: Date }): Member {
  return { ...row, joinedAt: row.joinedAt.toISOString() };
}

export function createMembersService(db: Db) {
  return {
    async list(auth: RequestAuth): Promise<Member[]> {
      return (await membersOfDepartment(db, departmentOf(auth).id)).map(toMember);
    },

    /** Changes a member's role; refuses to leave the department without an admin. */
    async changeRole(auth: RequestAuth, userId: string, role: Role): Promise<Member> {
      const department = departmentOf(auth);
      await db.transaction(async (tx) => {
        const rows = await lockMemberships(tx, department.id);
        const target = rows.find((r) => r.userId === userId);
        if (!target) throw memberNotFound();
        if (target.role === role) return;
        const adminsAfter = rows.filter((r) => (r.userId === userId ? role : r.role) === 'admin').length;
        if (adminsAfter === 0) throw lastAdmin();
        await updateRole(tx, department.id, userId, role);
        await recordAudit(tx, {
          departmentId: department.id,
          actorUserId: auth.user.id,
          action: 'member.role_changed',
          target: userId,
          detail: { from: target.role, to: role },
        });
      });
      const member = (await membersOfDepartment(db, department.id)).find((m) => m.userId === userId);
      if (!member) throw memberNotFound();
      return toMember(member);
    },

    async remove(auth: RequestAuth, userId: string): Promise<void> {
      const department = departmentOf(auth);
      await db.transaction(async (tx) => {
        const rows = await lockMemberships(tx, department.id);
        const target = rows.find((r) => r.userId === userId);
        if (!target) throw memberNotFound();
        if (target.role === 'admin' && rows.filter((r) => r.role === 'admin').length === 1) throw lastAdmin();
        await deleteMembership(tx, department.id, userId);
        await recordAudit(tx, {
          departmentId: department.id,
          actorUserId: auth.user.id,
          action: 'member.removed',
          target: userId,
          detail: { role: target.role },
        });
      });
    },
  };
}

export type MembersService = ReturnType<typeof createMembersService>;
