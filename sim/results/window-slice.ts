/** Index range of the samples inside a time window [start, end] (both inclusive), by binary search on sorted t. */
export function windowIndices(t: ArrayLike<number>, startS: number, endS: number): { first: number; last: number } {
  const n = t.length;
  let lo = 0;
  let hi = n;
  while (lo < hi) {
    const mid = (lo + hi) >>> 1;
    if (t[mid] < startS) lo = mid + 1;
    else hi = mid;
  }
  const first = lo;
  lo = first;
  hi = n;
  while (lo < hi) {
    const mid = (lo + hi) >>> 1;
    if (t[mid] <= endS) lo = mid + 1;
    else hi = mid;
  }
  return { first, last: lo - 1 };
}
