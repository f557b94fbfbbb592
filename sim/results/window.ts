/**
 * All measures of one scoring window, as a plain serialisable object (no NaN or Infinity:
 * "not reached" is null). The runner calls it on the true temperature and again on the
 * filtered PV.
 */
import { bandHalfWidthC } from "./band";
import { stepMetrics } from "./step-metrics";
import { errorIntegrals } from "./integrals";
import { disturbanceMetrics } from "./disturbance";
import { heaterEnergyKWh, outputTravel, timeAbove } from "./effort";
import { windowIndices } from "./window-slice";

export type WindowKind = "setpoint" | "disturbance";

export interface WindowResultsInput {
  /** Sample times, s, increasing. All series have the same length. */
  t: ArrayLike<number>;
  /** The temperature scored (true temperature or filtered PV), °C. */
  y: ArrayLike<number>;
  /** Setpoint, °C. */
  sp: ArrayLike<number>;
  /** Controller output, %. */
  out: ArrayLike<number>;
  /** Heater power, W: mean over each sample interval [t_k, t_k+1). */
  heaterPowerW: ArrayLike<number>;
  /** Window, s (samples with windowStartS ≤ t ≤ windowEndS are used). */
  windowStartS: number;
  windowEndS: number;
  kind: WindowKind;
  /**
   * Setpoint windows: the step (new SP − old SP), °C. Default: SP at the end of the window minus
   * y at its start. Disturbance windows: optional; if given, 2 % of it joins the band (as for settling).
   */
  stepSizeC?: number;
  /** The step's or disturbance's instant, s; default windowStartS. Rise, peak, settling and recovery times count from it. */
  eventTimeS?: number;
  /** Absolute floor of the band half-width, °C. */
  bandFloorC: number;
  /** Standard deviation of the PV noise, °C (3σ joins the band). */
  noiseSigmaC: number;
  /** Cutout set point for "time above", °C; omit to skip (result 0). */
  cutoutPointC?: number;
}

export interface WindowResults {
  kind: WindowKind;
  windowStartS: number;
  windowEndS: number;
  /** Number of samples used. */
  samples: number;
  /** Band half-width used for settling / recovery, °C. */
  bandC: number;
  stepSizeC: number | null;
  riseTimeS: number | null;
  overshootPct: number | null;
  overshootC: number | null;
  peakTimeS: number | null;
  settlingTimeS: number | null;
  peakDeviationC: number | null;
  peakDeviationTimeS: number | null;
  recoveryTimeS: number | null;
  /** °C·s */
  iae: number;
  /** °C²·s */
  ise: number;
  /** °C·s², time from the window start */
  itae: number;
  /** Σ|ΔOUT|, % */
  outputTravelPct: number;
  heaterEnergyKWh: number;
  timeAboveCutoutS: number;
}

export function computeWindowResults(input: WindowResultsInput): WindowResults {
  const { t, y, sp, out, heaterPowerW, windowStartS, windowEndS, kind } = input;
  const n = t.length;
  if (y.length !== n || sp.length !== n || out.length !== n || heaterPowerW.length !== n) {
    throw new RangeError("computeWindowResults: t, y, sp, out and heaterPowerW must have the same length");
  }
  const { first, last } = windowIndices(t, windowStartS, windowEndS);
  const eventTimeS = input.eventTimeS ?? windowStartS;
  const ints = errorIntegrals(t, y, sp, first, last, windowStartS);
  const base: WindowResults = {
    kind,
    windowStartS,
    windowEndS,
    samples: Math.max(0, last - first + 1),
    bandC: 0,
    stepSizeC: null,
    riseTimeS: null,
    overshootPct: null,
    overshootC: null,
    peakTimeS: null,
    settlingTimeS: null,
    peakDeviationC: null,
    peakDeviationTimeS: null,
    recoveryTimeS: null,
    iae: ints.iae,
    ise: ints.ise,
    itae: ints.itae,
    outputTravelPct: last > first ? outputTravel(out, first, last) : 0,
    heaterEnergyKWh: last > first ? heaterEnergyKWh(t, heaterPowerW, first, last) : 0,
    timeAboveCutoutS: input.cutoutPointC !== undefined && last > first ? timeAbove(t, y, input.cutoutPointC, first, last) : 0,
  };
  if (last < first) {
    base.bandC = bandHalfWidthC(input.stepSizeC ?? 0, input.bandFloorC, input.noiseSigmaC);
    return base;
  }
  if (kind === "setpoint") {
    const target = sp[last];
    const step = input.stepSizeC ?? target - y[first];
    const m = stepMetrics(t, y, first, last, eventTimeS, target, step, input.bandFloorC, input.noiseSigmaC);
    base.bandC = m.bandC;
    base.stepSizeC = step;
    base.riseTimeS = m.riseTimeS;
    base.overshootPct = m.overshootPct;
    base.overshootC = m.overshootC;
    base.peakTimeS = m.peakTimeS;
    base.settlingTimeS = m.settlingTimeS;
  } else {
    const bandC = bandHalfWidthC(input.stepSizeC ?? 0, input.bandFloorC, input.noiseSigmaC);
    // Disturbance measures count from the event; samples before it (if the window opens early) are skipped.
    const ev = windowIndices(t, eventTimeS, windowEndS);
    const d = disturbanceMetrics(t, y, sp, Math.max(first, ev.first), last, eventTimeS, bandC);
    base.bandC = bandC;
    base.stepSizeC = input.stepSizeC ?? null;
    base.peakDeviationC = d.peakDeviationC;
    base.peakDeviationTimeS = d.peakDeviationTimeS;
    base.recoveryTimeS = d.recoveryTimeS;
  }
  return base;
}
