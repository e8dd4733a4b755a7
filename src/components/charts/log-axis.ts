/**
 * Axis ticks for a log scale at whole decades. One style per axis: plain numbers when every
 * decade lies between 0.01 and 1000, powers of ten ("10⁻²", "10⁰", "10⁶") otherwise, so that a
 * label such as 10000 never stands beside 10⁶. Labels that would touch (a phone's narrow chart)
 * are left out by the chart itself, never drawn over each other.
 */

const SUPERSCRIPT: Record<string, string> = { '-': '⁻', '0': '⁰', '1': '¹', '2': '²', '3': '³', '4': '⁴', '5': '⁵', '6': '⁶', '7': '⁷', '8': '⁸', '9': '⁹' };

/** The decades written as plain numbers when an axis stays inside them. */
const PLAIN_DECADES = [-2, 3] as const;

/** The label of 10^k: as a number ("0.01", "1000") or as a power of ten ("10⁶"). */
export function decadeLabel(k: number, style: 'plain' | 'power' = k >= PLAIN_DECADES[0] && k <= PLAIN_DECADES[1] ? 'plain' : 'power'): string {
  if (style === 'plain') return String(Number((10 ** k).toPrecision(1)));
  return `10${String(k)
    .split('')
    .map((c) => SUPERSCRIPT[c])
    .join('')}`;
}

export interface DecadeAxis {
  values: number[];
  labelExpr: string;
  labelOverlap: 'greedy';
  labelSeparation: number;
  labelFlush: boolean;
}

/**
 * Vega-Lite axis properties for the decades inside [10^lo, 10^hi]; at most `maxLabels` of them
 * are labelled (every second, third … decade), the rest keep a tick and grid line.
 */
export function decadeAxis(lo: number, hi: number, maxLabels = 6): DecadeAxis {
  const first = Math.ceil(lo - 1e-9);
  const last = Math.floor(hi + 1e-9);
  const decades: number[] = [];
  for (let k = first; k <= last; k++) decades.push(k);
  const style = decades.every((k) => k >= PLAIN_DECADES[0] && k <= PLAIN_DECADES[1]) ? 'plain' : 'power';
  const every = Math.max(1, Math.ceil(decades.length / maxLabels));
  // Vega expressions have no lookup tables: a chain of comparisons on the decade picks the label.
  const cases = decades
    .filter((k) => (k - first) % every === 0)
    .map((k) => `abs(log(datum.value) / LN10 - (${k})) < 0.01 ? '${decadeLabel(k, style)}'`);
  return {
    values: decades.map((k) => 10 ** k),
    labelExpr: cases.length ? `${cases.join(' : ')} : ''` : "''",
    // Whatever still would not fit (a 390 px phone) is dropped rather than drawn on top of its neighbour.
    labelOverlap: 'greedy',
    labelSeparation: 6,
    labelFlush: true,
  };
}

/**
 * A count axis: "0", "500", "5k", "1.5M". Vega's own "~s" axis format picks one SI prefix for
 * every tick, which writes zero as "0k"; formatting each value alone does not.
 */
export const COUNT_AXIS = { labelExpr: "format(datum.value, '~s')", labelOverlap: 'greedy' as const } as const;
