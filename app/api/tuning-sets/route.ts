import { guardRoute } from "@/app/_lib/guard";
import { isPlantRef, tuningSetsFor } from "@/db/bench-queries";

// GET /api/tuning-sets?plant=<ref> — { tuningSets: TuningSetItem[] }: the user's own tuning sets
// for that plant, by name. 400 without a valid plant reference.
export async function GET(request: Request) {
  const user = await guardRoute();
  if (user instanceof Response) return user;
  const ref = new URL(request.url).searchParams.get("plant") ?? "";
  if (!isPlantRef(ref)) return Response.json({ error: "Say which plant: ?plant=preset:<id> or ?plant=plant:<uuid>." }, { status: 400 });
  return Response.json({ tuningSets: await tuningSetsFor(user, ref) }, { headers: { "cache-control": "no-store" } });
}
