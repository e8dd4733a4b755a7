/**
 * Axis ticks for a log scale at whole decades, labelled as plain numbers from 0.001 to 10⁴ and as
 * powers of ten beyond ("10⁶", "10⁻⁴"), so that a period axis spanning ten decades stays legible.
 */

const SUPERSCRIPT: Record<string, string> = { '-': '⁻', '0': '⁰', '1': '¹', '2': '²', '3': '³', '4': '⁴', '5': '⁵', '6': '⁶', '7': '⁷', '8': '⁸', '9': '⁹' };

/** The label of 10^k. */
export function decadeLabel(k: number): string {
  if (k >= -3 && k <= 4) return String(Number((10 ** k).toPrecision(1)));
  return `10${String(k).split('').map((c) => SUPERSCRIPT[c]).join('')}`;
}

/**
 * Vega-Lite axis properties for the decades inside [10^lo, 10^hi]; at most `maxLabels` of them
 * are labelled (every second, third … decade), the rest keep a tick and grid line.
 */
export function decadeAxis(lo: number, hi: number, maxLabels = 8): { values: number[]; labelExpr: string } {
  const first = Math.ceil(lo - 1e-9);
  const last = Math.floor(hi + 1e-9);
  const decades: number[] = [];
  for (let k = first; k <= last; k++) decades.push(k);
  const every = Math.max(1, Math.ceil(decades.length / maxLabels));
  // Vega expressions have no lookup tables: a chain of comparisons on the decade picks the label.
  const cases = decades
    .filter((k) => (k - first) % every === 0)
    .map((k) => `abs(log(datum.value) / LN10 - (${k})) < 0.01 ? '${decadeLabel(k)}'`);
  return { values: decades.map((k) => 10 ** k), labelExpr: cases.length ? `${cases.join(' : ')} : ''` : "''" };
}
