/**
 * Power curve: steady-state temperature against OUT % over a sweep, the "learn your system first"
 * step. How each point is obtained is reported with the curve:
 * - linear plants (linear-loss enclosure, FOPDT/SOPDT model): ANALYTIC, the engine's steady-state
 *   heat balance (sim/plant/derived-figures.ts: a linear solve), no simulation needed;
 * - nonlinear-loss enclosure: SIMULATED to steady state, sweeping upwards from ambient, each
 *   point starting from the previous one's end state, in chunks of one dominant time constant
 *   until a chunk changes the air temperature by less than the tolerance (remaining error below
 *   about 0.6 × tolerance for a first-order approach).
 * From the curve: the static gain at any OUT (slope between neighbouring points), the manual OUT
 * for a target SP (inverse interpolation) and heat-up time estimates (simulated from ambient).
 */
import { createPlant, type PlantDefinition } from "../plant/plant-definition";
import { dominantTimeConstantS, steadyStateTemperatureC } from "../plant/derived-figures";

export interface PowerCurvePoint {
  outPercent: number;
  steadyStateC: number;
}

export interface PowerCurve {
  points: PowerCurvePoint[];
  method: "analytic" | "simulated";
  note: string;
}

export interface PowerCurveOptions {
  /** OUT values of the sweep, %; default 0, 10, …, 100 */
  outputsPercent?: readonly number[];
  /** simulated mode: stop when one chunk changes the temperature by less than this, °C; default 1e-3 */
  toleranceC?: number;
}

function isLinear(def: PlantDefinition): boolean {
  return def.kind === "transfer-function" || def.lossModel !== "nonlinear";
}

export function powerCurve(def: PlantDefinition, opts: PowerCurveOptions = {}): PowerCurve {
  const outs = [...(opts.outputsPercent ?? Array.from({ length: 11 }, (_, i) => 10 * i))].sort((a, b) => a - b);
  if (isLinear(def))
    return {
      points: outs.map((o) => ({ outPercent: o, steadyStateC: steadyStateTemperatureC(def, o) })),
      method: "analytic",
      note: "analytic: the linear steady-state heat balance (no simulation needed for a linear plant)",
    };
  const tol = opts.toleranceC ?? 1e-3;
  const chunk = dominantTimeConstantS(def);
  const plant = createPlant(def, { cutoutSensorTimeConstantS: 10 });
  plant.initialize({ kind: "ambient" });
  const points: PowerCurvePoint[] = [];
  for (const o of outs) {
    const f = Math.min(1, Math.max(0, o / 100));
    for (let i = 0; i < 200; i++) {
      const before = plant.airTemperatureC();
      plant.advance(chunk, f);
      if (Math.abs(plant.airTemperatureC() - before) < tol) break;
    }
    points.push({ outPercent: o, steadyStateC: plant.airTemperatureC() });
  }
  return { points, method: "simulated", note: `simulated to steady state (nonlinear losses), chunks of ${+chunk.toPrecision(3)} s until a chunk changes the temperature by < ${tol} °C` };
}

/** Static gain ∂T/∂OUT at an OUT, °C per %: slope of the segment containing it. */
export function staticGainAt(curve: PowerCurve, outPercent: number): number {
  const p = curve.points;
  if (p.length < 2) return NaN;
  let i = 1;
  while (i < p.length - 1 && p[i].outPercent < outPercent) i++;
  return (p[i].steadyStateC - p[i - 1].steadyStateC) / (p[i].outPercent - p[i - 1].outPercent);
}

export type OutputForSetpoint = { ok: true; outPercent: number } | { ok: false; reason: string };

/** The manual OUT that holds a setpoint (linear interpolation between sweep points). */
export function outputForSetpoint(curve: PowerCurve, setpointC: number): OutputForSetpoint {
  const p = curve.points;
  if (p.length < 2) return { ok: false, reason: "the power curve needs at least two points" };
  const first = p[0];
  const last = p[p.length - 1];
  if (setpointC < Math.min(first.steadyStateC, last.steadyStateC))
    return { ok: false, reason: `${setpointC} °C is below the lowest steady temperature (${+first.steadyStateC.toPrecision(4)} °C at ${first.outPercent} %): the heater cannot hold it; the process needs cooling` };
  if (setpointC > Math.max(first.steadyStateC, last.steadyStateC))
    return { ok: false, reason: `${setpointC} °C is above the highest steady temperature (${+last.steadyStateC.toPrecision(4)} °C at ${last.outPercent} %): the heater is too small for it` };
  for (let i = 1; i < p.length; i++) {
    const a = p[i - 1];
    const b = p[i];
    if ((setpointC - a.steadyStateC) * (setpointC - b.steadyStateC) <= 0 && b.steadyStateC !== a.steadyStateC)
      return { ok: true, outPercent: a.outPercent + ((b.outPercent - a.outPercent) * (setpointC - a.steadyStateC)) / (b.steadyStateC - a.steadyStateC) };
  }
  return { ok: false, reason: "the power curve is flat around this setpoint" };
}

export interface HeatUpEstimate {
  /** from ambient at OUT = 100 % until the sensor reaches SP, s (null if never) */
  atFullOutputS: number | null;
  /** from ambient at the holding OUT until the sensor is within 5 % of the rise from SP, s */
  atHoldingOutputS: number | null;
  holdingOutPercent: number | null;
}

/** Heat-up time estimates by simulating the plant from ambient (open loop). */
export function heatUpTime(def: PlantDefinition, setpointC: number, curve: PowerCurve = powerCurve(def)): HeatUpEstimate {
  const tau = dominantTimeConstantS(def);
  const dt = Math.max(0.1, tau / 400);
  const horizon = 12 * tau + (def.kind === "transfer-function" ? def.deadTimeS : 0);
  const timeTo = (fraction: number, target: number): number | null => {
    const plant = createPlant(def, { cutoutSensorTimeConstantS: 10 });
    plant.initialize({ kind: "ambient" });
    plant.prepareStep(dt);
    let prev = plant.sensorTemperatureC();
    if (prev >= target) return 0;
    for (let t = 0; t < horizon; t += dt) {
      plant.advance(dt, fraction);
      const y = plant.sensorTemperatureC();
      if (y >= target) return t + (dt * (target - prev)) / (y - prev);
      prev = y;
    }
    return null;
  };
  const hold = outputForSetpoint(curve, setpointC);
  const amb = createPlant(def, { cutoutSensorTimeConstantS: 10 });
  amb.initialize({ kind: "ambient" });
  const start = amb.sensorTemperatureC();
  return {
    atFullOutputS: timeTo(1, setpointC),
    atHoldingOutputS: hold.ok ? timeTo(hold.outPercent / 100, setpointC - 0.05 * (setpointC - start)) : null,
    holdingOutPercent: hold.ok ? hold.outPercent : null,
  };
}
