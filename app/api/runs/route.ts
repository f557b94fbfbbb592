import { guardRoute } from "@/app/_lib/guard";
import { isPlantRef, runsFor } from "@/db/bench-queries";

// GET /api/runs?plant=<ref> — { runs: SavedRunSummary[] }: the user's own saved runs of that plant,
// newest first, with key results and without the drill, controller or action log.
export async function GET(request: Request) {
  const user = await guardRoute();
  if (user instanceof Response) return user;
  const ref = new URL(request.url).searchParams.get("plant") ?? "";
  if (!isPlantRef(ref)) return Response.json({ error: "Say which plant: ?plant=preset:<id> or ?plant=plant:<uuid>." }, { status: 400 });
  return Response.json({ runs: await runsFor(user, ref) }, { headers: { "cache-control": "no-store" } });
}
