// The model a record's margins are worked out on: a twin's own transfer function, or the one the
// pre-commissioning flow reports from a bump test, or none.
import type { PlantDefinition } from "@/sim/plant/plant-definition";
import type { RecordModel } from "./record-document";

/** A transfer-function plant as the toolkit's FOPDT / SOPDT (τ1 ≥ τ2, as sim/tuning/models.ts sorts them). */
export function modelOfDefinition(def: PlantDefinition): RecordModel | null {
  if (def.kind !== "transfer-function") return null;
  const [a, b] = def.timeConstantsS;
  if (b === undefined) return { kind: "fopdt", gainCPerPercent: def.gainCPerPercent, timeConstantS: a, deadTimeS: def.deadTimeS };
  return { kind: "sopdt", gainCPerPercent: def.gainCPerPercent, timeConstant1S: Math.max(a, b), timeConstant2S: Math.min(a, b), deadTimeS: def.deadTimeS };
}
