import { useNavigate } from 'react-router-dom';
import { RoleBadge } from '../../components/role-badge.tsx';
import { paths } from '../../config/paths.ts';
import { DepartmentSwitcher } from '../../features/auth/components/department-switcher.tsx';
import { SignOutButton } from '../../features/auth/components/sign-out-button.tsx';
import type { ActiveMe } from '../../lib/active-me.ts';
import { cx } from '../../lib/class-names.ts';

export interface UserPanelProps {
  me: ActiveMe;
  /** `bar`: one row in the top bar of wide screens; `stack`: a column in the mobile menu. */
  layout: 'bar' | 'stack';
}

/** Who is signed in, in which department and role; switching department; signing out. */
export function UserPanel({ me, layout }: UserPanelProps) {
  const navigate = useNavigate();
  const bar = layout === 'bar';
  return (
    <section
      aria-label="Your account"
      className={cx(bar ? 'flex w-full min-w-0 items-center gap-5' : 'flex flex-col gap-3 border-t border-ink-700 p-4')}
    >
      <div className={cx('min-w-0', bar && 'mr-auto max-w-md')}>
        <DepartmentSwitcher me={me} compact={bar} />
      </div>
      <div className={cx('flex min-w-0 gap-2', bar ? 'items-center' : 'flex-col items-start')}>
        <p className="min-w-0 font-bold break-words">
          {me.user.name}
          <span className="sr-only">, {me.user.email}</span>
        </p>
        <RoleBadge role={me.role} />
      </div>
      <SignOutButton onSignedOut={() => navigate(paths.signIn.getHref(), { replace: true })} />
    </section>
  );
}
