import type { Metadata } from "next";
import { guardPage } from "@/app/_lib/guard";
import { parsePlantRef } from "@/app/_lib/plant-ref";
import { benchStartPlant } from "@/app/_lib/bench-start-plant";
import { BenchApp } from "@/components/bench/BenchApp";
import { PLANT_PRESETS } from "@/sim/plant/presets";

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
  const plant = ref?.kind === "plant" ? await benchStartPlant(user, ref.plantId) : null;
  if (plant) return <BenchApp startPlant={plant} />;
  return <BenchApp />;
}
