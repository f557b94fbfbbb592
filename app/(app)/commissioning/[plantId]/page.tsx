import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { guardPage } from "@/app/_lib/guard";
import { isUuid } from "@/app/_lib/bench-store";
import { plantFor } from "@/db/bench-queries";
import { CommissioningBench } from "@/components/commissioning/CommissioningBench";
import { sensorFromIdentification } from "@/components/bench/sensor-from-data";
import { twinIdentification } from "./twin-identification";

export const metadata: Metadata = { title: "Pre-commissioning" };

// The pre-commissioning flow for one stored plant the user may read (own, or shared in the
// organisation); anything else, presets included, is "not found" so private plants are not revealed.
export default async function CommissioningPage({ params }: { params: Promise<{ plantId: string }> }) {
  const user = await guardPage();
  const { plantId } = await params;
  if (!isUuid(plantId)) notFound();
  const plant = await plantFor(user, plantId);
  if (!plant || plant.origin === "preset") notFound();
  const sensorFromData = plant.origin === "twin" ? sensorFromIdentification(await twinIdentification(user, plantId)) : null;
  return <CommissioningBench plant={{ ref: plant.ref, title: plant.title, definition: plant.definition, origin: plant.origin, sensorFromData, privateToUser: plant.source === "own" && !plant.shared }} />;
}
