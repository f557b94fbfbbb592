import { describe, expect, it } from "vitest";
import { execFileSync } from "node:child_process";
import { mkdtempSync, readFileSync, writeFileSync } from "node:fs";
import { createRequire } from "node:module";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { guessMappingForText, importLog } from "@/sim/import";
import { identifyStepResponse } from "@/sim/tuning/identify";

// The plant's true parameters are ours: K = 0.8 °C/%, τ = 240 s, θ = 45 s (FOPDT). The 5 % band
// is the requirement of issue 7 ("Twins").
const TRUE = { gainCPerPercent: 0.8, timeConstantS: 240, deadTimeS: 45 };

const drill = {
  formatVersion: 1,
  id: "import-recovery-fopdt",
  title: "Bump test on a known FOPDT plant (invented test fixture)",
  description: "Invented for a test: OUT stepped 30 → 45 % by hand at 300 s on an FOPDT plant.",
  plant: {
    kind: "transfer-function",
    gainCPerPercent: TRUE.gainCPerPercent,
    timeConstantsS: [TRUE.timeConstantS],
    deadTimeS: TRUE.deadTimeS,
    operatingPoint: { outPercent: 30, temperatureC: 60 },
    ambientC: 20,
  },
  initialState: { temperatures: { kind: "steady", outPercent: 30 }, mode: "manual", setpointC: 60, outPercent: 30 },
  events: [],
  scoring: { windows: [{ id: "all", kind: "setpoint", startS: 0, endS: 2400 }] },
  referenceTuning: { kind: "pid", form: "standard", kc: 2, ti: 300, td: 0, sampleTimeS: 1 },
  drive: { kind: "continuous" },
  cutout: { enabled: false, tripPointC: 150, sensorTimeConstantS: 10, resetMarginC: 5 },
  noise: { seedPolicy: "fixed", seed: 2718 },
  durationS: 2400,
};

describe("a bump test written by the CLI, imported and identified", () => {
  it("recovers K, τ and θ of the FOPDT plant within 5 %", () => {
    const dir = mkdtempSync(join(tmpdir(), "loopwright-import-"));
    const drillFile = join(dir, "drill.json");
    const actionsFile = join(dir, "actions.json");
    const traceFile = join(dir, "trace.csv");
    writeFileSync(drillFile, JSON.stringify(drill));
    // the manual OUT step at sample 300 (t = 300 s at a 1 s sample time)
    writeFileSync(actionsFile, JSON.stringify([{ sample: 300, type: "manual-output", outPercent: 45 }]));
    const tsxCli = createRequire(import.meta.url).resolve("tsx/cli");
    execFileSync(process.execPath, [tsxCli, "sim/cli/main.ts", "run", drillFile, "--actions", actionsFile, "--out", traceFile, "--no-score"], {
      cwd: process.cwd(),
      stdio: ["ignore", "ignore", "pipe"],
    });
    const text = readFileSync(traceFile, "utf8");
    // the trace's own columns (sim/drill/trace.ts): the raw PV is what a logger would record
    expect(text.split("\n")[1]).toBe("timeS,setpointC,pvRawC,pvFilteredC,trueC,outPercent,heaterPowerW,heaterOn,pvBad,cutoutTripped");

    const g = guessMappingForText(text);
    expect(g.ok).toBe(true);
    if (!g.ok) return;
    expect(g.mapping.columns).toMatchObject({ time: 0, out: 5, pv: 2, sp: 1 });
    const r = importLog(text, Buffer.byteLength(text), g.mapping);
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.summary.step).toEqual({ timeS: 300, outBeforePercent: 30, outAfterPercent: 45 });
    expect(r.summary.irregular).toBe(false);

    const id = identifyStepResponse(r.log, { fopdtOnly: true });
    expect(id.ok).toBe(true);
    if (!id.ok) return;
    const m = id.fopdt.model;
    const rel = (x: number, ref: number) => Math.abs(x / ref - 1);
    expect(rel(m.gainCPerPercent, TRUE.gainCPerPercent)).toBeLessThan(0.05);
    expect(rel(m.timeConstantS, TRUE.timeConstantS)).toBeLessThan(0.05);
    expect(rel(m.deadTimeS, TRUE.deadTimeS)).toBeLessThan(0.05);
    expect(id.fopdt.quality.r2).toBeGreaterThan(0.999);
  }, 60_000);
});
