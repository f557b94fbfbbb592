/**
 * The recorded trend of a run: one row per controller sample, in typed arrays that grow by
 * doubling (the Bench runs open-ended). Heater power is the mean over the sample interval
 * [t_k, t_k+1) that follows the row (the last row repeats the previous interval's value).
 */
export interface Trace {
  engineVersion: string;
  length: number;
  timeS: Float64Array;
  setpointC: Float64Array;
  pvRawC: Float64Array;
  pvFilteredC: Float64Array;
  trueC: Float64Array;
  outPercent: Float64Array;
  heaterPowerW: Float64Array;
  heaterOn: Uint8Array;
  pvBad: Uint8Array;
  cutoutTripped: Uint8Array;
}

export const TRACE_FLOAT_COLUMNS = ["timeS", "setpointC", "pvRawC", "pvFilteredC", "trueC", "outPercent", "heaterPowerW"] as const;
export const TRACE_FLAG_COLUMNS = ["heaterOn", "pvBad", "cutoutTripped"] as const;

export class TraceRecorder {
  private cap: number;
  length = 0;
  timeS: Float64Array;
  setpointC: Float64Array;
  pvRawC: Float64Array;
  pvFilteredC: Float64Array;
  trueC: Float64Array;
  outPercent: Float64Array;
  heaterPowerW: Float64Array;
  heaterOn: Uint8Array;
  pvBad: Uint8Array;
  cutoutTripped: Uint8Array;

  constructor(capacity: number, readonly engineVersion: string) {
    this.cap = Math.max(16, capacity);
    const f = () => new Float64Array(this.cap);
    const u = () => new Uint8Array(this.cap);
    this.timeS = f(); this.setpointC = f(); this.pvRawC = f(); this.pvFilteredC = f(); this.trueC = f();
    this.outPercent = f(); this.heaterPowerW = f();
    this.heaterOn = u(); this.pvBad = u(); this.cutoutTripped = u();
  }

  /** Make room for row index i. */
  ensure(i: number): void {
    if (i < this.cap) return;
    let cap = this.cap;
    while (cap <= i) cap *= 2;
    const grow = <T extends Float64Array | Uint8Array>(a: T): T => {
      const b = new (a.constructor as { new (n: number): T })(cap);
      b.set(a);
      return b;
    };
    this.timeS = grow(this.timeS); this.setpointC = grow(this.setpointC); this.pvRawC = grow(this.pvRawC);
    this.pvFilteredC = grow(this.pvFilteredC); this.trueC = grow(this.trueC); this.outPercent = grow(this.outPercent);
    this.heaterPowerW = grow(this.heaterPowerW); this.heaterOn = grow(this.heaterOn); this.pvBad = grow(this.pvBad);
    this.cutoutTripped = grow(this.cutoutTripped);
    this.cap = cap;
  }

  /** Rows [from, to) as a Trace of views (no copy when from = 0 and the caller only reads). */
  view(from = 0, to = this.length): Trace {
    return {
      engineVersion: this.engineVersion,
      length: to - from,
      timeS: this.timeS.subarray(from, to),
      setpointC: this.setpointC.subarray(from, to),
      pvRawC: this.pvRawC.subarray(from, to),
      pvFilteredC: this.pvFilteredC.subarray(from, to),
      trueC: this.trueC.subarray(from, to),
      outPercent: this.outPercent.subarray(from, to),
      heaterPowerW: this.heaterPowerW.subarray(from, to),
      heaterOn: this.heaterOn.subarray(from, to),
      pvBad: this.pvBad.subarray(from, to),
      cutoutTripped: this.cutoutTripped.subarray(from, to),
    };
  }

  /** An independent copy of rows [from, to) (for posting out of a worker or keeping). */
  copy(from = 0, to = this.length): Trace {
    const v = this.view(from, to);
    return {
      ...v,
      timeS: v.timeS.slice(), setpointC: v.setpointC.slice(), pvRawC: v.pvRawC.slice(), pvFilteredC: v.pvFilteredC.slice(),
      trueC: v.trueC.slice(), outPercent: v.outPercent.slice(), heaterPowerW: v.heaterPowerW.slice(),
      heaterOn: v.heaterOn.slice(), pvBad: v.pvBad.slice(), cutoutTripped: v.cutoutTripped.slice(),
    };
  }
}

/** CSV text of a trace (header + one line per sample). */
export function traceToCsv(t: Trace): string {
  const cols = [...TRACE_FLOAT_COLUMNS, ...TRACE_FLAG_COLUMNS];
  const lines = [`# engine ${t.engineVersion}`, cols.join(",")];
  for (let i = 0; i < t.length; i++) lines.push(cols.map((c) => t[c][i]).join(","));
  return lines.join("\n") + "\n";
}
