import type { Metadata } from "next";
import { guardPage } from "@/app/_lib/guard";
import { parsePlantRef } from "@/app/_lib/plant-ref";
import { plantFor } from "@/db/bench-queries";
import { BenchApp } from "@/components/bench/BenchApp";
import { sensorFromIdentification } from "@/components/bench/sensor-from-data";
import { PLANT_PRESETS } from "@/sim/plant/presets";
import { twinIdentification } from "../commissioning/[plantId]/twin-identification";

export const metadata: Metadata = { title: "Bench" };

// /bench?plant=plant:<uuid> opens the Bench on a stored plant the user may read (a twin with its
// log's sensor noise), /bench?plant=preset:<id> on a preset; anything else opens the default preset.
export default async function BenchPage({ searchParams }: { searchParams: Promise<{ plant?: string | string[] }> }) {
  const user = await guardPage();
  const { plant: requested } = await searchParams;
  const ref = typeof requested === "string" ? parsePlantRef(requested) : null;
  if (ref?.kind === "preset") {
    const { presetId } = ref;
    if (PLANT_PRESETS.some((p) => p.id === presetId)) return <BenchApp initialPresetId={presetId} />;
  }
  if (ref?.kind === "plant") {
    const { plantId } = ref;
    const plant = await plantFor(user, plantId);
    if (plant && plant.origin !== "preset") {
      const sensorFromData = plant.origin === "twin" ? sensorFromIdentification(await twinIdentification(user, plantId)) : null;
      return <BenchApp startPlant={{ ref: plant.ref, title: plant.title, definition: plant.definition, origin: plant.origin, sensorFromData }} />;
    }
  }
  return <BenchApp />;
}
