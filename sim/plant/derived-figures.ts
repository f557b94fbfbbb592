/**
 * Figures a technician reads off a plant before tuning it: static gain (°C per % output),
 * steady-state temperature at a given output, dominant time constant, time to 63 % and the
 * apparent dead time of the step response seen by the controller's sensor element.
 * Method: the open-loop step response 0 → 100 % from ambient, stepped exactly on a fine grid;
 *  - apparent dead time by the tangent at the inflection point (Ziegler–Nichols reaction curve,
 *    references §2: L where the steepest tangent crosses the initial value);
 *  - two-point FOPDT fit τ = 1.5(t63.2 − t28.3), θ = t63.2 − τ (Smith; Bequette §4.2, references §8).
 * For the nonlinear-loss mode the dynamic figures are those of the linear model at the nominal
 * outer film; steady-state temperature and static gain use the nonlinear steady state.
 */
import { EnclosurePlant } from "./enclosure-plant";
import type { EnclosureParams } from "./enclosure-params";
import { ModalStepper } from "./modal-stepper";
import type { PlantDefinition } from "./plant-definition";
import { TransferFunctionPlant } from "./transfer-function-plant";
import type { Plant } from "./plant";

export interface DerivedFigures {
  /** ∂T/∂OUT at the given output, °C per % */
  staticGainCPerPercent: number;
  /** air temperature at steady state with the given output, °C */
  steadyStateC: number;
  outPercent: number;
  /** slowest time constant of the linear model (incl. sensor lag), s */
  dominantTimeConstantS: number;
  /** time for the sensor element to make 63.2 % of a step change, s */
  timeTo63PercentS: number;
  /** tangent (inflection point) dead time of the sensor's step response, s */
  apparentDeadTimeS: number;
  /** two-point (28.3 % / 63.2 %) FOPDT fit of the step response */
  fopdtFit: { gainCPerPercent: number; timeConstantS: number; deadTimeS: number };
}

function linearised(def: PlantDefinition): PlantDefinition {
  return def.kind === "enclosure" ? ({ ...def, lossModel: "linear" } as EnclosureParams) : def;
}

/** Steady air temperature for a constant output (continuous average power), °C. */
export function steadyStateTemperatureC(def: PlantDefinition, outPercent: number): number {
  if (def.kind === "enclosure") {
    const p = new EnclosurePlant(def, { cutoutSensorTimeConstantS: 1, integrator: def.lossModel === "nonlinear" ? "odex" : "exact" });
    const x = p.steadyNodeTemperatures(outPercent / 100);
    return x[p.network.airNode];
  }
  return def.operatingPoint.temperatureC + def.gainCPerPercent * (outPercent - def.operatingPoint.outPercent);
}

export function dominantTimeConstantS(def: PlantDefinition): number {
  if (def.kind === "transfer-function") return Math.max(...def.timeConstantsS, def.sensorTimeConstantS);
  const p = new EnclosurePlant(linearised(def) as EnclosureParams, { cutoutSensorTimeConstantS: 1 });
  const m = new ModalStepper(p.network, [], new Float64Array(p.network.n), []);
  const slowest = Math.min(...Array.from(m.lambda, (l) => -l));
  return Math.max(1 / slowest, def.sensorTimeConstantS);
}

export function derivedFigures(def: PlantDefinition, outPercent = 50): DerivedFigures {
  const d = 0.5;
  const lo = Math.max(0, outPercent - d);
  const hi = Math.min(100, outPercent + d);
  const gain = (steadyStateTemperatureC(def, hi) - steadyStateTemperatureC(def, lo)) / (hi - lo);
  const tauDom = dominantTimeConstantS(def);
  const lin = linearised(def);
  const plant: Plant =
    lin.kind === "enclosure" ? new EnclosurePlant(lin, { cutoutSensorTimeConstantS: 1 }) : new TransferFunctionPlant(lin, { cutoutSensorTimeConstantS: 1 });
  plant.initialize({ kind: "steady", outPercent: 0 });
  const horizon = 8 * tauDom + (lin.kind === "transfer-function" ? lin.deadTimeS : 0);
  const steps = 16000;
  const dt = horizon / steps;
  plant.prepareStep(dt);
  const y0 = plant.sensorTemperatureC();
  const t = new Float64Array(steps + 1);
  const y = new Float64Array(steps + 1);
  y[0] = y0;
  for (let k = 1; k <= steps; k++) {
    plant.advance(dt, 1);
    t[k] = k * dt;
    y[k] = plant.sensorTemperatureC();
  }
  const yInf = steadyStateTemperatureC(lin, 100);
  const span = yInf - y0;
  const crossing = (frac: number): number => {
    const target = y0 + frac * span;
    for (let k = 1; k <= steps; k++) {
      if ((y[k] - target) * Math.sign(span) >= 0) {
        const f = (target - y[k - 1]) / (y[k] - y[k - 1]);
        return t[k - 1] + f * dt;
      }
    }
    return NaN;
  };
  let best = 0;
  let kBest = 1;
  for (let k = 1; k <= steps; k++) {
    const s = (y[k] - y[k - 1]) / dt;
    if (Math.abs(s) > Math.abs(best)) {
      best = s;
      kBest = k;
    }
  }
  const tMid = (t[kBest] + t[kBest - 1]) / 2;
  const yMid = (y[kBest] + y[kBest - 1]) / 2;
  const apparentDead = tMid - (yMid - y0) / best;
  const t28 = crossing(1 - Math.exp(-1 / 3));
  const t63 = crossing(1 - Math.exp(-1));
  const tau = 1.5 * (t63 - t28);
  return {
    staticGainCPerPercent: gain,
    steadyStateC: steadyStateTemperatureC(def, outPercent),
    outPercent,
    dominantTimeConstantS: tauDom,
    timeTo63PercentS: t63,
    apparentDeadTimeS: Math.max(0, apparentDead),
    fopdtFit: { gainCPerPercent: span / 100, timeConstantS: tau, deadTimeS: Math.max(0, t63 - tau) },
  };
}

/** Power curve: steady-state air temperature against output % (the sweep to steady state,
 * computed directly from the steady-state balance; bends in the nonlinear-loss mode). */
export function powerCurve(def: PlantDefinition, outputsPercent: readonly number[]): { outPercent: number; steadyStateC: number }[] {
  return outputsPercent.map((o) => ({ outPercent: o, steadyStateC: steadyStateTemperatureC(def, o) }));
}
