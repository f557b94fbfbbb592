// FNV-1a fingerprint (Fowler, Noll, Vo; reference values from the FNV authors' test suite,
// from memory: FNV-1a 32 of "a" is 0xe40c292c).
import { describe, expect, it } from "vitest";
import { traceFingerprint } from "@/sim/drill/trace-hash";
import { TraceRecorder } from "@/sim/drill/trace";

function fnv1a32(s: string) {
  let h = 0x811c9dc5;
  for (const ch of Buffer.from(s)) h = Math.imul(h ^ ch, 16777619);
  return h >>> 0;
}

describe("traceFingerprint", () => {
  it("uses FNV-1a (reference value for 'a')", () => {
    expect(fnv1a32("a")).toBe(0xe40c292c);
  });
  it("is equal for equal traces and changes with one bit of one value", () => {
    const make = () => {
      const r = new TraceRecorder(4, "test");
      for (let i = 0; i < 4; i++) {
        r.ensure(i);
        r.timeS[i] = i * 0.5;
        r.trueC[i] = 20 + i;
        r.length = i + 1;
      }
      return r;
    };
    const a = make();
    const b = make();
    expect(traceFingerprint(a.view())).toBe(traceFingerprint(b.view()));
    b.trueC[2] = 22 + Number.EPSILON * 22;
    expect(traceFingerprint(a.view())).not.toBe(traceFingerprint(b.view()));
    expect(traceFingerprint(a.view(), 2)).toBe(traceFingerprint(b.view(), 2));
  });
});
