/** Display formats shared by all pages. Dates are shown in UTC, as observers log them. */

const dateFormat = new Intl.DateTimeFormat('en-GB', { dateStyle: 'medium', timeZone: 'UTC' });
const dateTimeFormat = new Intl.DateTimeFormat('en-GB', { dateStyle: 'medium', timeStyle: 'medium', timeZone: 'UTC' });

function parse(iso: string): Date | null {
  const date = new Date(iso);
  return Number.isNaN(date.getTime()) ? null : date;
}

/** "3 Mar 2026"; the input as is when it is not a date. */
export function formatDate(iso: string): string {
  const date = parse(iso);
  return date ? dateFormat.format(date) : iso;
}

/** "3 Mar 2026, 14:05:09 UTC". */
export function formatDateTimeUtc(iso: string): string {
  const date = parse(iso);
  return date ? `${dateTimeFormat.format(date)} UTC` : iso;
}
