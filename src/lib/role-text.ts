import { ROLE_LABELS, type Role } from '../../shared/contracts/roles.ts';

/** "an observer", "a modeller", "an admin": for sentences about a role. */
export function roleWithArticle(role: Role): string {
  const label = ROLE_LABELS[role].toLowerCase();
  return `${/^[aeiou]/.test(label) ? 'an' : 'a'} ${label}`;
}
