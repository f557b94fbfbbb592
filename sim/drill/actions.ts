/**
 * Operator actions on the Bench or in an attempt. Each is stamped with the integer index of the
 * controller sample at whose boundary it is applied (before that sample's measurement and
 * controller update), so replaying the log reproduces the trace exactly.
 */
import { z } from "zod";
import { controllerConfigSchema } from "../control/config";

export const operatorActionSchema = z.discriminatedUnion("type", [
  z.object({ type: z.literal("setpoint"), setpointC: z.number().finite() }).strict(),
  z.object({ type: z.literal("mode"), mode: z.enum(["auto", "manual"]) }).strict(),
  z.object({ type: z.literal("manual-output"), outPercent: z.number().finite() }).strict(),
  z.object({ type: z.literal("tuning"), controller: controllerConfigSchema }).strict(),
  z.object({ type: z.literal("cutout-reset") }).strict(),
]);

export const stampedActionSchema = z.intersection(z.object({ sample: z.number().int().nonnegative() }), operatorActionSchema);
export const actionLogSchema = z.array(stampedActionSchema);

export type OperatorAction = z.output<typeof operatorActionSchema>;
export type OperatorActionInput = z.input<typeof operatorActionSchema>;
export type StampedAction = OperatorAction & { sample: number };
