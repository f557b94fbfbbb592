/**
 * A plant definition is either an enclosure described physically or a transfer-function model;
 * createPlant turns it into a steppable Plant.
 */
import { z } from "zod";
import { enclosureParamsSchema, type EnclosureParams } from "./enclosure-params";
import { transferFunctionParamsSchema, type TransferFunctionParams } from "./transfer-function-params";
import { EnclosurePlant, type IntegratorKind } from "./enclosure-plant";
import { TransferFunctionPlant } from "./transfer-function-plant";
import type { Plant } from "./plant";

export const plantDefinitionSchema = z.discriminatedUnion("kind", [enclosureParamsSchema, transferFunctionParamsSchema]);
export type PlantDefinition = EnclosureParams | TransferFunctionParams;

export interface CreatePlantOptions {
  cutoutSensorTimeConstantS: number;
  integrator?: IntegratorKind;
  odexTolerance?: number;
  rk4MaxStepS?: number;
}

export function createPlant(def: PlantDefinition, opts: CreatePlantOptions): Plant {
  return def.kind === "enclosure" ? new EnclosurePlant(def, opts) : new TransferFunctionPlant(def, opts);
}
