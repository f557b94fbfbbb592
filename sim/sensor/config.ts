/**
 * Configuration of the measurement chain (element → transmitter → noise → analog input),
 * validated with zod. Units are in the field names. Every field has a default, so
 * `sensorChainSchema.parse({})` gives a sensible 3-wire class-A Pt100 on a 0–200 °C transmitter.
 */
import { z } from "zod";

/** Fault of the element or its wiring, applied per sample by the runner (a drill event). */
export type SensorFault = "none" | "open" | "shorted" | "lead-break";
export const sensorFaultSchema = z.enum(["none", "open", "shorted", "lead-break"]);

export const elementSchema = z.object({
  toleranceClass: z.enum(["AA", "A", "B", "C"]).default("A").describe("IEC 60751 tolerance class"),
  tolerancePosition: z
    .number()
    .min(-1)
    .max(1)
    .default(0)
    .describe("where this element sits in its class band: −1 reads low by the full tolerance, 0 ideal, +1 reads high"),
  wiring: z.enum(["2-wire", "3-wire", "4-wire"]).default("3-wire"),
  leadResistanceOhm: z.number().min(0).max(100).default(0.5).describe("resistance of each lead, Ω"),
  leadMismatchOhm: z
    .number()
    .min(-10)
    .max(10)
    .default(0)
    .describe("3-wire only: difference between the two current-carrying leads, Ω (the residual after compensation)"),
});

export const transmitterSchema = z
  .object({
    rangeLowC: z.number().default(0).describe("temperature at 4 mA, °C"),
    rangeHighC: z.number().default(200).describe("temperature at 20 mA, °C"),
    failureDirection: z
      .enum(["downscale", "upscale"])
      .default("upscale")
      .describe("NAMUR NE 43 failure signal on a failed element: downscale ≤ 3.6 mA or upscale ≥ 21 mA"),
    failureLowMa: z.number().min(0).max(3.6).default(3.6).describe("downscale failure current, mA (≤ 3.6 per NE 43)"),
    failureHighMa: z.number().min(21).max(25).default(21).describe("upscale failure current, mA (≥ 21 per NE 43)"),
  })
  .refine((t) => t.rangeHighC > t.rangeLowC, { message: "rangeHighC must exceed rangeLowC", path: ["rangeHighC"] })
  .refine((t) => t.rangeLowC >= -200 && t.rangeHighC <= 850, {
    message: "the Pt100 range is −200…850 °C (IEC 60751)",
    path: ["rangeLowC"],
  });

export const electricalNoiseSchema = z.object({
  sdMa: z.number().min(0).max(5).default(0.004).describe("Gaussian noise standard deviation on the loop current, mA"),
  spikeProbability: z.number().min(0).max(1).default(0).describe("probability of a spike per sample"),
  spikeAmplitudeMa: z.number().min(0).max(20).default(0).describe("spike height, mA (sign random)"),
});

export const analogInputSchema = z
  .object({
    bits: z.number().int().min(1).max(32).default(16).describe("ADC resolution, bits"),
    rangeLowMa: z.number().default(0).describe("current at code 0, mA"),
    rangeHighMa: z.number().default(24).describe("current at full-scale code, mA"),
    badBelowMa: z
      .number()
      .default(3.7)
      .describe("a reading below this is flagged bad (NE 43 failure low ≤ 3.6 mA; 3.7 leaves margin for noise)"),
    badAboveMa: z
      .number()
      .default(20.75)
      .describe("a reading above this is flagged bad (NE 43 failure high ≥ 21 mA; 20.75 leaves margin for noise)"),
  })
  .refine((a) => a.rangeHighMa > a.rangeLowMa, { message: "rangeHighMa must exceed rangeLowMa", path: ["rangeHighMa"] })
  .refine((a) => a.badBelowMa < a.badAboveMa, { message: "badBelowMa must be below badAboveMa", path: ["badBelowMa"] });

export const sensorChainSchema = z.object({
  element: elementSchema.prefault({}),
  transmitter: transmitterSchema.prefault({}),
  noise: electricalNoiseSchema.prefault({}),
  analogInput: analogInputSchema.prefault({}),
});

export type SensorChainConfig = z.infer<typeof sensorChainSchema>;
/** What an author writes (every field optional). */
export type SensorChainConfigInput = z.input<typeof sensorChainSchema>;

/** Reading the controller sees, per sample. */
export interface SensorReading {
  /** PV in °C, scaled from the quantised current (meaningless while `bad`). */
  pv: number;
  /** Loop current as read by the analog input (after noise and quantisation), mA. */
  mA: number;
  /** The reading is at an NE 43 failure level (outside [badBelowMa, badAboveMa]). */
  bad: boolean;
}
