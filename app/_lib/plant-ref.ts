// One spelling per plant reference, for storing and comparing: parsePlantRef (bench-store.ts)
// accepts a uuid in any case; records keep it lowercase.
import type { PlantRef } from "@/app/_lib/bench-store";

/** "preset:<id>" or "plant:<lowercase uuid>". */
export function canonicalRef(ref: PlantRef): string {
  return ref.kind === "preset" ? `preset:${ref.presetId}` : `plant:${ref.plantId}`;
}
