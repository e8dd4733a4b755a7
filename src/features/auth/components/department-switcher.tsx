import type { ActiveMe } from '../../../lib/active-me.ts';
import { ROLE_LABELS } from '../../../../shared/contracts/roles.ts';
import { Select } from '../../../components/ui/select.tsx';
import { errorMessage } from '../../../components/ui/error-state.tsx';
import { useSwitchDepartment } from '../api/switch-department.ts';

/** The active department; a select when the user belongs to more than one. */
export function DepartmentSwitcher({ me, compact = false }: { me: ActiveMe; compact?: boolean }) {
  const switchDepartment = useSwitchDepartment();

  if (me.memberships.length < 2) {
    return (
      <p className="truncate text-foam-300" title={me.department.name}>
        <span className="sr-only">Department: </span>
        {me.department.name}
      </p>
    );
  }

  return (
    <Select
      label="Active department"
      hideLabel={compact}
      value={switchDepartment.isPending ? switchDepartment.variables : me.department.id}
      disabled={switchDepartment.isPending}
      error={switchDepartment.isError ? errorMessage(switchDepartment.error) : undefined}
      onChange={(event) => switchDepartment.mutate(event.target.value)}
      options={me.memberships.map((m) => ({ value: m.departmentId, label: `${m.departmentName} (${ROLE_LABELS[m.role]})` }))}
    />
  );
}
