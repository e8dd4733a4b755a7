import { Link } from 'react-router-dom';
import { ROLE_LABELS, ROLES, roleAtLeast, type Role } from '../../../../shared/contracts/roles.ts';
import { Card } from '../../../components/ui/card.tsx';
import { paths } from '../../../config/paths.ts';
import { cx } from '../../../lib/class-names.ts';
import { roleWithArticle } from '../../../lib/role-text.ts';
import { ROLE_ABILITIES } from './role-abilities.ts';

/** The abilities of the user's role and, dimmed, what the higher roles would add. */
export function WhatYouCanDo({ role }: { role: Role }) {
  return (
    <Card title="What you can do here" description={`As ${roleWithArticle(role)} in this department:`}>
      <div className="flex flex-col gap-6">
        {ROLES.map((level, index) => {
          const granted = roleAtLeast(role, level);
          const heading =
            index === 0 ? 'Everyone' : granted ? `${ROLE_LABELS[level]}s also` : `${ROLE_LABELS[level]}s also (ask an admin)`;
          return (
            <section key={level} aria-label={heading} className={cx(!granted && 'text-foam-400')}>
              <h3 className={cx('mb-2 font-bold', granted ? 'text-foam-50' : 'text-foam-400')}>{heading}</h3>
              <ul className="flex flex-col gap-2">
                {ROLE_ABILITIES[level].map((ability) => (
                  <li key={ability.text} className="flex gap-2.5">
                    <span aria-hidden="true" className={granted ? 'text-kelp-300' : 'text-ink-500'}>
                      {granted ? '●' : '○'}
                    </span>
                    <span className={granted ? 'text-foam-300' : undefined}>
                      {ability.text}
                      {granted && ability.page && (
                        <>
                          {' '}
                          <Link to={paths[ability.page.key].getHref()} className="text-sm whitespace-nowrap">
                            {ability.page.label}
                          </Link>
                        </>
                      )}
                    </span>
                  </li>
                ))}
              </ul>
            </section>
          );
        })}
      </div>
    </Card>
  );
}
