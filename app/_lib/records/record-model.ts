// The model a record's margins are worked out on: a twin's own transfer function, or the one the
// pre-commissioning flow reports from a bump test, or none.
import type { PlantDefinition } from "@/sim/plant/plant-definition";
import { modelOfTransferFunction } from "@/sim/tuning/model-definition";
import type { RecordModel } from "./record-document";

/** A transfer-function plant as the toolkit's FOPDT / SOPDT (τ1 ≥ τ2, sim/tuning/model-definition.ts); null for other plants. */
export function modelOfDefinition(def: PlantDefinition): RecordModel | null {
  return def.kind === "transfer-function" ? modelOfTransferFunction(def) : null;
}
