/** Excess-temperature cutout configuration (NFPA 86 excess-temperature limit, references §14). */
import { z } from "zod";

export const cutoutConfigSchema = z
  .object({
    enabled: z.boolean().default(true),
    /** trip point, °C: the cutout opens when its own sensor reads above it */
    tripPointC: z.number().finite(),
    /** the cutout's own sensor element time constant, s (a plant state, independent of the controller's sensor) */
    sensorTimeConstantS: z.number().finite().positive().default(10),
    /** a manual reset is accepted only once its sensor reads this far below the trip point, °C */
    resetMarginC: z.number().finite().nonnegative().default(5),
  })
  .strict();

export type CutoutConfig = z.output<typeof cutoutConfigSchema>;
export type CutoutConfigInput = z.input<typeof cutoutConfigSchema>;
