// FOPDT plant with dead time under a time-proportioning drive: the cycle-averaged response must
// equal the continuous drive's (a linear plant responds to the mean of a periodic input, up to the
// ripple), and the steady state must be K·ΔOUT above the operating point (FOPDT definition, G(0) = K).
import { describe, expect, it } from "vitest";
import { runDrill } from "@/sim/drill/run-drill";
import type { DrillInput } from "@/sim/drill/schema";

const drill = (drive: DrillInput["drive"]): DrillInput => ({
  formatVersion: 1,
  id: "tf",
  title: "FOPDT under SSR",
  plant: { kind: "transfer-function", name: "test loop", gainCPerPercent: 1.5, timeConstantsS: [300], deadTimeS: 40, operatingPoint: { outPercent: 0, temperatureC: 20 }, ambientC: 20, heaterRatingW: 1000, nominalVoltageV: 230, sensorTimeConstantS: 1 } as never,
  initialState: { temperatures: { kind: "steady", outPercent: 0 }, mode: "manual", setpointC: 20, outPercent: 60 },
  scoring: { windows: [{ id: "w", kind: "setpoint", startS: 0, endS: 3000 }] },
  referenceTuning: { sampleTimeS: 0.5 },
  cutout: { tripPointC: 500 },
  durationS: 3000,
  drive,
});

describe("transfer-function plant with dead time and a time-proportioning drive", () => {
  it("follows the continuous drive (cycle mean) and settles at K·ΔOUT", () => {
    const ssr = runDrill(drill({ kind: "time-proportioning", cycleTimeS: 2, minOnTimeS: 0, minOffTimeS: 0 }));
    const cont = runDrill(drill({ kind: "continuous" }));
    const at = (s: number) => Math.round(s / 0.5);
    // cycle-mean of the SSR response around 500 s against the continuous response
    let mean = 0;
    for (let k = at(499); k < at(501); k++) mean += ssr.trace.trueC[k];
    mean /= at(501) - at(499);
    expect(Math.abs(mean - cont.trace.trueC[at(500)])).toBeLessThan(0.05);
    let settled = 0;
    for (let k = at(2998); k < at(3000); k++) settled += ssr.trace.trueC[k];
    settled /= at(3000) - at(2998);
    expect(settled).toBeCloseTo(20 + 1.5 * 60, 1);
  });
});
