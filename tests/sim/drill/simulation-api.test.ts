import { describe, expect, it } from "vitest";
import { readFileSync } from "node:fs";
import { join } from "node:path";
import { drillSchema, runDrill, Simulation } from "@/sim/drill";
import { ENGINE_VERSION } from "@/sim/version";

const drill = drillSchema.parse(JSON.parse(readFileSync(join(process.cwd(), "sim/examples/noisy-failing-sensor.json"), "utf8")));

describe("Simulation (the Bench's stepping API)", () => {
  it("streams chunks that concatenate to the runDrill trace", () => {
    const sim = new Simulation(drill);
    const chunks = [];
    let from = 0;
    while (!sim.finished) {
      sim.advance(Math.min(437, drill.durationS + sim.sampleTimeS - sim.timeS));
      chunks.push(sim.traceChunk(from));
      from = sim.trace().length;
    }
    const full = runDrill(drill).trace;
    const joined = chunks.flatMap((c) => Array.from(c.pvRawC));
    expect(joined).toEqual(Array.from(full.pvRawC));
    expect(chunks.every((c) => c.engineVersion === ENGINE_VERSION)).toBe(true);
  });

  it("snapshot reports the last recorded sample", () => {
    const sim = new Simulation(drill);
    sim.advance(10);
    const s = sim.snapshot();
    expect(s.sample).toBe(sim.sampleIndex - 1);
    expect(s.timeS).toBeCloseTo(10 - sim.sampleTimeS, 9);
    expect(s.mode).toBe("auto");
    expect(s.cutoutTripped).toBe(false);
  });

  it("refuses a tuning change that alters the sample time, and logs it", () => {
    const sim = new Simulation(drill);
    sim.act({ type: "tuning", controller: { ...sim.controllerConfig, sampleTimeS: 1 } });
    sim.advance(1);
    expect(sim.events.some((e) => e.type === "action-refused")).toBe(true);
    expect(sim.controllerConfig.sampleTimeS).toBe(drill.referenceTuning.sampleTimeS);
  });

  it("runs past the drill's duration when the Bench keeps going", () => {
    const sim = new Simulation({ ...drill, durationS: 5 });
    sim.advance(20);
    expect(sim.finished).toBe(true);
    expect(sim.trace().length).toBe(Math.round(20 / sim.sampleTimeS));
  });
});
