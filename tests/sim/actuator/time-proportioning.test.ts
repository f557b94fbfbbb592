import { describe, expect, it } from "vitest";
import { cyclePulse, TimeProportioningDrive } from "@/sim/actuator/time-proportioning";
import { ContinuousDrive } from "@/sim/actuator/continuous-drive";
import { driveConfigSchema } from "@/sim/actuator/drive-config";

/** Walks the drive's segments over [0, end) and returns the on-time, like the runner does. */
function onTime(drive: TimeProportioningDrive, end: number, out: (t: number) => number): { on: number; switches: number[] } {
  let t = 0;
  let on = 0;
  const switches: number[] = [];
  let last = -1;
  let nextSample = 0;
  while (t < end - 1e-12) {
    if (t >= nextSample - 1e-12) {
      drive.setOutput(out(t));
      nextSample += 0.1;
    }
    const seg = drive.segmentAt(t);
    const until = Math.min(seg.until, end, nextSample);
    if (seg.fraction !== last) switches.push(t);
    last = seg.fraction;
    on += seg.fraction * (until - t);
    t = until;
  }
  return { on, switches };
}

describe("time-proportioning output (common practice)", () => {
  it("gives on-time = duty × cycle time, one pulse at the start of each cycle", () => {
    const d = new TimeProportioningDrive({ cycleTimeS: 2, minOnTimeS: 0, minOffTimeS: 0 });
    const r = onTime(d, 20, () => 37);
    expect(r.on).toBeCloseTo(0.37 * 20, 9);
    // switches at cycle starts (on) and 0.74 s into each cycle (off)
    expect(r.switches.slice(0, 4)).toEqual([0, expect.closeTo(0.74, 9), 2, expect.closeTo(2.74, 9)]);
  });

  it("latches the duty at the start of the cycle: a change mid-cycle acts from the next cycle", () => {
    const d = new TimeProportioningDrive({ cycleTimeS: 2, minOnTimeS: 0, minOffTimeS: 0 });
    const r = onTime(d, 4, (t) => (t < 0.5 ? 10 : 90));
    expect(r.on).toBeCloseTo(0.2 + 1.8, 9);
  });

  it("carries a pulse shorter than the minimum on-time over to the next cycle (not lost)", () => {
    const cfg = { cycleTimeS: 2, minOnTimeS: 0.5, minOffTimeS: 0 };
    // 10 % of 2 s = 0.2 s < 0.5 s: cycles 1, 2 carry (0.2, 0.4), cycle 3 fires 0.6 s
    let carry = 0;
    const pulses: number[] = [];
    for (let k = 0; k < 6; k++) {
      const p = cyclePulse(0.1, carry, cfg);
      pulses.push(p.onTimeS);
      carry = p.carryS;
    }
    expect(pulses.map((x) => +x.toFixed(9))).toEqual([0, 0, 0.6, 0, 0, 0.6]);
    const d = new TimeProportioningDrive(cfg);
    expect(onTime(d, 60, () => 10).on + d.carryS).toBeCloseTo(6, 6); // average power preserved
  });

  it("turns an off gap shorter than the minimum off-time into a full cycle and pays the excess back", () => {
    const cfg = { cycleTimeS: 2, minOnTimeS: 0, minOffTimeS: 0.3 };
    const p1 = cyclePulse(0.95, 0, cfg); // gap 0.1 s < 0.3 s
    expect(p1.onTimeS).toBe(2);
    expect(p1.carryS).toBeCloseTo(-0.1, 12);
    const d = new TimeProportioningDrive(cfg);
    // delivered + what is still owed (negative: paid back next cycle) = demanded
    expect(onTime(d, 40, () => 95).on + d.carryS).toBeCloseTo(38, 6);
  });

  it("0 % and 100 % give no switching inside the cycle", () => {
    const d0 = new TimeProportioningDrive({ cycleTimeS: 2, minOnTimeS: 0.1, minOffTimeS: 0.1 });
    expect(onTime(d0, 10, () => 0).on).toBe(0);
    const d1 = new TimeProportioningDrive({ cycleTimeS: 2, minOnTimeS: 0.1, minOffTimeS: 0.1 });
    expect(onTime(d1, 10, () => 100).on).toBeCloseTo(10, 9);
  });

  it("continuous drive passes OUT/100 clipped to 0–1", () => {
    const c = new ContinuousDrive();
    c.setOutput(42);
    expect(c.segmentAt(0).fraction).toBeCloseTo(0.42, 12);
    c.setOutput(130);
    expect(c.segmentAt(1).fraction).toBe(1);
  });

  it("schema refuses minimum times longer than the cycle", () => {
    const r = driveConfigSchema.safeParse({ kind: "time-proportioning", cycleTimeS: 1, minOnTimeS: 0.8, minOffTimeS: 0.5 });
    expect(r.success).toBe(false);
  });
});
