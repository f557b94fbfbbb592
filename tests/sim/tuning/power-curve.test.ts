import { describe, expect, it } from "vitest";
import { findPreset, steadyStateTemperatureC, transferFunctionParamsSchema } from "@/sim/plant";
import { heatUpTime, outputForSetpoint, powerCurve, staticGainAt } from "@/sim/tuning/power-curve";

const linear = findPreset("benchtop-curing-cabinet")!.plant;
const nonlinear = { ...linear, lossModel: "nonlinear" as const };

describe("power curve", () => {
  it("linear plant: analytic, a straight line (equal gain at both ends)", () => {
    const c = powerCurve(linear);
    expect(c.method).toBe("analytic");
    expect(c.note).toMatch(/analytic/);
    expect(staticGainAt(c, 5)).toBeCloseTo(staticGainAt(c, 95), 9);
  });

  it("nonlinear-loss mode: simulated to steady state, agrees with the engine's Newton steady state, and the static gain differs between the low and high ends", () => {
    const c = powerCurve(nonlinear);
    expect(c.method).toBe("simulated");
    for (const p of c.points) expect(p.steadyStateC).toBeCloseTo(steadyStateTemperatureC(nonlinear, p.outPercent), 2);
    const low = staticGainAt(c, 5);
    const high = staticGainAt(c, 95);
    // losses grow faster than linearly with temperature (natural convection ∝ ΔT^1.25, radiation ∝ T⁴):
    // each % of output buys fewer °C at the hot end
    // each % of output buys fewer °C at the hot end; in this well-insulated cabinet the insulation
    // (linear) dominates, so the bend is mild: about 0.7 %, far above the 1e-3 °C steady-state tolerance
    expect(high).toBeLessThan(0.995 * low);
    // an uninsulated skin (U close to the two films in series) lets the outer film dominate: a strong bend
    const bare = { ...nonlinear, wallUValueWPerM2K: 4.5 };
    const cb = powerCurve(bare);
    expect(staticGainAt(cb, 95)).toBeLessThan(0.9 * staticGainAt(cb, 5));
  }, 30_000);

  it("manual OUT for a target SP by inverse interpolation; refuses an unreachable SP", () => {
    const tf = transferFunctionParamsSchema.parse({
      kind: "transfer-function", gainCPerPercent: 1.5, timeConstantsS: [600], deadTimeS: 30,
      operatingPoint: { outPercent: 20, temperatureC: 50 }, ambientC: 20,
    });
    const c = powerCurve(tf);
    const o = outputForSetpoint(c, 80);
    expect(o.ok && o.outPercent).toBeCloseTo(40, 9); // 50 + 1.5·(OUT − 20) = 80
    const hi = outputForSetpoint(c, 500);
    expect(hi.ok).toBe(false);
    if (!hi.ok) expect(hi.reason).toMatch(/heater is too small/);
  });

  it("heat-up time: FOPDT from ambient at 100 % reaches SP at θ + τ·ln(Δ∞/(Δ∞ − ΔSP)) (analytic first-order response)", () => {
    const tf = transferFunctionParamsSchema.parse({
      kind: "transfer-function", gainCPerPercent: 1, timeConstantsS: [600], deadTimeS: 30,
      operatingPoint: { outPercent: 0, temperatureC: 20 }, ambientC: 20,
    });
    const h = heatUpTime(tf, 80);
    // Δ∞ = 100 °C, ΔSP = 60 °C
    expect(h.atFullOutputS!).toBeCloseTo(30 + 600 * Math.log(100 / 40), 0);
    // at the holding output (60 %) the sensor reaches 95 % of the rise after θ + 3τ
    expect(h.holdingOutPercent).toBeCloseTo(60, 9);
    expect(h.atHoldingOutputS!).toBeCloseTo(30 + 600 * Math.log(20), 0);
  });
});
