/**
 * A sensor chain that reproduces what a twin's uploaded log showed: its noise σ as Gaussian
 * noise on the loop current, and its quantization step as the nearest analog-input resolution.
 * The chain quantizes in mA over the input's whole range (sim/sensor/adc.ts), so the step can only
 * be matched to the nearest whole number of bits; the step actually used is returned with it.
 */
import { sensorChainSchema, type SensorChainConfig, type SensorChainConfigInput } from "@/sim/sensor/config";

export interface SensorFromData {
  /** PV noise σ read from the log, °C */
  noiseSigmaC: number | null;
  /** smallest PV change in the log, °C */
  quantizationStepC: number | null;
}

export interface SensorMatch {
  sensor: SensorChainConfigInput;
  /** the Bench's PV noise σ and PV step with this chain, °C */
  sigmaC: number | null;
  stepC: number | null;
  bits: number | null;
}

const positive = (x: unknown): number | null => (typeof x === "number" && Number.isFinite(x) && x > 0 ? x : null);
// a log can be noise-free (σ = 0); a step of 0 means no step was found
const nonNegative = (x: unknown): number | null => (typeof x === "number" && Number.isFinite(x) && x >= 0 ? x : null);

/** Reads noise σ and step from a twin's identification document, whatever else it holds. */
export function sensorFromIdentification(identification: unknown): SensorFromData | null {
  if (!identification || typeof identification !== "object") return null;
  const id = identification as Record<string, unknown>;
  const noiseSigmaC = nonNegative(id.noiseSigmaC);
  const quantizationStepC = positive(id.quantizationStepC);
  return noiseSigmaC === null && quantizationStepC === null ? null : { noiseSigmaC, quantizationStepC };
}

/** The default chain (0–200 °C unless `rangeHighC` says more) carrying the log's noise and step. */
export function sensorMatching(data: SensorFromData, rangeHighC = 200): SensorMatch {
  const base: SensorChainConfig = sensorChainSchema.parse({ transmitter: { rangeLowC: 0, rangeHighC } });
  const spanC = base.transmitter.rangeHighC - base.transmitter.rangeLowC;
  const maPerC = 16 / spanC;
  const ai = base.analogInput;
  const sensor: SensorChainConfigInput = { transmitter: { rangeLowC: 0, rangeHighC } };
  let sigmaC: number | null = null;
  let stepC: number | null = null;
  let bits: number | null = null;
  if (data.noiseSigmaC !== null) {
    // the log's σ already holds the logger's rounding (q²/12 for a uniform quantizer; Widrow & Kollár,
    // from memory), and the chain adds its own ADC step: take the rounding out so it is not counted twice
    const q = data.quantizationStepC ?? 0;
    const sensorSigmaC = Math.sqrt(Math.max(0, data.noiseSigmaC ** 2 - (q * q) / 12));
    const sdMa = Math.min(5, sensorSigmaC * maPerC);
    sensor.noise = { sdMa };
    sigmaC = sdMa / maPerC;
  }
  if (data.quantizationStepC !== null) {
    // step = (range mA)/(2^bits − 1) in mA: the nearest whole bits, on a log scale
    const codes = (ai.rangeHighMa - ai.rangeLowMa) / (data.quantizationStepC * maPerC);
    bits = Math.min(32, Math.max(1, Math.round(Math.log2(codes + 1))));
    sensor.analogInput = { bits };
    stepC = (ai.rangeHighMa - ai.rangeLowMa) / (2 ** bits - 1) / maPerC;
  }
  return { sensor, sigmaC, stepC, bits };
}
