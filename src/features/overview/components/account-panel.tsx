import type { ActiveMe } from '../../../lib/active-me.ts';
import { RoleBadge } from '../../../components/role-badge.tsx';
import { Card } from '../../../components/ui/card.tsx';
import { DescriptionList } from '../../../components/ui/description-list.tsx';

export function AccountPanel({ me }: { me: ActiveMe }) {
  const others = me.memberships.filter((m) => m.departmentId !== me.department.id);
  return (
    <Card title="You">
      <DescriptionList
        items={[
          { term: 'Name', description: me.user.name },
          { term: 'E-mail', description: me.user.email },
          { term: 'Department', description: me.department.name },
          { term: 'Your role', description: <RoleBadge role={me.role} /> },
          ...(others.length > 0
            ? [
                {
                  term: 'Also member of',
                  description: (
                    <ul className="flex flex-col gap-1">
                      {others.map((m) => (
                        <li key={m.departmentId} className="flex flex-wrap items-center gap-2">
                          {m.departmentName} <RoleBadge role={m.role} />
                        </li>
                      ))}
                    </ul>
                  ),
                },
              ]
            : []),
        ]}
      />
    </Card>
  );
}
