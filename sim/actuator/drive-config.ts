/**
 * Final element configuration: time-proportioning to a solid-state relay, or a continuous drive
 * (e.g. a phase-angle power controller taking 0–100 %).
 */
import { z } from "zod";

export const timeProportioningSchema = z
  .object({
    kind: z.literal("time-proportioning"),
    /** cycle time, s: the duty is latched at the start of each cycle */
    cycleTimeS: z.number().finite().positive().default(2),
    /** shortest on pulse the relay is given, s (shorter ones are carried over) */
    minOnTimeS: z.number().finite().nonnegative().default(0),
    /** shortest off gap, s (shorter gaps become a full-on cycle, the excess carried over) */
    minOffTimeS: z.number().finite().nonnegative().default(0),
  })
  .strict()
  .refine((c) => c.minOnTimeS + c.minOffTimeS <= c.cycleTimeS, {
    message: "minOnTimeS + minOffTimeS must not exceed cycleTimeS",
    path: ["minOnTimeS"],
  });

export const continuousDriveSchema = z.object({ kind: z.literal("continuous") }).strict();

export const driveConfigSchema = z.union([timeProportioningSchema, continuousDriveSchema]);
export type DriveConfig = z.output<typeof driveConfigSchema>;
export type DriveConfigInput = z.input<typeof driveConfigSchema>;
