import { NavLink } from 'react-router-dom';
import type { Role } from '../../../shared/contracts/roles.ts';
import { paths } from '../../config/paths.ts';
import { cx } from '../../lib/class-names.ts';
import { navigationFor } from '../nav-items.ts';

/** The main navigation, grouped; only what the role may use. */
export function NavMenu({ role, onNavigate }: { role: Role; onNavigate?: () => void }) {
  return (
    <nav aria-label="Main" className="flex flex-col gap-5 px-3 pt-2 pb-6">
      {navigationFor(role).map((group) => (
        <div key={group.label ?? 'top'}>
          {group.label && <h2 className="mb-1 px-3 text-sm font-bold tracking-wide text-foam-400 uppercase">{group.label}</h2>}
          <ul className="flex flex-col gap-0.5">
            {group.items.map((item) => (
              <li key={item.key}>
                <NavLink
                  to={paths[item.key].getHref()}
                  end={item.key === 'overview'}
                  onClick={onNavigate}
                  className={({ isActive }) =>
                    cx(
                      'flex min-h-10 items-center rounded-md border-l-4 px-3 py-1.5 no-underline transition-colors',
                      isActive
                        ? 'border-lantern-400 bg-ink-800 font-bold text-foam-50'
                        : 'border-transparent text-foam-300 hover:bg-ink-800 hover:text-foam-50',
                    )
                  }
                >
                  {item.label}
                </NavLink>
              </li>
            ))}
          </ul>
        </div>
      ))}
    </nav>
  );
}
