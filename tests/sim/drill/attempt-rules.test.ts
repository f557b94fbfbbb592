// Attempt rules (allViolations in sim/drill/run-drill.ts). Source: the drill format's rules
// (sim/drill/README.md, "What the trainee may change") and the Bench's tests, which take the loop
// to manual and drive OUT through mode / manual-output actions and, with SP tracking, put the SP
// back on hand-back (sim/worker/bench-tests.ts) — our own definitions, no outside source.
import { describe, expect, it } from "vitest";
import { readFileSync } from "node:fs";
import { drillSchema, runDrill, type StampedAction } from "@/sim/drill";

const base = JSON.parse(readFileSync("sim/examples/setpoint-ladder.json", "utf8"));
const drillWith = (trainee: Record<string, unknown>) => drillSchema.parse({ ...base, durationS: 2700, events: [base.events[0]], scoring: { ...base.scoring, windows: [base.scoring.windows[0]] }, trainee });
const noTests = drillWith({ relayTestAllowed: false, bumpTestAllowed: false });
const bumpOnly = drillWith({ relayTestAllowed: false, bumpTestAllowed: true });
const relayOnly = drillWith({ relayTestAllowed: true, bumpTestAllowed: false });
const operate = drillWith({ mayChange: { operation: true }, relayTestAllowed: false, bumpTestAllowed: false });

// a bump test as the Bench does it: manual, OUT step, OUT back, SP restored (SP tracking), auto
const sp0 = base.initialState.setpointC; // 59.3 °C before the scripted step at 300 s
const bump: StampedAction[] = [
  { sample: 100, type: "mode", mode: "manual" },
  { sample: 100, type: "manual-output", outPercent: 25 },
  { sample: 120, type: "manual-output", outPercent: 35 },
  { sample: 400, type: "manual-output", outPercent: 25 },
  { sample: 500, type: "setpoint", setpointC: sp0 },
  { sample: 500, type: "mode", mode: "auto" },
] as StampedAction[];
const violations = (d: ReturnType<typeof drillWith>, log: StampedAction[]) => runDrill(d, null, log).results.controllerViolations;

describe("attempt rules: operating the loop, relay and bump tests", () => {
  it("no actions: within the rules in every drill", () => {
    for (const d of [noTests, bumpOnly, relayOnly, operate]) expect(violations(d, [])).toEqual([]);
  });

  it("without operation or tests, mode / manual OUT / SP actions are violations (README)", () => {
    const v = violations(noTests, bump);
    expect(v).toContain("mode (operating the loop is not allowed in this drill)");
    expect(v).toContain("manual-output (operating the loop is not allowed in this drill)");
    expect(v).toContain("setpoint (operating the loop is not allowed in this drill)");
  });

  it("a drill allowing a bump or a relay test accepts the test's mode and OUT actions and the SP hand-back (bench-tests.ts)", () => {
    expect(violations(bumpOnly, bump)).toEqual([]);
    expect(violations(relayOnly, bump.filter((a) => a.type !== "setpoint"))).toEqual([]);
  });

  it("operation allowed: everything within the rules", () => {
    expect(violations(operate, [...bump, { sample: 2000, type: "setpoint", setpointC: 70 } as StampedAction])).toEqual([]);
  });

  it("an SP change that is not a restore still needs operation, even when tests are allowed", () => {
    const moved = bump.map((a) => (a.type === "setpoint" ? { ...a, setpointC: 65 } : a)) as StampedAction[];
    expect(violations(bumpOnly, moved)).toEqual(["setpoint (operating the loop is not allowed in this drill)"]);
    // a lone SP change back to the initial value, with no manual phase, is not a hand-back
    const gaming = [{ sample: 700, type: "setpoint", setpointC: sp0 }] as StampedAction[];
    expect(violations(bumpOnly, gaming)).toEqual(["setpoint (operating the loop is not allowed in this drill)"]);
    // nor is one after the loop is back in auto
    expect(violations(bumpOnly, [...bump, { sample: 900, type: "setpoint", setpointC: sp0 } as StampedAction])).toEqual(["setpoint (operating the loop is not allowed in this drill)"]);
  });

  it("hand-operating cannot game the setpoint: windows still score against the scripted SP (results.ts)", () => {
    const honest = runDrill(bumpOnly, null, [], undefined, { score: true });
    const gamed = runDrill(bumpOnly, null, [{ sample: 601, type: "setpoint", setpointC: sp0 } as StampedAction], undefined, { score: true });
    expect(gamed.score!.score).toBeLessThan(honest.score!.score);
  });
});

describe("attempt rules: the relay test's own actions", () => {
  // as sim/tuning/relay/relay-test.ts does it: manual, kick OUT, switch the block to on/off between
  // the two levels, auto, pin the SP at the value in force; then the original block back
  const relay = (): StampedAction[] => {
    const onoff = { ...relayOnly.referenceTuning, kind: "onoff", outOnPct: 45, outOffPct: 5, hysteresisC: 0.6 };
    return [
      { sample: 100, type: "mode", mode: "manual" },
      { sample: 100, type: "manual-output", outPercent: 45 },
      { sample: 101, type: "tuning", controller: onoff },
      { sample: 101, type: "mode", mode: "auto" },
      { sample: 101, type: "setpoint", setpointC: sp0 },
      { sample: 500, type: "mode", mode: "manual" },
      { sample: 500, type: "manual-output", outPercent: 25 },
      { sample: 500, type: "tuning", controller: relayOnly.referenceTuning },
      { sample: 501, type: "mode", mode: "auto" },
    ] as StampedAction[];
  };

  it("a drill allowing the relay test accepts its on/off levels and the SP pinned at the value in force", () => {
    expect(violations(relayOnly, relay())).toEqual([]);
  });

  it("without the relay test, the on/off levels are settings outside the rules", () => {
    const v = violations(noTests, relay());
    expect(v).toEqual(expect.arrayContaining(["outOnPct", "outOffPct"]));
  });

  it("an SP moved to a new value is still a violation when only tests are allowed", () => {
    const log = [...relay(), { sample: 600, type: "setpoint", setpointC: sp0 + 5 } as StampedAction];
    expect(violations(relayOnly, log)).toContain("setpoint (operating the loop is not allowed in this drill)");
  });
});
