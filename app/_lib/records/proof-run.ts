// A proof test re-run on the server with the engine: the record never takes the browser's
// numbers. The drill must run the record's own plant, and the simulated time is capped so one
// record cannot tie up the server (the cap is said in the refusal).
import { ActionRefused } from "@/app/_lib/action";
import { resolvePlant } from "@/sim/drill/resolve";
import { runDrill, type DrillRun } from "@/sim/drill/run-drill";
import { traceFingerprint } from "@/sim/drill/trace-hash";
import { plantDefinitionSchema, type PlantDefinition } from "@/sim/plant/plant-definition";
import type { ProofTestRequest, ProofTestStored } from "./record-document";
import { decimateTrend } from "./trend-decimation";

export const MAX_PROOF_TEST_S = 12 * 3600;
/** 12 h at a 0.05 s sample: the trace of one test stays under about 100 MB while it runs */
export const MAX_PROOF_TEST_SAMPLES = 864_000;

/** A plant definition as canonical JSON without its display name (jsonb reorders keys; names differ harmlessly). */
function canonicalPlant(def: PlantDefinition): string {
  const { name: _name, ...rest } = plantDefinitionSchema.parse(def) as PlantDefinition & { name?: string };
  const sorted = (v: unknown): unknown =>
    Array.isArray(v) ? v.map(sorted) : v && typeof v === "object" ? Object.fromEntries(Object.entries(v).sort(([a], [b]) => (a < b ? -1 : 1)).map(([k, x]) => [k, sorted(x)])) : v;
  return JSON.stringify(sorted(rest));
}

export function samePlant(a: PlantDefinition, b: PlantDefinition): boolean {
  return canonicalPlant(a) === canonicalPlant(b);
}

/** Refuses, before anything runs, a test on another plant or one beyond the caps. */
export function checkProofTest(test: ProofTestRequest, index: number, recordPlant: PlantDefinition, plantName: string): void {
  const which = `Proof test ${index + 1} ("${test.label}")`;
  let drillPlant: PlantDefinition;
  try {
    drillPlant = resolvePlant(test.drill);
  } catch {
    throw new ActionRefused(`${which} names a plant preset that does not exist.`);
  }
  if (!samePlant(drillPlant, recordPlant)) {
    throw new ActionRefused(`${which} ran on a different plant: its drill must use the record's plant (${plantName}) exactly as stored.`);
  }
  if (test.drill.durationS > MAX_PROOF_TEST_S) {
    throw new ActionRefused(`${which} runs ${hours(test.drill.durationS)} h: a proof test on a record may simulate at most ${MAX_PROOF_TEST_S / 3600} h.`);
  }
  const samples = Math.round(test.drill.durationS / test.controller.sampleTimeS);
  if (samples > MAX_PROOF_TEST_SAMPLES) {
    throw new ActionRefused(
      `${which} needs ${samples.toLocaleString("en-GB")} controller samples: at most ${MAX_PROOF_TEST_SAMPLES.toLocaleString("en-GB")} per test (12 h at a 0.05 s sample time). Lengthen the sample time or shorten the test.`,
    );
  }
}

const hours = (s: number) => String(Math.round((s / 3600) * 10) / 10);

/** Runs the test as stored (drill, controller, seed; no operator actions): the same trace every time. */
export function rerunProofTest(test: Pick<ProofTestRequest, "drill" | "controller" | "seed">): DrillRun {
  return runDrill(test.drill, test.controller, [], test.seed);
}

/** The stored form of a test: the request plus what the engine measured. */
export function storedProofTest(test: ProofTestRequest): ProofTestStored {
  const run = rerunProofTest(test);
  const r = run.results;
  const t = (w: (typeof r.windows)[number]["trueTemperature"]) => ({
    iae: w.iae,
    overshootPct: w.overshootPct,
    settlingTimeS: w.settlingTimeS,
    riseTimeS: w.riseTimeS,
    recoveryTimeS: w.recoveryTimeS,
    peakDeviationC: w.peakDeviationC,
  });
  return {
    ...test,
    traceFingerprint: traceFingerprint(run.trace),
    durationS: test.drill.durationS,
    // measured on the true (simulated air) temperature, which is what the drills score
    windows: r.windows.map((w) => ({ label: w.label, kind: w.kind, ...t(w.trueTemperature) })),
    wholeRun: { ...t(r.wholeRun.trueTemperature) },
    safetyTrips: r.safetyTrips.length,
    heaterEnergyKWh: Number.isFinite(r.heaterEnergyKWh) ? r.heaterEnergyKWh : null,
    trend: decimateTrend(run.trace),
  };
}
