/** The width of uniform bins from their edges, tidied for a title: [0.2, 0.22, …] → "0.02". */
export function binWidthText(edges: readonly number[]): string {
  if (edges.length < 2) return '';
  return String(Number((edges[1] - edges[0]).toPrecision(3)));
}
