import { guardRoute } from "@/app/_lib/guard";
import { runFor } from "@/db/bench-queries";

// GET /api/runs/:runId — { run: SavedRunDetail }: everything needed to replay a saved run
// (drill, controller, seed, action log, results, engine version). The owner's only: 404 otherwise.
export async function GET(_request: Request, { params }: { params: Promise<{ runId: string }> }) {
  const { runId } = await params;
  const user = await guardRoute();
  if (user instanceof Response) return user;
  const run = await runFor(user, runId);
  if (!run) return Response.json({ error: "No such saved run." }, { status: 404 });
  return Response.json({ run }, { headers: { "cache-control": "no-store" } });
}
