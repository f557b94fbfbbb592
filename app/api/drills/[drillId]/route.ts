import { guardRoute } from "@/app/_lib/guard";
import { drillFor } from "@/db/drill-queries";

// GET /api/drills/:drillId — { drill: DrillDetail }: the drill with its versions (newest first:
// version, status, publishedAt, createdAt, createdByName). 404 for a drill the user may not view,
// so private drills of others are not revealed; trainees get 403.
export async function GET(_request: Request, { params }: { params: Promise<{ drillId: string }> }) {
  const { drillId } = await params;
  const user = await guardRoute({ roles: ["instructor", "admin"] });
  if (user instanceof Response) return user;
  const drill = await drillFor(user, drillId);
  if (!drill) return Response.json({ error: "No such drill." }, { status: 404 });
  return Response.json({ drill }, { headers: { "cache-control": "no-store" } });
}
