import { describe, expect, it } from 'vitest';
import { formatDate, formatDateTimeUtc } from './format.ts';

describe('format', () => {
  it('shows dates in UTC, day first, whatever the machine zone', () => {
    expect(formatDate('2026-03-03T23:30:00-05:00')).toBe('4 Mar 2026');
    expect(formatDateTimeUtc('2026-03-03T14:05:09.120Z')).toBe('3 Mar 2026, 14:05:09 UTC');
  });

  it('passes through what is not a date', () => {
    expect(formatDate('soon')).toBe('soon');
  });
});
