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

/**
 * A span of time in words for an ETA or a compute time: "4 s", "2 min 10 s", "14 min",
 * "1 h 5 min". Seconds are dropped from ten minutes on, where they are noise.
 */
export function formatDuration(seconds: number): string {
  const s = Math.max(0, Math.round(seconds));
  if (s < 60) return `${Math.max(1, s)} s`;
  const minutes = Math.floor(s / 60);
  if (minutes < 10) return s % 60 === 0 ? `${minutes} min` : `${minutes} min ${s % 60} s`;
  if (minutes < 60) return `${Math.round(s / 60)} min`;
  const totalMinutes = Math.round(s / 60);
  const hours = Math.floor(totalMinutes / 60);
  return totalMinutes % 60 === 0 ? `${hours} h` : `${hours} h ${totalMinutes % 60} min`;
}
