import type { Role } from '../../../../shared/contracts/roles.ts';
import type { PathKey } from '../../../config/paths.ts';

export interface Ability {
  text: string;
  /** The page where it is done. */
  page?: { key: PathKey; label: string };
}

/** What each role adds to the one before it (the server decides; this only explains). */
export const ROLE_ABILITIES: Record<Role, readonly Ability[]> = {
  observer: [
    { text: "Read the department's scenarios, runs and sweeps, and start small runs.", page: { key: 'runs', label: 'Runs' } },
    {
      text: 'Keep observed samples and test each against a finished run’s predicted magnetic fraction (“Test against a run” on the sample’s page).',
      page: { key: 'samples', label: 'Samples' },
    },
    { text: 'Set two to four finished runs side by side.', page: { key: 'compare', label: 'Compare' } },
    {
      text: 'Find the companion occurrence that a measured magnetic fraction would require.',
      page: { key: 'impliedOccurrence', label: 'Implied occurrence' },
    },
    { text: 'Upload your own occurrence tables of planets, brown dwarfs and stellar companions, and edit or delete them.', page: { key: 'occurrenceTables', label: 'Occurrence tables' } },
  ],
  modeller: [
    {
      text: 'Write scenarios: IMF, star-formation history, companions, giant-branch and common-envelope physics.',
      page: { key: 'scenarios', label: 'Scenarios' },
    },
    { text: 'Start heavy runs and parameter sweeps.', page: { key: 'sweeps', label: 'Sweeps' } },
  ],
  admin: [
    { text: 'Set the roles of members and remove them.', page: { key: 'members', label: 'Members' } },
    { text: 'Buy compute credit for heavy runs; see usage and receipts.', page: { key: 'credits', label: 'Credits' } },
  ],
};
