import { describe, expect, it } from 'vitest';
import { PUBLIC_PAGE_KEYS, paths } from '../config/paths.ts';
import { NAV_GROUPS, navigationFor } from './nav-items.ts';

const labels = (role: Parameters<typeof navigationFor>[0]) => navigationFor(role).flatMap((g) => g.items.map((i) => i.label));

const EVERYONE = [
  'Overview',
  'Scenarios',
  'Runs',
  'Sweeps',
  'Fits',
  'Implied occurrence',
  'Compare',
  'Constraint sets',
  'Two-sample test',
  'Samples',
  'Occurrence tables',
  'API tokens',
  'Settings',
  // Everyone reads their own mail in the development outbox.
  'Outbox',
];

describe('navigation by role', () => {
  it('shows observers and modellers the shared pages only', () => {
    expect(labels('observer')).toEqual(EVERYONE);
    expect(labels('modeller')).toEqual(EVERYONE);
    expect(navigationFor('observer').map((g) => g.label)).not.toContain('Department');
  });

  it('adds Members and Credits for admins', () => {
    expect(labels('admin')).toEqual([...EVERYONE, 'Members', 'Credits', 'Workers']);
  });

  it('links every app page exactly once, and nothing else', () => {
    const keys = NAV_GROUPS.flatMap((g) => g.items.map((i) => i.key));
    expect(new Set(keys).size).toBe(keys.length);
    const appPages = Object.keys(paths).filter((key) => !PUBLIC_PAGE_KEYS.includes(key as keyof typeof paths));
    expect([...keys].sort()).toEqual(appPages.sort());
  });
});
