/**
 * A fingerprint of a trace: FNV-1a (Fowler–Noll–Vo, 32-bit, offset basis 2166136261, prime
 * 16777619) run twice with different offset bases over the bytes of every column, in a fixed
 * order. The browser's worker and the CLI compute it on the same Float64 values, so equal
 * fingerprints mean the same trace bit for bit (not a security hash).
 */
import { TRACE_FLAG_COLUMNS, TRACE_FLOAT_COLUMNS, type Trace } from "./trace";

export function traceFingerprint(trace: Trace, rows = trace.length): string {
  let a = 0x811c9dc5;
  let b = 0x01000193 ^ 0x5bd1e995; // second basis: any other odd constant
  const feed = (bytes: Uint8Array) => {
    for (let i = 0; i < bytes.length; i++) {
      a = Math.imul(a ^ bytes[i], 16777619);
      b = Math.imul(b ^ bytes[i], 16777619);
    }
  };
  for (const c of TRACE_FLOAT_COLUMNS) {
    const col = trace[c].subarray(0, rows);
    feed(new Uint8Array(col.buffer, col.byteOffset, col.byteLength));
  }
  for (const c of TRACE_FLAG_COLUMNS) feed(trace[c].subarray(0, rows));
  return (a >>> 0).toString(16).padStart(8, "0") + (b >>> 0).toString(16).padStart(8, "0");
}
