// The stored plant a Bench opens on (/bench?plant=… and the pre-commissioning flow): a plant the
// user may read, with a twin's sensor noise and step read from its identification. Null for an
// unknown, unreadable or malformed id, so the pages answer alike for all three.
import { and, eq } from "drizzle-orm";
import { isUuid, readablePlant, type BenchUser } from "@/app/_lib/bench-store";
import type { BenchStartPlant } from "@/components/bench/BenchApp";
import { sensorFromIdentification } from "@/components/bench/sensor-from-data";
import { plantFor } from "@/db/bench-queries";
import { getDb } from "@/db/client";
import { plants } from "@/db/schema";

/** A twin's identification document, under the plant's own visibility rule; its shape is the twins code's, read defensively. */
async function twinIdentification(user: BenchUser, plantId: string): Promise<unknown> {
  const [row] = await getDb()
    .select({ identification: plants.identification })
    .from(plants)
    .where(and(eq(plants.id, plantId), readablePlant(user)));
  return row?.identification ?? null;
}

export async function benchStartPlant(user: BenchUser, plantId: string): Promise<BenchStartPlant | null> {
  if (!isUuid(plantId)) return null;
  const plant = await plantFor(user, plantId);
  if (!plant || plant.origin === "preset") return null;
  const sensorFromData = plant.origin === "twin" ? sensorFromIdentification(await twinIdentification(user, plantId)) : null;
  return {
    ref: plant.ref,
    title: plant.title,
    definition: plant.definition,
    origin: plant.origin,
    sensorFromData,
    privateToUser: plant.source === "own" && !plant.shared,
  };
}
