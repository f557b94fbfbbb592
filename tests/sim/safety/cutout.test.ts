import { describe, expect, it } from "vitest";
import { ExcessTemperatureCutout } from "@/sim/safety/cutout";
import { cutoutConfigSchema } from "@/sim/safety/cutout-config";

// NFPA 86 excess-temperature limit (references §14): own sensor, trips above the limit or on
// sensor failure, latches, manual reset only. [CONFIRMED] title/scope; clause wording [MEMORY].
describe("excess-temperature cutout", () => {
  const cfg = cutoutConfigSchema.parse({ tripPointC: 150 });

  it("trips above its set point and latches", () => {
    const c = new ExcessTemperatureCutout(cfg);
    expect(c.check(1, 149.9, "none")).toBeNull();
    expect(c.check(2, 150.1, "none")?.cause).toBe("over-temperature");
    expect(c.heaterPermitted).toBe(false);
    expect(c.check(3, 20, "none")).toBeNull(); // still latched, no second trip
    expect(c.tripped).toBe(true);
    expect(c.trips).toHaveLength(1);
  });

  it.each(["open", "shorted", "lead-break"] as const)("trips when its own sensor fails (%s)", (fault) => {
    const c = new ExcessTemperatureCutout(cfg);
    expect(c.check(1, 60, fault)?.cause).toBe("sensor-failure");
  });

  it("refuses a reset while the cause persists, accepts it once cleared", () => {
    const c = new ExcessTemperatureCutout(cfg);
    c.check(0, 160, "none");
    expect(c.reset(148, "none")).toBe(false); // within the reset margin
    expect(c.reset(100, "open")).toBe(false);
    expect(c.tripped).toBe(true);
    expect(c.reset(100, "none")).toBe(true);
    expect(c.heaterPermitted).toBe(true);
  });

  it("does nothing when disabled", () => {
    const c = new ExcessTemperatureCutout({ ...cfg, enabled: false });
    expect(c.check(0, 500, "open")).toBeNull();
  });
});
