/**
 * Physical description of a heated, ventilated enclosure, in the SI figures a technician has on
 * the data plate and drawings. Defaults are stated where a sensible trade value exists.
 */
import { z } from "zod";

const positive = z.number().finite().positive();
const nonNegative = z.number().finite().nonnegative();

export const nonlinearLossSchema = z
  .object({
    /** Natural-convection outer film: h = c·|T_wall − T_amb|^(1/4) in W/(m²K); c ≈ 1.3–1.4 W/(m²·K^1.25)
     * for vertical plates in air (simplified laminar air correlation, from memory). */
    convectionCoefficient: positive.default(1.32),
    /** Emissivity of the outer skin for εσ(T⁴ − T∞⁴) (painted steel ≈ 0.9, common practice). */
    emissivity: z.number().min(0).max(1).default(0.9),
  })
  .strict();

export const contentsSchema = z
  .object({
    massKg: nonNegative,
    specificHeatJPerKgK: positive,
    /** h·A between the air and the contents, W/K. */
    airCouplingWPerK: nonNegative,
  })
  .strict();

export const enclosureParamsSchema = z
  .object({
    kind: z.literal("enclosure"),
    name: z.string().optional(),
    /** internal air volume, m³ */
    volumeM3: positive,
    /** wall area through which heat is conducted, m² */
    wallAreaM2: positive,
    /** overall air-to-ambient U-value of the wall, W/(m²K) */
    wallUValueWPerM2K: positive,
    /** inner film coefficient between the circulated air and the inner skin, W/(m²K). The wall
     * node is the inner skin with shelves and frame; the rest of 1/U (insulation + outer film)
     * connects it to ambient. */
    innerFilmCoefficientWPerM2K: positive.default(10),
    /** outer film coefficient (convection + radiation) at nominal conditions, W/(m²K); only the
     * nonlinear-loss mode uses it, to split the remaining resistance into insulation and outer film */
    outerFilmCoefficientWPerM2K: positive.default(8),
    /** lumped heat capacity of the walls (shell, insulation, shelves), J/K */
    wallHeatCapacityJPerK: positive,
    /** heater rating at the nominal supply voltage, W */
    heaterRatingW: positive,
    nominalVoltageV: positive.default(230),
    /** heater element heat capacity, J/K */
    heaterHeatCapacityJPerK: positive,
    /** heater element time constant against still air temperature, s (sets element-to-air h·A = C/τ) */
    heaterTimeConstantS: positive,
    /** inlet airflow, m³/h at inlet conditions (0 = sealed) */
    inletAirflowM3PerH: nonNegative,
    /** extra air exchange while the door is open, m³/h (used when a door event gives no size) */
    doorOpenAirflowM3PerH: nonNegative.default(0),
    /** ambient = inlet air temperature, °C */
    ambientC: z.number().finite().min(-60).max(80),
    /** barometric pressure for the inlet air density, Pa */
    pressurePa: positive.default(101325),
    contents: contentsSchema.default({ massKg: 0, specificHeatJPerKgK: 1000, airCouplingWPerK: 0 }),
    /** controller's sensor element time constant (RTD in its sheath or thermowell), s */
    sensorTimeConstantS: positive,
    /** "linear": constant films, exact stepping; "nonlinear": natural convection + radiation, odex */
    lossModel: z.enum(["linear", "nonlinear"]).default("linear"),
    nonlinear: nonlinearLossSchema.default({ convectionCoefficient: 1.32, emissivity: 0.9 }),
  })
  .strict()
  .refine((p) => 1 / p.wallUValueWPerM2K > 1 / p.innerFilmCoefficientWPerM2K + 1 / p.outerFilmCoefficientWPerM2K, {
    message: "1/U must exceed 1/h_inner + 1/h_outer (U includes both films)",
    path: ["wallUValueWPerM2K"],
  });

export type EnclosureParams = z.output<typeof enclosureParamsSchema>;
export type EnclosureParamsInput = z.input<typeof enclosureParamsSchema>;
