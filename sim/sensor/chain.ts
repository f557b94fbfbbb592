/**
 * The measurement chain, once per controller sample:
 *   element temperature (°C; the element's own lag is a plant state)
 *   → Pt100 resistance with its tolerance-class offset, plus the lead resistance the wiring leaves
 *   → transmitter (ideal-curve linearisation, NE 43 clipping and failure current)
 *   → electrical noise on the loop current (Gaussian, plus optional spikes)
 *   → analog input (N-bit quantisation)
 *   → scaling back to °C, with a bad flag at NE 43 failure levels.
 */
import type { SeededRandom } from "../random/seeded-random";
import type { SensorChainConfig, SensorFault, SensorReading } from "./config";
import { TOLERANCE_CLASSES, leadResistanceSeenOhm, pt100Resistance, pt100Temperature } from "./pt100";
import { clipToMeasurementRange, failureCurrentMa, isElementFailed, type TransmitterParams } from "./transmitter";
import { AnalogInput } from "./adc";

export class SensorChain {
  // Element error = tolerancePosition · (a0 + a1|t|), pre-multiplied.
  private readonly tolA0: number;
  private readonly tolA1: number;
  private readonly leadOhm: number;
  private readonly tx: TransmitterParams;
  private readonly failMa: number;
  /** 16 / (rangeHigh − rangeLow): mA per °C. */
  private readonly maPerC: number;
  private readonly noiseSdMa: number;
  private readonly spikeProbability: number;
  private readonly spikeAmplitudeMa: number;
  private readonly adc: AnalogInput;
  private readonly badBelowMa: number;
  private readonly badAboveMa: number;
  private readonly rng: SeededRandom;
  /** Reused result object: measure() is allocation-free. */
  private readonly reading: SensorReading = { pv: 0, mA: 0, bad: false };

  constructor(cfg: SensorChainConfig, rng: SeededRandom) {
    const e = cfg.element;
    const cls = TOLERANCE_CLASSES[e.toleranceClass];
    this.tolA0 = e.tolerancePosition * cls.a0C;
    this.tolA1 = e.tolerancePosition * cls.a1PerC;
    this.leadOhm = leadResistanceSeenOhm(e.wiring, e.leadResistanceOhm, e.leadMismatchOhm);
    this.tx = { ...cfg.transmitter };
    this.failMa = failureCurrentMa(this.tx);
    this.maPerC = 16 / (this.tx.rangeHighC - this.tx.rangeLowC);
    this.noiseSdMa = cfg.noise.sdMa;
    this.spikeProbability = cfg.noise.spikeProbability;
    this.spikeAmplitudeMa = cfg.noise.spikeAmplitudeMa;
    const ai = cfg.analogInput;
    this.adc = new AnalogInput(ai.bits, ai.rangeLowMa, ai.rangeHighMa);
    this.badBelowMa = ai.badBelowMa;
    this.badAboveMa = ai.badAboveMa;
    this.rng = rng;
  }

  /** Resistance at the transmitter's terminals (Ω) for an element temperature and fault. */
  terminalResistanceOhm(elementTempC: number, fault: SensorFault): number {
    switch (fault) {
      case "open":
      case "lead-break": // any broken conductor interrupts the measuring current: an open circuit
        return Infinity;
      case "shorted": // the element is bridged; only the lead resistance the wiring leaves remains
        return this.leadOhm;
      case "none": {
        const tIndicated = elementTempC + this.tolA0 + this.tolA1 * Math.abs(elementTempC);
        return pt100Resistance(tIndicated) + this.leadOhm;
      }
    }
  }

  /**
   * Loop current the transmitter drives, before noise (mA): transmitterOutputMa() of
   * transmitter.ts with the scaling precomputed (a test checks they agree).
   */
  transmitterMa(elementTempC: number, fault: SensorFault): number {
    const r = this.terminalResistanceOhm(elementTempC, fault);
    if (isElementFailed(r)) return this.failMa;
    return clipToMeasurementRange(4 + this.maPerC * (pt100Temperature(r) - this.tx.rangeLowC));
  }

  /**
   * One sample of the chain. The returned object is reused by the next call: copy its fields if
   * you keep them. Draws exactly 13 uniforms per call whatever the configuration (12 for the
   * Gaussian, 1 for the spike), so changing the noise level never shifts later noise.
   * @param extraNoiseSdMa extra Gaussian noise from a disturbance, mA; combined in quadrature
   *   with the configured noise (independent sources: variances add).
   */
  measure(elementTempC: number, fault: SensorFault, extraNoiseSdMa: number): SensorReading {
    const rng = this.rng;
    let mA = this.transmitterMa(elementTempC, fault);
    const sd = extraNoiseSdMa > 0 ? Math.sqrt(this.noiseSdMa * this.noiseSdMa + extraNoiseSdMa * extraNoiseSdMa) : this.noiseSdMa;
    mA += sd * rng.gaussian();
    // One uniform decides both whether a spike occurs (u < p) and its sign (lower or upper half of [0, p)).
    const p = this.spikeProbability;
    const u = rng.uniform();
    if (u < p) mA += u < 0.5 * p ? -this.spikeAmplitudeMa : this.spikeAmplitudeMa;
    const read = this.adc.quantize(mA);
    const r = this.reading;
    r.mA = read;
    r.bad = read < this.badBelowMa || read > this.badAboveMa;
    r.pv = this.tx.rangeLowC + (read - 4) / this.maPerC; // loopCurrentToTemperatureC, precomputed
    return r;
  }
}
