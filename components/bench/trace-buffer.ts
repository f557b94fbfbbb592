/**
 * The Bench's copy of the streamed trace, outside React: chunks from the worker are appended
 * into growable typed arrays; the trend reads them directly at animation-frame rate.
 */
import type { Trace } from "@/sim/drill/trace";
import { TRACE_ARRAY_KEYS } from "@/sim/worker/protocol";

type Column = (typeof TRACE_ARRAY_KEYS)[number];

export class TraceBuffer {
  length = 0;
  version = 0;
  engineVersion = "";
  columns: { [K in Column]: K extends "heaterOn" | "pvBad" | "cutoutTripped" ? Uint8Array : Float64Array };
  private capacity = 0;

  constructor(initialCapacity = 4096) {
    this.columns = TraceBuffer.allocate(initialCapacity);
    this.capacity = initialCapacity;
  }

  private static allocate(n: number) {
    const f = () => new Float64Array(n);
    const u = () => new Uint8Array(n);
    return { timeS: f(), setpointC: f(), pvRawC: f(), pvFilteredC: f(), trueC: f(), outPercent: f(), heaterPowerW: f(), heaterOn: u(), pvBad: u(), cutoutTripped: u() };
  }

  clear(): void {
    this.length = 0;
    this.version++;
  }

  /** Writes rows [from, from + chunk.length); a chunk may overlap rows already held (reset). */
  append(from: number, chunk: Trace): void {
    const end = from + chunk.length;
    if (end > this.capacity) {
      let cap = Math.max(this.capacity, 16);
      while (cap < end) cap *= 2;
      const next = TraceBuffer.allocate(cap);
      for (const k of TRACE_ARRAY_KEYS) (next[k] as Float64Array | Uint8Array).set(this.columns[k].subarray(0, this.length));
      this.columns = next;
      this.capacity = cap;
    }
    for (const k of TRACE_ARRAY_KEYS) (this.columns[k] as Float64Array | Uint8Array).set(chunk[k] as Float64Array | Uint8Array, from);
    this.length = end;
    this.engineVersion = chunk.engineVersion;
    this.version++;
  }

  /** A Trace view of the rows held (no copy). */
  view(): Trace {
    const v = {} as Trace;
    for (const k of TRACE_ARRAY_KEYS) (v as unknown as Record<string, unknown>)[k] = this.columns[k].subarray(0, this.length);
    v.length = this.length;
    v.engineVersion = this.engineVersion;
    return v;
  }
}
