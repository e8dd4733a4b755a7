/** Sets the tab's title; React 19 hoists <title> into the document head. */
export function DocumentTitle({ title }: { title: string }) {
  return <title>{`${title} · Tidefield`}</title>;
}
