/**
 * The table as CSV, in the columns an upload takes. A plain link: the browser downloads it
 * with the session cookie, under the file name the server gives.
 */
export function tableCsvHref(id: string): string {
  return `/api/occurrence-tables/${encodeURIComponent(id)}/csv`;
}
