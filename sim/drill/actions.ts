/**
 * Operator actions on the Bench or in an attempt. Each is stamped with the integer index of the
 * controller sample at whose boundary it is applied (before that sample's measurement and
 * controller update), so replaying the log reproduces the trace exactly.
 */
import { z } from "zod";
import { controllerConfigSchema } from "../control/config";
import { drillEventSchema, type DrillEvent } from "./schema";

/** Disturbance types an operator can apply live (the timeline's events without their time). */
export const LIVE_DISTURBANCE_TYPES = ["inlet-blockage", "door-open", "ambient", "supply-voltage", "cold-load", "sensor-noise", "sensor-fault"] as const;

/** Validated as the timeline event it stands for (at time 0), then without its time. */
export const liveDisturbanceSchema = z
  .looseObject({ type: z.enum(LIVE_DISTURBANCE_TYPES) })
  .transform((e, ctx): LiveDisturbance => {
    const parsed = drillEventSchema.safeParse({ ...e, timeS: 0 });
    if (!parsed.success) {
      for (const issue of parsed.error.issues) ctx.addIssue({ code: "custom", message: issue.message, path: issue.path });
      return z.NEVER;
    }
    const { timeS: _t, ...rest } = parsed.data;
    return rest as LiveDisturbance;
  });

type DistributiveOmitTime<E> = E extends unknown ? Omit<E, "timeS"> : never;
export type LiveDisturbance = DistributiveOmitTime<Extract<DrillEvent, { type: (typeof LIVE_DISTURBANCE_TYPES)[number] }>>;

export const operatorActionSchema = z.discriminatedUnion("type", [
  z.object({ type: z.literal("setpoint"), setpointC: z.number().finite() }).strict(),
  z.object({ type: z.literal("mode"), mode: z.enum(["auto", "manual"]) }).strict(),
  z.object({ type: z.literal("manual-output"), outPercent: z.number().finite() }).strict(),
  z.object({ type: z.literal("tuning"), controller: controllerConfigSchema }).strict(),
  z.object({ type: z.literal("cutout-reset") }).strict(),
  // a disturbance applied now (the Bench's disturbance panel); logged and replayed like the rest
  z.object({ type: z.literal("disturbance"), event: liveDisturbanceSchema }).strict(),
]);

export const stampedActionSchema = z.intersection(z.object({ sample: z.number().int().nonnegative() }), operatorActionSchema);
export const actionLogSchema = z.array(stampedActionSchema);

export type OperatorAction = z.output<typeof operatorActionSchema>;
export type OperatorActionInput = z.input<typeof operatorActionSchema>;
export type StampedAction = OperatorAction & { sample: number };
