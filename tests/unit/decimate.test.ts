// Min/max decimation per pixel column (method: Jugel et al., "M4: a visualization-oriented time
// series data aggregation", VLDB 2014 — keeping each column's extrema; cited from memory).
import { describe, expect, it } from "vitest";
import { decimateMinMax, lowerBound } from "@/components/trend/decimate";

describe("decimateMinMax", () => {
  const n = 72_000; // 2 h of 10 Hz samples
  const x = Float64Array.from({ length: n }, (_, i) => i * 0.1);
  const y = Float64Array.from({ length: n }, (_, i) => Math.sin(i / 500));

  it("keeps a one-sample spike that plain subsampling would drop", () => {
    const spiky = y.slice();
    spiky[33_333] = 9; // a single spike sample
    spiky[50_001] = -7;
    const d = decimateMinMax(x, [spiky], n, { fromX: 0, toX: x[n - 1] }, 800);
    expect(Math.max(...d.series[0])).toBe(9);
    expect(Math.min(...d.series[0])).toBe(-7);
    expect(d.x.length).toBeLessThanOrEqual(2 * 800 + 2);
    // subsampling every 90th point misses it
    const sub = Array.from({ length: 800 }, (_, i) => spiky[i * 90]);
    expect(Math.max(...sub)).toBeLessThan(9);
  });

  it("keeps each column's extrema for every series and x increasing", () => {
    const z = Float64Array.from(y, (v) => -2 * v);
    const d = decimateMinMax(x, [y, z], n, { fromX: 0, toX: x[n - 1] }, 500);
    for (let i = 1; i < d.x.length; i++) expect(d.x[i]).toBeGreaterThanOrEqual(d.x[i - 1]);
    expect(Math.max(...d.series[1])).toBeCloseTo(2, 6);
    expect(d.series[0].length).toBe(d.x.length);
  });

  it("returns the raw samples (plus one either side) when they fit", () => {
    const d = decimateMinMax(x, [y], n, { fromX: 100, toX: 110 }, 800);
    expect(d.x[0]).toBeCloseTo(99.9, 9);
    expect(d.x[d.x.length - 1]).toBeCloseTo(110.1, 9);
    expect(d.x.length).toBe(103);
  });

  it("lowerBound bisects a sorted array", () => {
    expect(lowerBound([0, 1, 2, 3], 4, 2.5)).toBe(3);
    expect(lowerBound([0, 1, 2, 3], 4, -1)).toBe(0);
    expect(lowerBound([0, 1, 2, 3], 4, 9)).toBe(4);
  });
});
