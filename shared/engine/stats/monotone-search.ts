/**
 * Bisection for the first integer i in [lo, hi] at which a monotone predicate (false … false,
 * true … true) becomes true; hi + 1 when it never does. O(log(hi − lo)) calls, which is what
 * lets the exact tests find the edge of a tail among 1e7 outcomes without visiting them all.
 */
export function firstTrueIndex(lo: number, hi: number, predicate: (i: number) => boolean): number {
  let left = lo;
  let right = hi + 1;
  while (left < right) {
    const mid = left + Math.floor((right - left) / 2);
    if (predicate(mid)) right = mid;
    else left = mid + 1;
  }
  return left;
}
