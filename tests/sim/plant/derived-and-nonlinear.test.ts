import { describe, expect, it } from "vitest";
import { derivedFigures, powerCurve, steadyStateTemperatureC } from "@/sim/plant/derived-figures";
import { transferFunctionParamsSchema } from "@/sim/plant/transfer-function-params";
import { EnclosurePlant } from "@/sim/plant/enclosure-plant";
import { findPreset, PLANT_PRESETS } from "@/sim/plant/presets";
import { outerLossW } from "@/sim/plant/nonlinear-losses";

describe("derived figures", () => {
  it("FOPDT: static gain, t63 = θ + τ and the Smith two-point fit (Bequette §4.2 [CONFIRMED], references §8)", () => {
    const p = transferFunctionParamsSchema.parse({
      kind: "transfer-function", gainCPerPercent: 1.2, timeConstantsS: [300], deadTimeS: 40,
      operatingPoint: { outPercent: 0, temperatureC: 20 }, ambientC: 20,
    });
    const f = derivedFigures(p);
    expect(f.staticGainCPerPercent).toBeCloseTo(1.2, 9);
    expect(f.timeTo63PercentS).toBeCloseTo(340, 0);
    expect(f.fopdtFit.timeConstantS).toBeCloseTo(300, -1); // exact FOPDT: Smith gives τ within 0.05 % (references §8 table)
    expect(f.fopdtFit.deadTimeS).toBeCloseTo(40, 0);
    expect(f.apparentDeadTimeS).toBeCloseTo(40, 0);
  });

  it.each(PLANT_PRESETS.map((p) => p.id))("preset %s has plausible figures (lag-upon-lag: apparent dead time > 0)", (id) => {
    const pre = findPreset(id)!;
    const f = derivedFigures(pre.plant, 50);
    expect(f.staticGainCPerPercent).toBeGreaterThan(0.3);
    expect(f.dominantTimeConstantS).toBeGreaterThan(600);
    expect(f.apparentDeadTimeS).toBeGreaterThan(5);
    expect(f.steadyStateC).toBeGreaterThan(pre.plant.ambientC + 20);
    expect(steadyStateTemperatureC(pre.plant, 100)).toBeGreaterThan(pre.cutoutTripC); // the cutout is reachable
  });
});

describe("nonlinear-loss mode", () => {
  const lin = findPreset("benchtop-curing-cabinet")!.plant;
  const nl = { ...lin, lossModel: "nonlinear" as const };

  it("outer loss: natural convection ∝ ΔT^(5/4) (correlation form from memory) plus radiation εσ(T⁴ − T∞⁴) (Stefan–Boltzmann, σ CODATA 2018)", () => {
    const p = { convectionCoefficient: 1.32, emissivity: 0, areaM2: 1 };
    expect(outerLossW(p, 36, 20)).toBeCloseTo(1.32 * 16 * 2, 9);
    const r = { convectionCoefficient: 0, emissivity: 1, areaM2: 1 };
    expect(outerLossW(r, 100, 0)).toBeCloseTo(5.670374419e-8 * (373.15 ** 4 - 273.15 ** 4), 9);
  });

  it("the power curve is straight in the linear mode", () => {
    const c = powerCurve(lin, [0, 50, 100]);
    expect(c[2].steadyStateC - c[1].steadyStateC).toBeCloseTo(c[1].steadyStateC - c[0].steadyStateC, 9);
  });

  it("the power curve bends: equal output steps give shrinking temperature steps", () => {
    const t = powerCurve(nl, [0, 25, 50, 75, 100]).map((p) => p.steadyStateC);
    const d = t.slice(1).map((x, i) => x - t[i]);
    for (let i = 1; i < d.length; i++) expect(d[i]).toBeLessThan(d[i - 1]);
  });

  it("odex integration settles on the Newton steady state", () => {
    const plant = new EnclosurePlant(nl, { cutoutSensorTimeConstantS: 10, odexTolerance: 1e-8 });
    plant.initialize({ kind: "steady", outPercent: 40 });
    const start = plant.airTemperatureC();
    for (let k = 0; k < 50; k++) plant.advance(600, 0.4);
    expect(plant.airTemperatureC()).toBeCloseTo(start, 4);
    expect(start).toBeCloseTo(steadyStateTemperatureC(nl, 40), 9);
  });
});
