// A twin's identification document (noise σ, quantization step, …), read under the same
// visibility rule as the plant itself. Its shape belongs to the twins code; callers read it defensively.
import { and, eq } from "drizzle-orm";
import { readablePlant, type BenchUser } from "@/app/_lib/bench-store";
import { getDb } from "@/db/client";
import { plants } from "@/db/schema";

export async function twinIdentification(user: BenchUser, plantId: string): Promise<unknown> {
  const [row] = await getDb()
    .select({ identification: plants.identification })
    .from(plants)
    .where(and(eq(plants.id, plantId), readablePlant(user)));
  return row?.identification ?? null;
}
