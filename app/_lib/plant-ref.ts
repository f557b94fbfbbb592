// Plant references, "preset:<id>" or "plant:<uuid>": the one parser and the one spelling, with no
// database import so the Bench (a client component) can use them too. bench-store.ts re-exports
// parsePlantRef and PlantRef for the server's existing imports.

export const uuidPattern = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

export type PlantRef = { kind: "preset"; presetId: string } | { kind: "plant"; plantId: string };

/** A reference read back; a stored plant's uuid is accepted in any case and kept lowercase. */
export function parsePlantRef(ref: string): PlantRef | null {
  if (ref.startsWith("preset:")) {
    const presetId = ref.slice("preset:".length);
    return presetId ? { kind: "preset", presetId } : null;
  }
  if (ref.startsWith("plant:")) {
    const plantId = ref.slice("plant:".length);
    return uuidPattern.test(plantId) ? { kind: "plant", plantId: plantId.toLowerCase() } : null;
  }
  return null;
}

/** One spelling per plant reference, for storing and comparing: "preset:<id>" or "plant:<lowercase uuid>". */
export function canonicalRef(ref: PlantRef): string {
  return ref.kind === "preset" ? `preset:${ref.presetId}` : `plant:${ref.plantId}`;
}
