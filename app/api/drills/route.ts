import { guardRoute } from "@/app/_lib/guard";
import { drillsFor } from "@/db/drill-queries";

// GET /api/drills[?archived=1] — { drills: DrillListItem[] }: the user's own drills, then those
// of the organisation they may view (shared ones; all for an admin), each with its status, latest
// version, open draft and published versions. Instructors and admins only: trainees get 403.
export async function GET(request: Request) {
  const user = await guardRoute({ roles: ["instructor", "admin"] });
  if (user instanceof Response) return user;
  const includeArchived = new URL(request.url).searchParams.get("archived") === "1";
  return Response.json({ drills: await drillsFor(user, { includeArchived }) }, { headers: { "cache-control": "no-store" } });
}
