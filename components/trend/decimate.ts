/**
 * Min/max decimation per pixel column (the "M4"-style reduction, Jugel et al., VLDB 2014, keeping
 * the extrema of every column): a long trace is reduced to at most two points per pixel column
 * and series, so every peak and spike still reaches the screen at any zoom.
 *
 * All series share the x array (uPlot's data model), so each column emits two x positions (its
 * first and last sample) and, for every series, its minimum and maximum in the order they
 * occurred. Columns holding a single sample emit it once.
 */
export interface DecimatedData {
  x: number[];
  series: number[][];
}

/** Index of the first x[i] >= value in the sorted range [0, length), by bisection. */
export function lowerBound(x: ArrayLike<number>, length: number, value: number): number {
  let lo = 0;
  let hi = length;
  while (lo < hi) {
    const mid = (lo + hi) >>> 1;
    if (x[mid] < value) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}

/** Index of the first x[i] > value in the sorted range [0, length), by bisection. */
export function upperBound(x: ArrayLike<number>, length: number, value: number): number {
  let lo = 0;
  let hi = length;
  while (lo < hi) {
    const mid = (lo + hi) >>> 1;
    if (x[mid] <= value) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}

export function decimateMinMax(
  x: ArrayLike<number>,
  series: readonly ArrayLike<number>[],
  length: number,
  range: { fromX: number; toX: number },
  columns: number,
): DecimatedData {
  // one sample either side of the window, so lines run to the plot edges
  const i0 = Math.max(0, lowerBound(x, length, range.fromX) - 1);
  const i1 = Math.min(length, upperBound(x, length, range.toX) + 1);
  const out: DecimatedData = { x: [], series: series.map(() => []) };
  const n = i1 - i0;
  if (n <= 0) return out;
  if (n <= 2 * columns) {
    for (let i = i0; i < i1; i++) {
      out.x.push(x[i]);
      for (let s = 0; s < series.length; s++) out.series[s].push(series[s][i]);
    }
    return out;
  }
  const span = range.toX - range.fromX || 1;
  const cols = Math.max(1, Math.floor(columns));
  let i = i0;
  while (i < i1) {
    const col = Math.min(cols - 1, Math.max(0, Math.floor(((x[i] - range.fromX) / span) * cols)));
    let j = i + 1;
    while (j < i1 && Math.min(cols - 1, Math.max(0, Math.floor(((x[j] - range.fromX) / span) * cols))) === col) j++;
    // column holds samples [i, j)
    if (j - i === 1) {
      out.x.push(x[i]);
      for (let s = 0; s < series.length; s++) out.series[s].push(series[s][i]);
    } else {
      out.x.push(x[i], x[j - 1]);
      for (let s = 0; s < series.length; s++) {
        const v = series[s];
        let min = Infinity;
        let max = -Infinity;
        let iMin = i;
        let iMax = i;
        for (let k = i; k < j; k++) {
          const y = v[k];
          if (y < min) {
            min = y;
            iMin = k;
          }
          if (y > max) {
            max = y;
            iMax = k;
          }
        }
        if (iMin <= iMax) out.series[s].push(min, max);
        else out.series[s].push(max, min);
      }
    }
    i = j;
  }
  return out;
}
