/**
 * A transfer-function plant (FOPDT or SOPDT) around an operating point:
 *     T(s) − T_op = K·e^{−θs} / ((τ1 s + 1)(τ2 s + 1)) · (u(s) − u_op)
 * with K in °C per % output. Used for twins, textbook checks and generic-loop drills.
 */
import { z } from "zod";

export const transferFunctionParamsSchema = z
  .object({
    kind: z.literal("transfer-function"),
    name: z.string().optional(),
    /** static gain, °C per % output */
    gainCPerPercent: z.number().finite(),
    /** one (FOPDT) or two (SOPDT) time constants, s */
    timeConstantsS: z.array(z.number().finite().positive()).min(1).max(2),
    /** dead time, s (exact for piecewise-constant input) */
    deadTimeS: z.number().finite().nonnegative(),
    /** the output and temperature the model was identified around */
    operatingPoint: z
      .object({ outPercent: z.number().finite().min(0).max(100), temperatureC: z.number().finite() })
      .strict(),
    /** ambient during identification, °C; an ambient change shifts the whole response by the same amount */
    ambientC: z.number().finite(),
    /** heater rating for energy figures, W; OUT 100 % = full rating */
    heaterRatingW: z.number().finite().positive().default(1000),
    nominalVoltageV: z.number().finite().positive().default(230),
    /** controller's sensor element lag, s (0 = included in the model already) */
    sensorTimeConstantS: z.number().finite().nonnegative().default(0),
  })
  .strict();

export type TransferFunctionParams = z.output<typeof transferFunctionParamsSchema>;
