import { roleAtLeast, type Role } from '../../shared/contracts/roles.ts';
import type { PathKey } from '../config/paths.ts';

export interface NavItem {
  key: PathKey;
  label: string;
  /** What the page is for, in one sentence. */
  summary: string;
  /** The weakest role that sees it (the server enforces; this only hides). */
  minimumRole: Role;
}

export interface NavGroup {
  /** Null for the ungrouped top entry. */
  label: string | null;
  items: readonly NavItem[];
}

export const NAV_GROUPS: readonly NavGroup[] = [
  {
    label: null,
    items: [{ key: 'overview', label: 'Overview', summary: 'You, your department and the service.', minimumRole: 'observer' }],
  },
  {
    label: 'Model',
    items: [
      {
        key: 'scenarios',
        label: 'Scenarios',
        summary:
          'Describe a Galactic population (IMF, star-formation history, companions, giant-branch and common-envelope physics) and keep it as a scenario.',
        minimumRole: 'observer',
      },
      {
        key: 'runs',
        label: 'Runs',
        summary:
          'Seeded Monte Carlo runs of a scenario: the predicted magnetic fraction with its error, split by channel, with mass and field distributions.',
        minimumRole: 'observer',
      },
      {
        key: 'sweeps',
        label: 'Sweeps',
        summary: 'One scenario across a parameter grid, with the same seed at every point, to see how the answer moves.',
        minimumRole: 'observer',
      },
      {
        key: 'fits',
        label: 'Fits',
        summary: 'Which parameter values all the observations together allow: posteriors on a grid, scored against a constraint set.',
        minimumRole: 'observer',
      },
    ],
  },
  {
    label: 'Observe',
    items: [
      {
        key: 'impliedOccurrence',
        label: 'Implied occurrence',
        summary: 'The companion occurrence multiplier that observed magnetic counts allow, at 68% and 95%.',
        minimumRole: 'observer',
      },
      {
        key: 'compare',
        label: 'Compare',
        summary: 'Two to four finished runs side by side on the same axes: fractions with their errors, mass and field distributions, differences in σ.',
        minimumRole: 'observer',
      },
      {
        key: 'constraintSets',
        label: 'Constraint sets',
        summary: 'The observations a run is judged by at once: published constraints and your own counts, masses, fields, cooling ages and periods.',
        minimumRole: 'observer',
      },
      {
        key: 'twoSample',
        label: 'Two-sample test',
        summary: 'Whether two observed samples can share one magnetic fraction: Fisher exact test, σ and both intervals.',
        minimumRole: 'observer',
      },
      {
        key: 'samples',
        label: 'Samples',
        summary: 'Observed counts of white dwarfs, magnetic or not, kept for comparison with runs.',
        minimumRole: 'observer',
      },
      {
        key: 'occurrenceTables',
        label: 'Occurrence tables',
        summary: 'Tables of planet, brown-dwarf and stellar-companion occurrence by mass and period, stored or uploaded.',
        minimumRole: 'observer',
      },
    ],
  },
  {
    label: 'Account',
    items: [
      { key: 'apiTokens', label: 'API tokens', summary: 'Tokens for the REST API and the command line.', minimumRole: 'observer' },
      { key: 'settings', label: 'Settings', summary: 'Your name, e-mail address, password, signed-in sessions and e-mail notices.', minimumRole: 'observer' },
      { key: 'outbox', label: 'Outbox', summary: "Your e-mail, and admins' department notices, as the local mail stand-in received them (development).", minimumRole: 'observer' },
    ],
  },
  {
    label: 'Department',
    items: [
      { key: 'members', label: 'Members', summary: 'Who belongs to the department, with which role.', minimumRole: 'admin' },
      { key: 'credits', label: 'Credits', summary: 'Compute credit for heavy runs: buy it, see usage and receipts.', minimumRole: 'admin' },
      { key: 'workers', label: 'Workers', summary: 'The machines and threads computing runs, and the jobs each has done.', minimumRole: 'admin' },
    ],
  },
];

/** The navigation a role sees, without empty groups. */
export function navigationFor(role: Role): NavGroup[] {
  return NAV_GROUPS.map((group) => ({ ...group, items: group.items.filter((item) => roleAtLeast(role, item.minimumRole)) })).filter(
    (group) => group.items.length > 0,
  );
}

export function navItem(key: PathKey): NavItem {
  const item = NAV_GROUPS.flatMap((group) => group.items).find((i) => i.key === key);
  if (!item) throw new Error(`No navigation entry for ${key}`);
  return item;
}
